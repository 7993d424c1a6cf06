// The crash test of sync (run by scripts/chaos-sync.sh). Three simulated devices of the demo
// superintendent push and pull the way lib/sync/client does (outbox kept until answered, resent
// after any failure, dropped at or below the acknowledged id on pull) while the app server is
// SIGKILLed by pid at random moments CHAOS_KILLS times (restarted each time), and PostgreSQL is
// killed once in the middle of a push. At the end every device must equal the server, no mutation
// may have been applied twice and none lost. Prints the figures; exit 1 if any check fails.
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { randomUUID } from "node:crypto";
import { encode } from "next-auth/jwt";
import { Client } from "pg";

const PORT = Number(process.env.CHAOS_APP_PORT ?? 3199);
const KILLS = Number(process.env.CHAOS_KILLS ?? 50);
const BASE = `http://127.0.0.1:${PORT}`;
const DB_URL = process.env.DATABASE_URL!;
const SAM = "0b7d2a51-5c1e-4f0a-9a55-000000000001"; // scripts/seed/ids.ts DEMO_IDS.users.sam
const MILLRACE = "6f1c3e20-8d44-4b7e-b1a2-00000000000b"; // scripts/seed/ids.ts DEMO_IDS.projects.millrace
const SCHEMA_VERSION = Number((await import("../lib/sync/protocol.ts")).SYNC_SCHEMA_VERSION);

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const rand = (lo: number, hi: number) => lo + Math.floor(Math.random() * (hi - lo + 1));

async function sql<T = Record<string, unknown>>(text: string, params: unknown[] = []): Promise<T[]> {
  const client = new Client({ connectionString: DB_URL });
  await client.connect();
  try {
    return (await client.query(text, params)).rows as T[];
  } finally {
    await client.end();
  }
}

// ---- the app server -------------------------------------------------------------------------
let server: ChildProcess | null = null;
async function startServer() {
  server = spawn("node", ["node_modules/next/dist/bin/next", "start", "-H", "127.0.0.1", "-p", String(PORT)], {
    env: { ...process.env, DIGEST_WORKER: "off" },
    stdio: "ignore",
  });
  for (let i = 0; i < 600; i++) {
    const ok = await fetch(`${BASE}/api/health`).then((r) => r.ok, () => false);
    if (ok) return;
    await sleep(100);
  }
  throw new Error("the app did not become ready in 60 s");
}
function killServer() {
  const pid = server?.pid;
  if (pid) process.kill(pid, "SIGKILL");
  server = null;
}

// ---- a device -------------------------------------------------------------------------------
type Mutation = { id: number; name: "create" | "update"; recordType: "placements"; projectId: string; recordId: string; args: Record<string, unknown>; baseVersion?: number };
type Local = { id: string; version: number; deletedAt: string | null };

class Device {
  clientId = randomUUID();
  outbox: Mutation[] = [];
  nextId = 1;
  acked = 0;
  cursor: Record<string, number> | null = null;
  local = new Map<string, Local>(); // the device's copy of the project's placements, from pulls
  mine = new Map<string, number>(); // records this device created → version it last heard
  sent = new Set<number>();
  inFlight = false;
  constructor(readonly name: string, readonly cookie: string) {}

  write() {
    const pendingRecords = new Set(this.outbox.map((m) => m.recordId));
    const editable = [...this.mine.entries()].filter(([id, v]) => v > 0 && !pendingRecords.has(id));
    if (editable.length && Math.random() < 0.4) {
      const [recordId, version] = editable[rand(0, editable.length - 1)];
      this.outbox.push({ id: this.nextId++, name: "update", recordType: "placements", projectId: MILLRACE, recordId, args: { patch: { plannedVolumeM3: rand(10, 90) } }, baseVersion: version });
      return;
    }
    const id = randomUUID();
    const args = { id, element: `Chaos ${this.name} ${this.nextId}`, level: "L1", grid: "A-B/1-2", elementType: "wall", leastDimensionMm: 300, plannedVolumeM3: 20, plannedStart: new Date().toISOString() };
    this.mine.set(id, 0);
    this.outbox.push({ id: this.nextId++, name: "create", recordType: "placements", projectId: MILLRACE, recordId: id, args });
  }

