// Two instances of one build behind the round-robin proxy (PLAYWRIGHT_PAIR=1, scripts/serve-pair.mjs):
// nothing in the app may assume one process. Each check talks HTTP to the proxy or to one instance
// directly, and reads PostgreSQL to see what was applied.
import { SYNC_SCHEMA_VERSION } from "@/lib/sync/protocol";
import { spawn, type ChildProcess } from "node:child_process";
import { createHash, randomUUID } from "node:crypto";
import { hash } from "@node-rs/argon2";
import { expect, test } from "@playwright/test";
import { Client } from "pg";

const APP_PORT = Number(process.env.APP_PORT ?? 3100);
const PROXY = `http://127.0.0.1:${APP_PORT}`;
const [A, B] = process.env.PAIR_PORTS!.split(",").map((p) => `http://127.0.0.1:${p}`);
const DOOMED_PORT = APP_PORT + 202;
const DOOMED = `http://127.0.0.1:${DOOMED_PORT}`;

test.describe.configure({ mode: "serial" });

async function withDb<T>(fn: (db: Client) => Promise<T>): Promise<T> {
  const db = new Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    return await fn(db);
  } finally {
    await db.end();
  }
}

const cookiesOf = (res: Response) => res.headers.getSetCookie().map((c) => c.split(";")[0]);

/** next-auth's credentials sign-in over HTTP: the CSRF pair from one address, the POST to another. */
async function signIn(csrfFrom: string, postTo: string, email: string, password: string): Promise<{ cookie: string | null; error: string | null }> {
  const csrf = await fetch(`${csrfFrom}/api/auth/csrf`);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const res = await fetch(`${postTo}/api/auth/callback/password`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: cookiesOf(csrf).join("; ") },
    body: new URLSearchParams({ csrfToken, email, password, json: "true" }),
  });
  const session = cookiesOf(res).find((c) => c.startsWith("next-auth.session-token="));
  const { url } = (await res.json()) as { url: string };
  return { cookie: session ?? null, error: new URL(url, postTo).searchParams.get("error") };
}

test("requests alternate between both instances, which serve the same service worker and assets", async () => {
  const servedBy = new Set<string>();
  for (let i = 0; i < 4; i++) servedBy.add((await fetch(`${PROXY}/api/health/live`)).headers.get("x-served-by") ?? "");
  expect(servedBy.size, "round robin over two instances").toBe(2);

  // Same build: the service worker (with its precache manifest and revisions) is byte-identical.
  const sha = async (url: string) => createHash("sha256").update(Buffer.from(await (await fetch(url)).arrayBuffer())).digest("hex");
  const [swA, swB] = [await sha(`${A}/sw.js`), await sha(`${B}/sw.js`)];
  expect(swA).toBe(swB);
  const sw = await (await fetch(`${A}/sw.js`)).text();
  const asset = sw.match(/"(\/_next\/static\/[^"]+\.js)"/)?.[1];
  expect(asset, "the precache lists the build's assets").toBeTruthy();
  expect(await sha(`${A}${asset}`)).toBe(await sha(`${B}${asset}`));

  // Readiness and liveness on each instance; /api/health stays as it was for older callers.
  for (const base of [A, B]) {
    const ready = await fetch(`${base}/api/health/ready`);
    expect(ready.status).toBe(200);
    expect(await ready.json()).toMatchObject({ ready: true, checks: { shutdown: "running", database: "ready", migrations: "applied" } });
    expect((await fetch(`${base}/api/health`)).status).toBe(200);
  }
});

test("a session from one instance is honoured by the other", async () => {
  const { cookie } = await signIn(A, A, "sam.super@example.test", "placewright-demo");
  expect(cookie).toBeTruthy();
  const res = await fetch(`${B}/api/projects`, { headers: { cookie: cookie! } });
  expect(res.status).toBe(200);
  expect(((await res.json()) as { name: string }[]).length).toBeGreaterThan(0);
});

test("sign-in throttling counts wrong passwords across both instances", async () => {
  test.setTimeout(120_000);
  const lockedAfter = async (email: string, bases: string[]) => {
    for (let attempt = 1; attempt <= 20; attempt++) {
      const base = bases[attempt % bases.length];
      const { error } = await signIn(base, base, email, "not-the-password");
      if (error && /Too many wrong passwords/.test(error)) return attempt;
    }
    return Infinity;
  };
  const single = await lockedAfter(`throttle-one-${randomUUID().slice(0, 8)}@example.test`, [A]);
  const alternating = await lockedAfter(`throttle-two-${randomUUID().slice(0, 8)}@example.test`, [A, B]);
  console.log(`sign-in locked after ${single} wrong passwords on one instance, ${alternating} alternating A/B`);
  expect(single).toBeLessThan(20);
  // A counter per process would need about twice as many attempts when they alternate.
  expect(alternating).toBe(single);
});

