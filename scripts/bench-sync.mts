// npm run bench:sync [-- --count=10000] [--interleaved] [--force]
// Throughput of the sync push (lib/sync/server/push.ts) beside a baseline measured in the same run:
// 1. sync push: N `create` mutations of deliveries through pushMutations, in batches of
//    MAX_MUTATIONS_PER_PUSH (one transaction per push: client lock, validation, role, link and
//    signed checks, change numbers, rows, audit entries, stored results, watermark);
// 2. baseline: the same rows (same table, same columns) into a second fresh project as plain
//    multi-row INSERTs through `pg`, one statement of MAX_MUTATIONS_PER_PUSH rows per transaction,
//    with the change numbers taken from the project's counter in the same transaction.
// All pushes are timed first, then all plain batches; --interleaved makes them take turns batch by
// batch instead, so a change in a shared machine's load meets both sides (the plain side then runs
// colder, and measures slower). Per push it prints the time and the statements sent.
// It prints both rates and their ratio, then deletes everything it created (projects cascade to
// their records, audit entries, conflicts and counters; the user cascades to its sync clients and
// their stored mutations). It refuses a database whose name has neither "test" nor "bench" in it
// unless --force is given.
import { randomUUID } from "node:crypto";
import { performance } from "node:perf_hooks";
import pg from "pg";

const TEST_DATABASE_URL = "postgres://placewright@127.0.0.1:54339/placewright_test";

const argv = process.argv.slice(2);
const option = (name: string) => argv.find((a) => a.startsWith(`--${name}=`))?.slice(name.length + 3);
const force = argv.includes("--force");
const interleaved = argv.includes("--interleaved");
const count = Number(option("count") ?? 10_000);
if (!Number.isInteger(count) || count < 1) {
  console.error("--count must be a whole number of 1 or more");
  process.exit(2);
}

