// npm run bench:load [-- --devices=200 --projects=20 --seconds=60 --connections=50] [--force]
// The sync routes under load on two app instances (scripts/serve-pair.mjs: a round-robin proxy in
// front of two `serve.mjs` processes) sharing one PostgreSQL, beside a baseline measured in the same
// run, with autocannon. Needs a production build (`npm run build`) and the app's environment
// (DATABASE_URL of a test or bench database, NEXTAUTH_SECRET, the fakes' URLs), as scripts/test.sh sets it.
// Three phases, a share of --seconds each:
// 1. baseline: GET /api/health (one query) with --connections connections;
// 2. empty incremental pull: POST /api/sync/pull from --devices signed-in devices whose cursor is
//    current, so there is nothing new: the cost of asking;
// 3. devices at work: each device in turn pushes 20 new deliveries to its project (POST /api/sync/push) and pulls,
//    push and pull traffic side by side.
// It prints requests/s, errors (non-2xx, socket errors, timeouts) and p50/p95/p99 per route, measured
// from each response's own time, and the ratio of the empty pull's rate to the health route's.
// Everything it created is deleted at the end. It refuses a database whose name has neither "test"
// nor "bench" in it unless --force is given.
import { spawn } from "node:child_process";
import { randomUUID } from "node:crypto";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import { encode } from "next-auth/jwt";
import { runLoad } from "./bench/load-run.ts";

