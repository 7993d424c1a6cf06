// Cases the sync convergence property (property.test.ts) found, kept as plain examples.
import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { conflicts } from "@/db/schema";
import { SYNC_SCHEMA_VERSION, type Mutation } from "@/lib/sync/protocol";
import { pullChanges } from "@/lib/sync/server/pull";
import { pushMutations } from "@/lib/sync/server/push";
import { addMembership, createProject, createUser, type TestUser } from "../helpers";
import { validBody } from "../record-fixtures";

describe("sync convergence: cases the property found", () => {
  it("keeping the server's values closes a conflict on a record deleted meanwhile", async () => {
    // Found by the property (seeds 1 and 4, 60 runs, before the fix): the office deletes a placement while the field, offline, edits its
    // grid; the edit is kept as a conflict (reason "deleted"). Answering it with "keep the server's
    // version" (an empty patch) must close it, or it shows on every pull for ever.
    const project = await createProject();
    const field = await createUser({ name: `field ${project.code}` });
    const office = await createUser({ name: `office ${project.code}` });
    await addMembership(field.id, project.id, "superintendent");
    await addMembership(office.id, project.id, "office");
    const [fieldDevice, officeDevice] = [randomUUID(), randomUUID()];
    const send = (user: TestUser, clientId: string, mutations: Mutation[]) =>
      pushMutations(user, { clientId, schemaVersion: SYNC_SCHEMA_VERSION, mutations });
    const body = validBody("placements");
    const base = { recordType: "placements" as const, projectId: project.id, recordId: body.id as string };

    await send(field, fieldDevice, [{ ...base, id: 1, name: "create", args: body }]);
    await send(office, officeDevice, [{ ...base, id: 1, name: "delete", args: {}, baseVersion: 1 }]);
    const edit = await send(field, fieldDevice, [{ ...base, id: 2, name: "update", args: { patch: { grid: "B-C/2-3" } }, baseVersion: 1 }]);
    expect(edit.results[0]).toMatchObject({ result: "conflict", reason: "deleted" });
    const conflictId = edit.results[0].conflictId!;
    const shown = await pullChanges(field, { clientId: fieldDevice, schemaVersion: SYNC_SCHEMA_VERSION, cursor: null });
    expect(shown.conflicts.map((c) => c.id)).toEqual([conflictId]);

    const answer = await send(field, fieldDevice, [{ ...base, id: 3, name: "resolve", args: { conflictId, patch: {} }, baseVersion: 2 }]);
    expect(answer.results[0]).toMatchObject({ result: "applied", version: 2 });
    const [closed] = await db.select().from(conflicts).where(eq(conflicts.id, conflictId));
    expect(closed.resolvedAt).not.toBeNull();
    const after = await pullChanges(field, { clientId: fieldDevice, schemaVersion: SYNC_SCHEMA_VERSION, cursor: shown.cursor });
    expect(after.conflicts).toEqual([]);
  });
});