const url = process.env.DATABASE_URL ?? TEST_DATABASE_URL;
const databaseName = decodeURIComponent(new URL(url).pathname.replace(/^\//, ""));
if (!/test|bench/i.test(databaseName) && !force) {
  console.error(
    `bench-sync writes ${count.toLocaleString("en-US")} rows and refuses database "${databaseName}": ` +
      `its name has neither "test" nor "bench". Point DATABASE_URL at a throwaway database, or pass --force.`,
  );
  process.exit(2);
}
// db/index.ts reads DATABASE_URL when it is first imported.
process.env.DATABASE_URL = url;

const { closeDb, db, getPool } = await import("../db/index.ts");
// Counts the statements the app's pool sends (the plain baseline uses its own client), so the
// figures show the round trips one push costs as well as its time.
let statements = 0;
getPool().on("connect", (client) => {
  const query = client.query.bind(client) as (...args: unknown[]) => unknown;
  (client as unknown as { query: (...args: unknown[]) => unknown }).query = (...args: unknown[]) => {
    statements += 1;
    return query(...args);
  };
});
const { deleteBenchRows } = await import("./bench/cleanup.ts");
const { memberships, projects, users } = await import("../db/schema/index.ts");
const { MAX_MUTATIONS_PER_PUSH, SYNC_SCHEMA_VERSION } = await import("../lib/sync/protocol.ts");
type Mutation = import("../lib/sync/protocol.ts").Mutation;
const { pushMutations } = await import("../lib/sync/server/push.ts");

const BATCH = MAX_MUTATIONS_PER_PUSH;
const T0 = Date.parse("2026-11-16T08:00:00-06:00");
const at = (minutes: number) => new Date(T0 + minutes * 60_000).toISOString();
const fmt = (n: number) => Math.round(n).toLocaleString("en-US");

/** The create input of the i-th delivery of a placement (what a device sends). */
function delivery(i: number, placementId: string) {
  return {
    id: randomUUID(),
    placementId,
    ticketNumber: `B-${String(i).padStart(6, "0")}`,
    truck: `T-${i % 40}`,
    volumeM3: 8,
    batchedAt: at(i),
    arrivedAt: at(i + 30),
    dischargeStartedAt: at(i + 35),
    dischargeFinishedAt: at(i + 60),
    revolutions: 70 + (i % 200),
  };
}
type Delivery = ReturnType<typeof delivery>;

const tag = randomUUID().slice(0, 8).toUpperCase();
const [user] = await db
  .insert(users)
  .values({ email: `bench-${tag.toLowerCase()}@example.test`, name: `Bench ${tag}`, isAdmin: false })
  .returning();
const sessionUser = { id: user.id, email: user.email, name: user.name, isAdmin: false };
const [syncProject, plainProject] = await db
  .insert(projects)
  .values([
    { name: `Bench sync ${tag}`, code: `BS-${tag}`, timeZone: "America/Chicago", unitSystem: "SI" as const },
    { name: `Bench plain ${tag}`, code: `BP-${tag}`, timeZone: "America/Chicago", unitSystem: "SI" as const },
  ])
  .returning();
await db.insert(memberships).values([
  { userId: user.id, projectId: syncProject.id, role: "superintendent" },
  { userId: user.id, projectId: plainProject.id, role: "superintendent" },
]);

const plain = new pg.Client({ connectionString: url });
await plain.connect();

try {
  // One placement per project, created through the same push (not timed; it also warms up the path).
  const clientId = randomUUID();
  const placementIds: string[] = [];
  for (const [index, project] of [syncProject, plainProject].entries()) {
    const id = randomUUID();
    placementIds.push(id);
    const setup = await pushMutations(sessionUser, {
      clientId,
      schemaVersion: SYNC_SCHEMA_VERSION,
      mutations: [
        {
          id: index + 1,
          name: "create",
          recordType: "placements",
          projectId: project.id,
          recordId: id,
          args: { id, element: "Bench slab", level: "L1", grid: "A-D/1-4", elementType: "elevated-slab", plannedStart: at(0) },
        },
      ],
    });
    if (setup.results[0].result !== "applied") throw new Error(`could not create the bench placement: ${JSON.stringify(setup.results[0])}`);
  }

  // 1. The sync push, one push of BATCH creates.
  const firstId = 3;
  const mutations: Mutation[] = Array.from({ length: count }, (_, i) => {
    const args = delivery(i, placementIds[0]);
    return { id: firstId + i, name: "create", recordType: "deliveries", projectId: syncProject.id, recordId: args.id, args };
  });
  let applied = 0;
  const pushes: { ms: number; statements: number }[] = [];
  async function syncBatch(i: number) {
    const before = { at: performance.now(), statements };
    const response = await pushMutations(sessionUser, { clientId, schemaVersion: SYNC_SCHEMA_VERSION, mutations: mutations.slice(i, i + BATCH) });
    pushes.push({ ms: performance.now() - before.at, statements: statements - before.statements });
    for (const result of response.results) {
      if (result.result !== "applied") throw new Error(`mutation ${result.id} was not applied: ${JSON.stringify(result)}`);
      applied += 1;
    }
  }

  // 2. The baseline: the same rows as plain batched INSERTs, one transaction of BATCH rows.
  const columns = [
    "id",
    "project_id",
    "version",
    "change_seq",
    "updated_by",
    "placement_id",
    "ticket_number",
    "truck",
    "volume_m3",
    "batched_at",
    "arrived_at",
    "discharge_started_at",
    "discharge_finished_at",
    "revolutions",
  ];
  const rows: Delivery[] = Array.from({ length: count }, (_, i) => delivery(i, placementIds[1]));
  async function plainBatch(i: number) {
    const batch = rows.slice(i, i + BATCH);
    await plain.query("BEGIN");
    try {
      const counter = await plain.query<{ last_seq: string }>(
        "UPDATE project_change_counters SET last_seq = last_seq + $2 WHERE project_id = $1 RETURNING last_seq",
        [plainProject.id, batch.length],
      );
      const firstSeq = Number(counter.rows[0].last_seq) - batch.length + 1;
      const values: unknown[] = [];
      const tuples = batch.map((d, j) => {
        const row = [
          d.id,
          plainProject.id,
          1,
          firstSeq + j,
          user.id,
          d.placementId,
          d.ticketNumber,
          d.truck,
          d.volumeM3,
          d.batchedAt,
          d.arrivedAt,
          d.dischargeStartedAt,
          d.dischargeFinishedAt,
          d.revolutions,
        ];
        const placeholders = row.map((value) => {
          values.push(value);
          return `$${values.length}`;
        });
        return `(${placeholders.join(", ")})`;
      });
      await plain.query(`INSERT INTO deliveries (${columns.join(", ")}) VALUES ${tuples.join(", ")}`, values);
      await plain.query("COMMIT");
    } catch (error) {
      await plain.query("ROLLBACK");
      throw error;
    }
  }

  // One side after the other, or taking turns batch by batch (--interleaved).
  let syncMs = 0;
  let plainMs = 0;
  const timed = async (run: () => Promise<void>) => {
    const start = performance.now();
    await run();
    return performance.now() - start;
  };
  if (interleaved) {
    for (let i = 0; i < count; i += BATCH) {
      syncMs += await timed(() => syncBatch(i));
      plainMs += await timed(() => plainBatch(i));
    }
  } else {
    for (let i = 0; i < count; i += BATCH) syncMs += await timed(() => syncBatch(i));
    for (let i = 0; i < count; i += BATCH) plainMs += await timed(() => plainBatch(i));
  }
  const syncSeconds = syncMs / 1000;
  const plainSeconds = plainMs / 1000;
  if (applied !== count) throw new Error(`${applied} of ${count} mutations applied`);

  const [{ n: syncRows }] = (await plain.query<{ n: number }>("SELECT count(*)::int AS n FROM deliveries WHERE project_id = $1", [syncProject.id])).rows;
  const [{ n: plainRows }] = (await plain.query<{ n: number }>("SELECT count(*)::int AS n FROM deliveries WHERE project_id = $1", [plainProject.id])).rows;
  if (syncRows !== count || plainRows !== count) throw new Error(`expected ${count} rows in each project, found ${syncRows} and ${plainRows}`);

  const syncRate = count / syncSeconds;
  const plainRate = count / plainSeconds;
  console.log(`database ${databaseName}; ${fmt(count)} delivery creates in batches of ${BATCH}, ${interleaved ? "sync and plain taking turns" : "sync then plain"}`);
  console.log(`  sync push (pushMutations): ${syncSeconds.toFixed(2)} s, ${((syncSeconds * 1000) / count).toFixed(2)} ms per mutation`);
  console.log(`  plain batched INSERT (pg):  ${plainSeconds.toFixed(2)} s, ${((plainSeconds * 1000) / count).toFixed(3)} ms per row`);
  const pushFigures = (label: string, some: typeof pushes) =>
    some.length
      ? `${label} ${(some.reduce((sum, p) => sum + p.ms, 0) / some.length).toFixed(1)} ms, ` +
        `${Math.min(...some.map((p) => p.statements))}–${Math.max(...some.map((p) => p.statements))} statements`
      : "";
  const tenth = Math.max(1, Math.floor(pushes.length / 10));
  console.log(`  per push (${fmt(BATCH)} creates; statements counted on the app's pool, BEGIN/COMMIT included):`);
  console.log(`    ${pushFigures("first tenth", pushes.slice(0, tenth))}; ${pushFigures("last tenth", pushes.slice(-tenth))}`);
  console.log(`sync push: ${fmt(syncRate)} mutations/s; plain batched INSERT: ${fmt(plainRate)} rows/s; ratio ${(plainRate / syncRate).toFixed(1)}× (sync ÷ plain ${(syncRate / plainRate).toFixed(2)})`);
} finally {
  // Clean up: projects cascade to memberships, records, audit entries, conflicts and counters;
  // the user cascades to its sync clients and their stored mutations.
  await plain.end().catch(() => undefined);
  await deleteBenchRows(db, [syncProject.id, plainProject.id], [user.id]);
  await closeDb();
}