  async post(path: string, body: unknown): Promise<Response | null> {
    return fetch(`${BASE}${path}`, { method: "POST", headers: { "content-type": "application/json", cookie: this.cookie }, body: JSON.stringify(body), signal: AbortSignal.timeout(15_000) }).catch(() => null);
  }

  async push(): Promise<boolean> {
    if (!this.outbox.length) return true;
    const batch = this.outbox.slice(0, 50);
    for (const m of batch) this.sent.add(m.id);
    this.inFlight = true;
    const res = await this.post("/api/sync/push", { clientId: this.clientId, schemaVersion: SCHEMA_VERSION, mutations: batch });
    this.inFlight = false;
    if (!res || res.status !== 200) return false;
    const json = (await res.json().catch(() => null)) as { results: { id: number; result: string; version?: number }[] } | null;
    if (!json) return false;
    for (const r of json.results) {
      const m = this.outbox.find((e) => e.id === r.id);
      if (m && r.result === "applied" && r.version) this.mine.set(m.recordId, r.version);
    }
    const answered = new Set(json.results.map((r) => r.id));
    this.outbox = this.outbox.filter((m) => !answered.has(m.id));
    return true;
  }

  async pull(): Promise<boolean> {
    for (let page = 0; page < 1000; page++) {
      const res = await this.post("/api/sync/pull", { clientId: this.clientId, schemaVersion: SCHEMA_VERSION, cursor: this.cursor, ackedMutationId: this.acked });
      if (!res || res.status !== 200) return false;
      const json = (await res.json().catch(() => null)) as { reset: boolean; cursor: Record<string, number>; hasMore: boolean; changes: { recordType: string; record: Local & { projectId: string } }[]; lastMutationId: number } | null;
      if (!json) return false;
      if (json.reset && page === 0) this.local.clear();
      for (const c of json.changes) {
        if (c.recordType === "placements" && c.record.projectId === MILLRACE) this.local.set(c.record.id, { id: c.record.id, version: c.record.version, deletedAt: c.record.deletedAt });
      }
      this.cursor = json.cursor;
      this.outbox = this.outbox.filter((m) => m.id > json.lastMutationId);
      this.acked = json.lastMutationId;
      if (!json.hasMore) return true;
    }
    return true;
  }
}

async function cookieFor(userId: string): Promise<string> {
  const [row] = await sql<{ id: string }>(
    "insert into user_sessions (user_id, session_version) select id, session_version from users where id = $1 returning id",
    [userId],
  );
  const token = await encode({ token: { sub: userId, sid: row.id }, secret: process.env.NEXTAUTH_SECRET! });
  return `next-auth.session-token=${token}`;
}

// ---- the run --------------------------------------------------------------------------------
await startServer();
const devices = [new Device("phone", await cookieFor(SAM)), new Device("tablet", await cookieFor(SAM)), new Device("laptop", await cookieFor(SAM))];
let running = true;
const loops = devices.map(async (d) => {
  while (running) {
    if (Math.random() < 0.3) d.write();
    await d.push();
    if (Math.random() < 0.5) await d.pull();
    await sleep(rand(20, 150));
  }
});