/** A superintendent of a project of their own (so other suites' lists are untouched), signed in. */
async function superintendentOfNewProject() {
  const tag = randomUUID().slice(0, 8);
  const email = `pair-${tag}@example.test`;
  const password = `pair-password-${tag}`;
  const projectId = randomUUID();
  await withDb(async (db) => {
    const user = await db.query("insert into users (email, name, password_hash) values ($1, $2, $3) returning id", [email, `Pair Tester ${tag}`, await hash(password)]);
    await db.query("insert into projects (id, name, code, time_zone, unit_system) values ($1, $2, $3, 'America/Chicago', 'SI')", [projectId, `Pair ${tag}`, `PAIR-${tag}`]);
    await db.query("insert into memberships (user_id, project_id, role) values ($1, $2, 'superintendent')", [user.rows[0].id, projectId]);
  });
  const { cookie } = await signIn(B, B, email, password);
  expect(cookie).toBeTruthy();
  return { tag, projectId, cookie: cookie! };
}

/** Device mutations `from`..`to`: each creates a placement. */
function placementCreates(tag: string, projectId: string, from: number, to: number) {
  return Array.from({ length: to - from + 1 }, (_, i) => {
    const id = randomUUID();
    const n = from + i;
    const args = { id, element: `Pair slab ${tag} ${n}`, level: "L2", grid: "A-D/1-4", elementType: "elevated-slab", leastDimensionMm: 250, plannedVolumeM3: 60, plannedStart: "2026-11-16T14:00:00Z" };
    return { id: n, name: "create", recordType: "placements", projectId, recordId: id, args };
  });
}

