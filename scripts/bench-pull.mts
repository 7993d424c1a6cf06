// npm run bench:pull [-- --records=10000] [--rounds=3] [--force]
// A device's full first pull of a large project (lib/sync/server/pull.ts) beside a baseline
// measured in the same run:
// 1. pull: pullBody (the JSON text the route sends) from no cursor, page after page until hasMore is
//    false; each answer is parsed afterwards, outside the timing, for its cursor and its count;
// 2. baseline: the same rows read with plain `SELECT * … WHERE project_id = $1` per record table
//    through `pg` in one read-only transaction, and JSON.stringify of the result.
// The project holds 100 placements, and deliveries and curing readings up to --records rows
// (written with INSERT … SELECT generate_series, not timed). Rounds alternate the two; the median
// of each is compared. It also prints the heap in use after each pull page (the largest seen):
// a paged pull keeps memory flat whatever the project's size. Everything created is deleted.
// It refuses a database whose name has neither "test" nor "bench" in it unless --force is given.
import { randomUUID } from "node:crypto";
import os from "node:os";
import { performance } from "node:perf_hooks";
import pg from "pg";

const TEST_DATABASE_URL = "postgres://placewright@127.0.0.1:54339/placewright_test";
const argv = process.argv.slice(2);
const option = (name: string) => argv.find((a) => a.startsWith(`--${name}=`))?.slice(name.length + 3);
const records = Number(option("records") ?? 10_000);
const rounds = Number(option("rounds") ?? 3);
if (!Number.isInteger(records) || records < 200 || !Number.isInteger(rounds) || rounds < 1) {
  console.error("--records must be a whole number of 200 or more, --rounds 1 or more");
  process.exit(2);
}
const url = process.env.DATABASE_URL ?? TEST_DATABASE_URL;
const databaseName = decodeURIComponent(new URL(url).pathname.replace(/^\//, ""));
if (!/test|bench/i.test(databaseName) && !argv.includes("--force")) {
  console.error(`bench-pull writes ${records} rows and refuses database "${databaseName}": its name has neither "test" nor "bench". Use a throwaway database, or pass --force.`);
  process.exit(2);
}
process.env.DATABASE_URL = url;

const { closeDb, db } = await import("../db/index.ts");
const { deleteBenchRows } = await import("./bench/cleanup.ts");
const { memberships, projects, users } = await import("../db/schema/index.ts");
const { SYNC_SCHEMA_VERSION } = await import("../lib/sync/protocol.ts");
const { pullBody } = await import("../lib/sync/server/pull.ts");
const { RECORD_TYPES, getRecordDef } = await import("../lib/records/registry.ts");
const { getTableName } = await import("drizzle-orm");

const tag = randomUUID().slice(0, 8).toUpperCase();
const [user] = await db.insert(users).values({ email: `bench-${tag.toLowerCase()}@example.test`, name: `Bench ${tag}`, isAdmin: false }).returning();
const [project] = await db.insert(projects).values({ name: `Bench pull ${tag}`, code: `BP-${tag}`, timeZone: "America/Chicago", unitSystem: "SI" }).returning();
await db.insert(memberships).values({ userId: user.id, projectId: project.id, role: "superintendent" });
const sessionUser = { id: user.id, email: user.email, name: user.name, isAdmin: false };
const plain = new pg.Client({ connectionString: url });
await plain.connect();

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const mb = (n: number) => `${(n / 1024 / 1024).toFixed(1)} MB`;

async function seed() {
  const deliveriesCount = Math.floor((records - 100) / 2);
  const curingCount = records - 100 - deliveriesCount;
  const p = project.id;
  await plain.query(
    `INSERT INTO placements (id, project_id, change_seq, element, level, grid, element_type, planned_start)
     SELECT gen_random_uuid(), $1, g, 'Bench slab ' || g, 'L' || (g % 9), 'A-D/1-4', 'elevated-slab', now() + g * interval '1 hour'
     FROM generate_series(1, 100) g`,
    [p],
  );
  const placementAt = `(SELECT array_agg(id ORDER BY change_seq) FROM placements WHERE project_id = $1)[1 + g % 100]`;
  await plain.query(
    `INSERT INTO deliveries (id, project_id, change_seq, placement_id, ticket_number, truck, volume_m3, batched_at, arrived_at)
     SELECT gen_random_uuid(), $1, 100 + g, ${placementAt}, 'B-' || lpad(g::text, 6, '0'), 'T-' || (g % 40), 8, now(), now() + interval '30 minutes'
     FROM generate_series(1, $2::int) g`,
    [p, deliveriesCount],
  );
  await plain.query(
    `INSERT INTO curing_readings (id, project_id, change_seq, placement_id, method, read_at, temp_c, location)
     SELECT gen_random_uuid(), $1, 100 + $2::int + g, ${placementAt}, 'Insulated blankets', now() + g * interval '1 minute', 12 + (g % 10), 'North edge'
     FROM generate_series(1, $3::int) g`,
    [p, deliveriesCount, curingCount],
  );
  await plain.query(`INSERT INTO project_change_counters (project_id, last_seq) VALUES ($1, $2) ON CONFLICT (project_id) DO UPDATE SET last_seq = $2`, [p, records]);
}

async function fullPull() {
  const clientId = randomUUID();
  let cursor: Record<string, number> | null = null;
  let rows = 0;
  let bytes = 0;
  let pages = 0;
  let heapPeak = 0;
  let seconds = 0;
  for (;;) {
    const start = performance.now();
    const body = await pullBody(sessionUser, { clientId, schemaVersion: SYNC_SCHEMA_VERSION, cursor });
    seconds += (performance.now() - start) / 1000;
    heapPeak = Math.max(heapPeak, process.memoryUsage().heapUsed);
    const page = JSON.parse(body) as { changes: unknown[]; cursor: Record<string, number>; hasMore: boolean };
    bytes += body.length;
    rows += page.changes.length;
    pages += 1;
    cursor = page.cursor;
    if (!page.hasMore) break;
  }
  return { seconds, rows, bytes, pages, heapPeak };
}

async function rawRead() {
  let rows = 0;
  let bytes = 0;
  const start = performance.now();
  await plain.query("BEGIN ISOLATION LEVEL REPEATABLE READ READ ONLY");
  for (const type of RECORD_TYPES) {
    const result = await plain.query(`SELECT * FROM ${getTableName(getRecordDef(type).table)} WHERE project_id = $1 ORDER BY change_seq`, [project.id]);
    rows += result.rows.length;
    bytes += JSON.stringify(result.rows).length;
  }
  await plain.query("COMMIT");
  return { seconds: (performance.now() - start) / 1000, rows, bytes };
}

const loadAtStart = os.loadavg()[0];
try {
  await seed();
  const pulls: Awaited<ReturnType<typeof fullPull>>[] = [];
  const raws: Awaited<ReturnType<typeof rawRead>>[] = [];
  for (let r = 0; r < rounds; r++) {
    raws.push(await rawRead());
    pulls.push(await fullPull());
  }
  for (const p of pulls) if (p.rows !== records) throw new Error(`the pull returned ${p.rows} of ${records} records`);
  for (const r of raws) if (r.rows !== records) throw new Error(`the raw read returned ${r.rows} of ${records} records`);
  const pullSeconds = median(pulls.map((p) => p.seconds));
  const rawSeconds = median(raws.map((r) => r.seconds));
  console.log(`database ${databaseName}; one project of ${records.toLocaleString("en-US")} records; ${rounds} rounds, medians`);
  console.log(`  full first pull (pullBody, ${pulls[0].pages} pages, ${mb(pulls[0].bytes)} JSON): ${pullSeconds.toFixed(2)} s, ${Math.round(records / pullSeconds).toLocaleString("en-US")} records/s`);
  console.log(`  raw SELECT + JSON.stringify (pg, ${mb(raws[0].bytes)} JSON):      ${rawSeconds.toFixed(2)} s, ${Math.round(records / rawSeconds).toLocaleString("en-US")} records/s`);
  console.log(`  heap in use after a pull page, largest seen: ${mb(Math.max(...pulls.map((p) => p.heapPeak)))}`);
  console.log(`  machine load (1-minute average) at start ${loadAtStart.toFixed(2)}, at end ${os.loadavg()[0].toFixed(2)}, on ${os.availableParallelism()} cores`);
  console.log(`pull ÷ raw ratio ${(rawSeconds / pullSeconds).toFixed(2)} (1.00 = as fast as the raw read)`);
} finally {
  await plain.end().catch(() => undefined);
  await deleteBenchRows(db, [project.id], [user.id]);
  await closeDb();
}