let kills = 0;
let pgKills = 0;
const started = Date.now();
for (let k = 1; k <= KILLS; k++) {
  await sleep(rand(300, 2500));
  if (k === Math.ceil(KILLS / 2)) {
    // PostgreSQL, once, while a push is in flight: an immediate shutdown is a crash (no checkpoint).
    while (!devices.some((d) => d.inFlight)) await sleep(5);
    spawnSync("runuser", ["-u", "postgres", "--", `${process.env.CHAOS_PG_BIN}/pg_ctl`, "-D", process.env.CHAOS_PG_DIR!, "-m", "immediate", "stop"], { stdio: "ignore" });
    pgKills++;
    await sleep(rand(500, 1500));
    spawnSync("runuser", ["-u", "postgres", "--", `${process.env.CHAOS_PG_BIN}/pg_ctl`, "-D", process.env.CHAOS_PG_DIR!, "-l", `${process.env.CHAOS_PG_DIR}/server.log`, "-w", "start"], { stdio: "ignore" });
  }
  killServer();
  kills++;
  await startServer();
  process.stdout.write(`\rkills ${kills}/${KILLS}`);
}
running = false;
await Promise.all(loops);

// Drain: every device sends what it has and pulls until the server has nothing more.
const drainUntil = Date.now() + 15 * 60_000;
while (devices.some((d) => d.outbox.length) && Date.now() < drainUntil) {
  for (const d of devices) {
    await d.push();
    await d.pull();
  }
}
for (const d of devices) await d.pull();
killServer();

// ---- the figures ----------------------------------------------------------------------------
const clientIds = devices.map((d) => d.clientId);
const sent = devices.reduce((n, d) => n + d.sent.size, 0);
const generated = devices.reduce((n, d) => n + d.nextId - 1, 0);
const stored = await sql<{ client_id: string; mutation_id: number; result: string }>("select client_id, mutation_id, result from sync_mutations where client_id = any($1)", [clientIds]);
const applied = stored.filter((r) => r.result === "applied").length;
const audits = await sql<{ n: number }>("select count(*)::int as n from audit_entries where device_id = any($1) and action in ('create', 'update')", [clientIds]);
const duplicates = audits[0].n - applied;
// Lost: a change the device no longer holds (answered or acknowledged) with no result on the server.
let lost = 0;
const unsent = devices.reduce((n, d) => n + d.outbox.length, 0);
for (const d of devices) {
  const ids = new Set(stored.filter((r) => r.client_id === d.clientId).map((r) => r.mutation_id));
  const held = new Set(d.outbox.map((m) => m.id));
  for (let id = 1; id < d.nextId; id++) if (!ids.has(id) && !held.has(id)) lost++;
}
const createdIds = devices.flatMap((d) => [...d.mine.keys()]);
const rows = await sql<{ id: string; version: number; deleted_at: Date | null }>("select id, version, deleted_at from placements where project_id = $1", [MILLRACE]);
const missingRecords = createdIds.filter((id) => !rows.some((r) => r.id === id)).length;
const serverRows = new Map(rows.map((r) => [r.id, `${r.version}:${r.deleted_at ? 1 : 0}`]));
const diverged = devices.filter(
  (d) => d.local.size !== serverRows.size || [...d.local.values()].some((l) => serverRows.get(l.id) !== `${l.version}:${l.deletedAt ? 1 : 0}`),
).length;
const outcomes = stored.reduce<Record<string, number>>((acc, r) => ({ ...acc, [r.result]: (acc[r.result] ?? 0) + 1 }), {});

console.log(`
chaos:sync (${Math.round((Date.now() - started) / 1000)} s)
  app server SIGKILLs:       ${kills}
  PostgreSQL crashes:        ${pgKills} (immediate stop while a push was in flight)
  mutations created:         ${generated} (3 devices)
  mutations sent:            ${sent} distinct (every resend after a failure included once)
  applied:                   ${applied}   outcomes: ${JSON.stringify(outcomes)}
  duplicates:                ${duplicates} (audit entries of these devices minus applied results)
  lost:                      ${lost} (no longer on a device, no result on the server); records missing: ${missingRecords}
  still waiting on devices:  ${unsent}
  devices equal to server:   ${devices.length - diverged}/${devices.length}
`);
const ok = duplicates === 0 && lost === 0 && unsent === 0 && missingRecords === 0 && diverged === 0 && generated === stored.length;
if (!ok) {
  console.error("chaos:sync FAILED");
  process.exit(1);
}
console.log("chaos:sync passed");
process.exit(0);