function startDoomed(): Promise<{ child: ChildProcess; output: () => string }> {
  const child = spawn(process.execPath, ["scripts/serve.mjs", "-H", "127.0.0.1", "-p", String(DOOMED_PORT)], {
    env: { ...process.env, DIGEST_WORKER: "off", INSTANCE_NAME: "doomed", LOG_LEVEL: "info" },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let out = "";
  child.stdout!.on("data", (d) => (out += d));
  child.stderr!.on("data", (d) => (out += d));
  return new Promise((resolve, reject) => {
    const until = Date.now() + 120_000;
    const poll = async () => {
      if (child.exitCode !== null) return reject(new Error(`the instance exited: ${out}`));
      const ok = await fetch(`${DOOMED}/api/health/ready`).then((r) => r.ok, () => false);
      if (ok) return resolve({ child, output: () => out });
      if (Date.now() > until) return reject(new Error("the instance did not start"));
      setTimeout(poll, 250);
    };
    void poll();
  });
}

test("one device's pushes landing on alternating instances apply once and in order", async () => {
  const { tag, projectId, cookie } = await superintendentOfNewProject();
  const clientId = randomUUID();
  const push = async (base: string, mutations: ReturnType<typeof placementCreates>) => {
    const res = await fetch(`${base}/api/sync/push`, { method: "POST", headers: { "content-type": "application/json", cookie }, body: JSON.stringify({ clientId, schemaVersion: SYNC_SCHEMA_VERSION, mutations }) });
    return { status: res.status, json: (await res.json()) as { lastMutationId?: number; results?: { id: number; result: string }[]; error?: { reason?: string; expectedId?: number } } };
  };
  const all = placementCreates(tag, projectId, 1, 30);
  expect((await push(A, all.slice(0, 10))).json.lastMutationId).toBe(10);
  expect((await push(B, all.slice(0, 20))).json.lastMutationId).toBe(20); // 1–10 replayed by B, 11–20 applied
  // A later batch arriving first, on the other instance, is refused at the gap (SYNC.md): nothing applied.
  const early = await push(A, all.slice(25, 30));
  expect(early.status).toBe(409);
  expect(early.json.error).toMatchObject({ reason: "gap", expectedId: 21 });
  const rest = await push(B, all.slice(20, 30));
  expect(rest.json.lastMutationId).toBe(30);
  expect(rest.json.results!.every((r) => r.result === "applied")).toBe(true);
  await withDb(async (db) => {
    const ids = all.map((m) => m.recordId);
    const audits = await db.query("select record_id, count(*)::int as n from audit_entries where record_id = any($1::uuid[]) group by record_id", [ids]);
    expect(audits.rows.length).toBe(30);
    expect(audits.rows.every((r: { n: number }) => r.n === 1)).toBe(true);
    // In order: each placement's change number follows the device's mutation order.
    const seq = await db.query("select id, change_seq from placements where id = any($1::uuid[])", [ids]);
    const byId = new Map(seq.rows.map((r: { id: string; change_seq: string }) => [r.id, Number(r.change_seq)]));
    const seqs = ids.map((id) => byId.get(id)!);
    expect(seqs).toEqual([...seqs].sort((a, b) => a - b));
  });
});

test("SIGTERM during a push: the device's retry on the other instance applies each mutation once", async () => {
  test.setTimeout(240_000);
  const { tag, projectId, cookie } = await superintendentOfNewProject();
  const clientId = randomUUID();
  const mutations = placementCreates(tag, projectId, 1, 100);
  const body = JSON.stringify({ clientId, schemaVersion: SYNC_SCHEMA_VERSION, mutations });
  const push = (base: string) => fetch(`${base}/api/sync/push`, { method: "POST", headers: { "content-type": "application/json", cookie }, body });

  const doomed = await startDoomed();
  const exited = new Promise<number | null>((resolve) => doomed.child.on("exit", (code) => resolve(code)));
  const first = push(DOOMED).then(
    async (res) => ({ status: res.status, json: (await res.json()) as { results: { id: number; result: string; version?: number }[] } }),
    (error: Error) => ({ status: 0, json: null, error }),
  );
  // SIGTERM once the push's transaction has started writing (it has a transaction id) and before it
  // commits: the whole push is one transaction, so nothing of it is visible until then.
  const appliedSoFar = () => withDb(async (db) => Number((await db.query("select count(*) from sync_mutations where client_id = $1", [clientId])).rows[0].count));
  const writing = () =>
    withDb(async (db) =>
      Number(
        (await db.query("select count(*) from pg_stat_activity where datname = current_database() and pid <> pg_backend_pid() and backend_xid is not null and xact_start is not null"))
          .rows[0].count,
      ),
    );
  await expect.poll(writing, { timeout: 60_000, intervals: [10] }).toBeGreaterThan(0);
  doomed.child.kill("SIGTERM");
  const atSigterm = await appliedSoFar();
  const answered = await first;
  console.log(`SIGTERM with ${atSigterm} of 100 mutations applied; the in-flight push answered ${answered.status}`);
  expect(atSigterm, "the push was still in flight at SIGTERM").toBeLessThan(100);
  // Graceful: the request in flight was finished and answered, not cut.
  expect(answered.status).toBe(200);
  expect(await exited, `graceful exit:\n${doomed.output()}`).toBe(0);
  const log = doomed.output();
  expect(log).toMatch(/"inFlight":[1-9]\d*,.*finishing requests in flight/);
  expect(log).toContain('"hook":"database pool"');
  // Stopped taking requests: the port no longer accepts connections.
  await expect(fetch(`${DOOMED}/api/health/live`)).rejects.toThrow();

  // The device did not keep the answer (or never got it): it sends the same batch again, to B.
  const retry = await push(B);
  expect(retry.status).toBe(200);
  const replay = (await retry.json()) as { lastMutationId: number; results: { id: number; result: string; version?: number }[] };
  expect(replay.lastMutationId).toBe(100);
  expect(replay.results.map((r) => [r.id, r.result, r.version])).toEqual(mutations.map((m) => [m.id, "applied", 1]));
  expect(answered.json!.results).toEqual(replay.results);

  await withDb(async (db) => {
    const ids = mutations.map((m) => m.recordId);
    const rows = await db.query("select count(*)::int as n from placements where id = any($1::uuid[])", [ids]);
    expect(rows.rows[0].n).toBe(100);
    const audits = await db.query("select record_id, count(*)::int as n from audit_entries where record_id = any($1::uuid[]) group by record_id", [ids]);
    expect(audits.rows.length).toBe(100);
    expect(audits.rows.every((r: { n: number }) => r.n === 1), "one audit entry per record: each mutation applied once").toBe(true);
    const device = await db.query("select last_mutation_id from sync_clients where id = $1", [clientId]);
    expect(device.rows[0].last_mutation_id).toBe(100);
  });
});

test("a missing DATABASE_URL or a malformed S3 endpoint stops the boot with one line naming it", async () => {
  test.setTimeout(120_000);
  const boot = (env: Record<string, string | undefined>) =>
    new Promise<{ code: number | null; stderr: string }>((resolve) => {
      const child = spawn(process.execPath, ["scripts/serve.mjs", "-H", "127.0.0.1", "-p", String(DOOMED_PORT + 1)], { env: { ...process.env, ...env } as NodeJS.ProcessEnv, stdio: ["ignore", "ignore", "pipe"] });
      let stderr = "";
      child.stderr!.on("data", (d) => (stderr += d));
      child.on("exit", (code) => resolve({ code, stderr }));
    });
  const [noDb, badS3] = await Promise.all([boot({ DATABASE_URL: "" }), boot({ S3_ENDPOINT: "localhost:4569 bucket" })]);
  for (const [result, name] of [
    [noDb, "DATABASE_URL is missing"],
    [badS3, "S3_ENDPOINT must be a URL starting with http:// or https://"],
  ] as const) {
    expect(result.code, result.stderr).toBe(78); // EX_CONFIG (sysexits.h)
    const lines = result.stderr.trim().split("\n");
    expect(lines, result.stderr).toHaveLength(1);
    expect(lines[0]).toContain(name);
    expect(lines[0]).not.toContain(process.env.NEXTAUTH_SECRET!);
  }
});
