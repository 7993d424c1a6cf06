// Finding 13: a mix could change after sign-off, and so change the acceptance of a signed
// placement (its slump tolerance, its f'c). The attacks: the office edits or removes the mix of a
// signed placement through the records API and through a sync push, and rewrites it with plain SQL
// on the app's connection. Each is refused with a message that says what to do instead; the mix row
// is unchanged. A mix no signed placement uses is still edited as before.
// [PostgreSQL docs 41.10 "Trigger Functions": BEFORE row triggers that raise abort the statement]
import { randomUUID } from "node:crypto";
import { eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { DELETE as deleteRoute, PATCH as patchRoute } from "@/app/api/projects/[projectId]/records/[type]/[id]/route";
import { POST as pushRoute } from "@/app/api/sync/push/route";
import { db } from "@/db";
import { mixDesigns } from "@/db/schema";
import { MIX_FROZEN_MESSAGE } from "@/lib/records/db-errors";
import { SYNC_SCHEMA_VERSION } from "@/lib/sync/protocol";
import { callRoute } from "../integration/helpers";
import { makeRecord } from "../integration/record-fixtures";
import { tableCounts } from "./attack";
import { signedPlacement, teamWithPasswords, type Setup } from "./fixtures";

let s: Setup;
let mixId: string;
const mixRow = async (id = mixId) => (await db.select().from(mixDesigns).where(eq(mixDesigns.id, id)))[0];
const params = (id = mixId) => ({ projectId: s.project.id, type: "mix-designs", id });

beforeAll(async () => {
  s = await teamWithPasswords();
  mixId = (await makeRecord("mix-designs", s.project.id, s.team)).id;
  await signedPlacement(s, { mixId });
});

describe("the mix of a signed placement is frozen (finding 13)", () => {
  it("an edit through the records API is refused (409, the message names the way forward); nothing changes", async () => {
    const before = await mixRow();
    const counts = await tableCounts();
    const res = await callRoute(patchRoute, { user: s.team.office, params: params(), body: { baseVersion: before.version, patch: { slumpToleranceMm: 100 } } });
    expect(res.status).toBe(409);
    expect(res.json.error.message).toBe(MIX_FROZEN_MESSAGE);
    expect(await mixRow()).toEqual(before);
    expect(await tableCounts()).toEqual(counts);
  });

  it("removing it through the records API is refused; nothing changes", async () => {
    const before = await mixRow();
    const res = await callRoute(deleteRoute, { user: s.team.office, params: params(), body: { baseVersion: before.version } });
    expect(res.status).toBe(409);
    expect(res.json.error.message).toBe(MIX_FROZEN_MESSAGE);
    expect(await mixRow()).toEqual(before);
  });

  it("an edit sent by sync is rejected with the same message", async () => {
    const before = await mixRow();
    const mutation = { id: 1, name: "update", recordType: "mix-designs", projectId: s.project.id, recordId: mixId, baseVersion: before.version, args: { patch: { fcMPa: 20 } } };
    const res = await callRoute(pushRoute, { user: s.team.office, body: { clientId: randomUUID(), schemaVersion: SYNC_SCHEMA_VERSION, mutations: [mutation] } });
    expect(res.status).toBe(200);
    expect(res.json.results[0]).toMatchObject({ result: "rejected" });
    expect(res.json.results[0].message).toBe(MIX_FROZEN_MESSAGE);
    expect(await mixRow()).toEqual(before);
  });

  it.each([
    ["loosen the slump tolerance", (id: string) => sql`update mix_designs set slump_tolerance_mm = 200 where id = ${id}`],
    ["lower f'c", (id: string) => sql`update mix_designs set fc_mpa = 10 where id = ${id}`],
    ["soft-delete it", (id: string) => sql`update mix_designs set deleted_at = now() where id = ${id}`],
    ["delete it", (id: string) => sql`delete from mix_designs where id = ${id}`],
  ])("plain SQL on the app's connection: %s is refused (PW409)", async (_name, statement) => {
    const before = await mixRow();
    await expect(db.execute(statement(mixId))).rejects.toMatchObject({ cause: { code: "PW409" } });
    expect(await mixRow()).toEqual(before);
  });

  it("a mix no signed placement uses is still edited, and a new mix can be added beside the frozen one", async () => {
    const free = await makeRecord("mix-designs", s.project.id, s.team);
    const res = await callRoute(patchRoute, { user: s.team.office, params: params(free.id), body: { baseVersion: free.version, patch: { slumpToleranceMm: 40 } } });
    expect(res.status, JSON.stringify(res.json)).toBe(200);
    expect((await mixRow(free.id)).slumpToleranceMm).toBe(40);
  });
});