const argv = process.argv.slice(2);
const option = (name: string) => argv.find((a) => a.startsWith(`--${name}=`))?.slice(name.length + 3);
const devicesCount = Number(option("devices") ?? 200);
const seconds = Number(option("seconds") ?? 60);
const connections = Number(option("connections") ?? 50);
const projectsCount = Number(option("projects") ?? 20);
if (![devicesCount, seconds, connections, projectsCount].every((n) => Number.isInteger(n) && n >= 1) || devicesCount < connections || devicesCount < projectsCount) {
  console.error("--devices, --seconds, --connections and --projects must be whole numbers of 1 or more, with at least as many devices as connections and as projects");
  process.exit(2);
}
const url = process.env.DATABASE_URL;
const secret = process.env.NEXTAUTH_SECRET;
if (!url || !secret) {
  console.error("bench-load needs DATABASE_URL and NEXTAUTH_SECRET (the app's environment; see scripts/test.sh)");
  process.exit(2);
}
const databaseName = decodeURIComponent(new URL(url).pathname.replace(/^\//, ""));
if (!/test|bench/i.test(databaseName) && !argv.includes("--force")) {
  console.error(`bench-load writes to database "${databaseName}", whose name has neither "test" nor "bench". Use a throwaway database, or pass --force.`);
  process.exit(2);
}

const { closeDb, db } = await import("../db/index.ts");
const { deleteBenchRows } = await import("./bench/cleanup.ts");
const { memberships, projects, users } = await import("../db/schema/index.ts");
const { createRecord } = await import("../lib/records/write.ts");
const { openSession } = await import("../lib/auth/user-sessions.ts");
const { SYNC_SCHEMA_VERSION } = await import("../lib/sync/protocol.ts");

// ── Set-up: the projects, one placement each to pour into, and the signed-in devices ──
// Devices are spread over --projects projects (a firm's sites), each device a member of one: a
// project's writes are serialised by its change counter (SYNC.md), and a day's findings are judged
// again on every push, so --projects=1 is the worst case of every device on one slab the same day.
const tag = randomUUID().slice(0, 8).toUpperCase();
const sites = await db
  .insert(projects)
  .values(Array.from({ length: projectsCount }, (_, i) => ({ name: `Bench load ${tag} ${i}`, code: `BL-${tag}-${i}`, timeZone: "America/Chicago", unitSystem: "SI" as const })))
  .returning();
const people = await db
  .insert(users)
  .values(Array.from({ length: devicesCount }, (_, i) => ({ email: `bench-${tag.toLowerCase()}-${i}@example.test`, name: `Bench ${tag} ${i}`, isAdmin: false })))
  .returning();
const siteOf = (i: number) => sites[i % sites.length];
await db.insert(memberships).values(people.map((u, i) => ({ userId: u.id, projectId: siteOf(i).id, role: "superintendent" as const })));
// The placement the trucks pour into on each project, through the write path (its change number and audit entry).
const placementOf = new Map<string, string>();
for (const [i, site] of sites.entries()) {
  const { record } = await createRecord({ user: { id: people[i].id, email: people[i].email, name: people[i].name, isAdmin: false } }, "placements", site.id, {
    id: randomUUID(),
    element: "Bench slab",
    level: "L1",
    grid: "A-D/1-4",
    elementType: "elevated-slab",
    leastDimensionMm: 250,
    plannedVolumeM3: 60,
    plannedStart: new Date().toISOString(),
  });
  placementOf.set(site.id, record.id);
}

type Device = { projectId: string; clientId: string; cookie: string; cursor: Record<string, number> | null; nextMutationId: number };
const devices: Device[] = [];
for (const [i, u] of people.entries()) {
  const sid = await openSession(u.id, "bench-load");
  const token = await encode({ token: { sub: u.id, email: u.email, name: u.name, isAdmin: false, sid }, secret });
  devices.push({ projectId: siteOf(i).id, clientId: randomUUID(), cookie: `next-auth.session-token=${token}`, cursor: null, nextMutationId: 1 });
}

// ── Two instances behind the proxy ──
const freePort = () =>
  new Promise<number>((resolve) => {
    const s = net.createServer().listen(0, "127.0.0.1", () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
const [port, portA, portB] = [await freePort(), await freePort(), await freePort()];
const base = `http://127.0.0.1:${port}`;
const pair = spawn(process.execPath, [path.join(import.meta.dirname, "serve-pair.mjs"), "-H", "127.0.0.1", "-p", String(port), "--ports", `${portA},${portB}`], {
  env: { ...process.env, DIGEST_WORKER: "off", APP_ORIGIN: base, NEXTAUTH_URL: base, LOG_LEVEL: "warn" },
  stdio: ["ignore", "ignore", "inherit"],
});
async function waitReady() {
  for (let i = 0; i < 240; i++) {
    const ok = await Promise.all([portA, portB].map((p) => fetch(`http://127.0.0.1:${p}/api/health`).then((r) => r.ok, () => false)));
    if (ok.every(Boolean)) return;
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error("the two instances did not become ready within 2 minutes (is there a build? npm run build)");
}

const headers = (d: Device) => ({ "content-type": "application/json", cookie: d.cookie, origin: base });
const pullBody = (d: Device) => JSON.stringify({ clientId: d.clientId, schemaVersion: SYNC_SCHEMA_VERSION, cursor: d.cursor });
function pushBody(d: Device) {
  const mutations = Array.from({ length: 20 }, () => {
    const id = randomUUID();
    const at = Date.now();
    return {
      id: d.nextMutationId++,
      name: "create",
      recordType: "deliveries",
      projectId: d.projectId,
      recordId: id,
      args: {
        id,
        placementId: placementOf.get(d.projectId),
        ticketNumber: `BL-${id.slice(0, 8)}`,
        truck: "B-17",
        volumeM3: 8,
        batchedAt: new Date(at - 50 * 60_000).toISOString(),
        arrivedAt: new Date(at - 20 * 60_000).toISOString(),
      },
    };
  });
  return JSON.stringify({ clientId: d.clientId, schemaVersion: SYNC_SCHEMA_VERSION, mutations });
}

let exitCode = 0;
try {
  await waitReady();
  // Every device's first pull, so its cursor is current (not timed).
  for (const d of devices) {
    const res = await fetch(`${base}/api/sync/pull`, { method: "POST", headers: headers(d), body: pullBody(d) });
    if (!res.ok) throw new Error(`first pull answered ${res.status}: ${await res.text()}`);
    d.cursor = ((await res.json()) as { cursor: Record<string, number> }).cursor;
  }
  const phase = Math.max(1, Math.round(seconds / 4));
  let turn = 0;
  const nextDevice = () => devices[turn++ % devices.length];

  const loadAtStart = os.loadavg()[0];
  const health = await runLoad(base, connections, "GET /api/health (baseline)", phase, () => ({ method: "GET", path: "/api/health" }));
  const emptyPull = await runLoad(base, connections, "POST /api/sync/pull, nothing new", phase, () => {
    const d = nextDevice();
    return { method: "POST", path: "/api/sync/pull", headers: headers(d), body: pullBody(d), device: d };
  });
  // Devices at work: push and pull side by side, each device's requests far apart (devices ≥ connections).
  let pushTurn = 0;
  let pullTurn = devices.length >> 1;
  const [push, pull] = await Promise.all([
    runLoad(base, connections, "POST /api/sync/push (20 changes)", phase * 2, () => {
      const d = devices[pushTurn++ % devices.length];
      return { method: "POST", path: "/api/sync/push", headers: headers(d), body: pushBody(d), device: d };
    }),
    runLoad(base, connections, "POST /api/sync/pull, while pushing", phase * 2, () => {
      const d = devices[pullTurn++ % devices.length];
      return { method: "POST", path: "/api/sync/pull", headers: headers(d), body: pullBody(d), device: d };
    }),
  ]);

  const rows = [health, emptyPull, push, pull];
  console.log(`\nbench:load · ${devicesCount} devices on ${projectsCount} project(s) · ${connections} connections per run · two instances behind a round-robin proxy · one PostgreSQL`);
  console.log(`${"route".padEnd(38)} ${"req".padStart(7)} ${"s".padStart(6)} ${"req/s".padStart(8)} ${"mean ms".padStart(8)} ${"errors".padStart(7)} ${"p50 ms".padStart(7)} ${"p95 ms".padStart(7)} ${"p99 ms".padStart(7)} ${"ac p50".padStart(7)} ${"ac p99".padStart(7)}`);
  for (const r of rows) {
    console.log(`${r.route.padEnd(38)} ${String(r.requests).padStart(7)} ${r.seconds.toFixed(1).padStart(6)} ${r.perSecond.toFixed(1).padStart(8)} ${r.meanMs.toFixed(0).padStart(8)} ${String(r.errors).padStart(7)} ${String(r.p50).padStart(7)} ${String(r.p95).padStart(7)} ${String(r.p99).padStart(7)} ${String(r.cannonP50).padStart(7)} ${String(r.cannonP99).padStart(7)}`);
  }
  for (const r of rows) for (const [why, count] of r.reasons) console.log(`  ${r.route}: ${count} × ${why}`);
  console.log(`machine load (1-minute average) when the runs began ${loadAtStart.toFixed(2)}, when they ended ${os.loadavg()[0].toFixed(2)}, on ${os.availableParallelism()} cores (every process here shares them)`);
  console.log(`\nempty incremental pull ÷ health route (requests/s): ${(emptyPull.perSecond / health.perSecond).toFixed(2)} (target ≥ 0.5)`);
  console.log(`errors in all: ${rows.reduce((n, r) => n + r.errors, 0)} (target 0); p99 pull ${pull.p99} ms (target ≤ 150), push ${push.p99} ms (target ≤ 300)`);
} catch (error) {
  console.error(error);
  exitCode = 1;
} finally {
  pair.kill("SIGTERM");
  await new Promise((r) => pair.once("exit", r));
  await deleteBenchRows(db, sites.map((p) => p.id), people.map((u) => u.id));
  await closeDb();
}
process.exit(exitCode);
