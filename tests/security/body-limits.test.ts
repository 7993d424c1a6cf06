// Finding 1: request size. Attack: a signed-in read-only owner tries to grow the database without
// bound: huge bodies (declared and undeclared length), a sync change with megabytes of args, changes
// refused as forbidden whose payload used to be stored raw, and changes naming a project that does
// not exist. Each is refused with a clear message and leaves the row counts and stored bytes alone.
// [common practice: OWASP API Security Top 10 2023, API4 unrestricted resource consumption]
import { randomUUID } from "node:crypto";
import { eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { POST as pushRoute } from "@/app/api/sync/push/route";
import { POST as createRoute } from "@/app/api/projects/[projectId]/records/[type]/route";
import { db } from "@/db";
import { syncMutations } from "@/db/schema";
import { DEFAULT_MAX_BODY_BYTES, SYNC_MAX_BODY_BYTES } from "@/lib/api/request-guard";
import { MAX_MUTATION_ARGS_BYTES, SYNC_SCHEMA_VERSION } from "@/lib/sync/protocol";
import { projectWithTeam } from "../integration/helpers";
import { validBody } from "../integration/record-fixtures";
import { attack, streamOf, tableCounts } from "./attack";

const mutation = (id: number, projectId: string, args: Record<string, unknown>) => ({
  id,
  name: "create",
  recordType: "mix-designs",
  projectId,
  recordId: randomUUID(),
  args,
});

describe("request size limits", () => {
  let s: Awaited<ReturnType<typeof projectWithTeam>>;
  beforeAll(async () => {
    s = await projectWithTeam();
  });

  it("a declared Content-Length over the cap is a 413 before anything is read", async () => {
    const before = await tableCounts();
    const res = await attack(createRoute, {
      user: s.team.office,
      params: { projectId: s.project.id, type: "mix-designs" },
      headers: { "content-length": String(DEFAULT_MAX_BODY_BYTES + 1) },
      body: JSON.stringify(validBody("mix-designs")),
    });
    expect(res.status).toBe(413);
    expect(res.json.error.message).toMatch(/too large.*Nothing was saved/);
    expect(await tableCounts()).toEqual(before);
  });

  it("a chunked body with no length is counted while read and cut at the cap (413)", async () => {
    const before = await tableCounts();
    const res = await attack(pushRoute, { user: s.team.owner, body: streamOf(SYNC_MAX_BODY_BYTES + 10) });
    expect(res.status).toBe(413);
    expect(res.json.error.code).toBe("payload_too_large");
    expect(await tableCounts()).toEqual(before);
  });

  it("one sync change with args over the cap is refused whole (400 naming the limit); nothing stored", async () => {
    const before = await tableCounts();
    const big = { name: "Mix A", note: "x".repeat(MAX_MUTATION_ARGS_BYTES + 1) };
    const res = await attack(pushRoute, {
      user: s.team.owner,
      body: JSON.stringify({ clientId: randomUUID(), schemaVersion: SYNC_SCHEMA_VERSION, mutations: [mutation(1, s.project.id, big)] }),
    });
    expect(res.status).toBe(400);
    expect(res.json.error.message).toMatch(/too large/);
    expect(await tableCounts()).toEqual(before);
  });

  it("an owner's refused changes keep their answer but not their payload", async () => {
    const clientId = randomUUID();
    const args = { ...validBody("mix-designs"), padding: "y".repeat(MAX_MUTATION_ARGS_BYTES - 2_000) };
    const mutations = Array.from({ length: 50 }, (_, i) => mutation(i + 1, s.project.id, args));
    const res = await attack(pushRoute, { user: s.team.owner, body: JSON.stringify({ clientId, schemaVersion: SYNC_SCHEMA_VERSION, mutations }) });
    expect(res.status).toBe(200);
    expect(res.json.results.every((r: { result: string }) => r.result === "rejected")).toBe(true);
    const [{ bytes }] = (
      await db.execute(sql`select coalesce(sum(pg_column_size(args)), 0)::int as bytes from sync_mutations where client_id = ${clientId}`)
    ).rows as { bytes: number }[];
    // 50 empty objects, not 50 × 14 KB [common practice: store what was validated, not what was sent]
    expect(bytes).toBeLessThan(50 * 64);
  });

  it("a change naming a project that does not exist is refused and stored with no project (foreign key holds)", async () => {
    const clientId = randomUUID();
    const ghost = randomUUID();
    const res = await attack(pushRoute, {
      user: s.team.office,
      body: JSON.stringify({ clientId, schemaVersion: SYNC_SCHEMA_VERSION, mutations: [mutation(1, ghost, validBody("mix-designs"))] }),
    });
    expect(res.status).toBe(200);
    expect(res.json.results[0]).toMatchObject({ result: "rejected", reason: "not_found" });
    const rows = await db.select().from(syncMutations).where(eq(syncMutations.clientId, clientId));
    expect(rows).toHaveLength(1);
    expect(rows[0].projectId).toBeNull();
    // The database itself refuses a dangling project id now. [PostgreSQL docs: SQLSTATE 23503 foreign_key_violation]
    await expect(
      db.execute(sql`update sync_mutations set project_id = ${ghost} where client_id = ${clientId}`),
    ).rejects.toMatchObject({ cause: { code: "23503" } });
  });
});
