// A device's pushes across two instances: alternating instances, and a SIGTERM during a push.
import { SYNC_SCHEMA_VERSION } from "@/lib/sync/protocol";
import { randomUUID } from "node:crypto";
import { expect, test } from "@playwright/test";
import { A, B, DOOMED, withDb, superintendentOfNewProject, placementCreates, startDoomed } from "./support";

test.describe.configure({ mode: "serial" });

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
