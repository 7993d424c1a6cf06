// What a set-based push of 100 trucks costs in statements (lib/sync/server/push.ts,
// lib/records/create-batch.ts, lib/findings/created.ts), counted on the driver: the same on an empty
// day as on a day that already holds 500 trucks of the same placement, since new trucks are judged
// on their own and their days are not read again [common practice: count round trips, do not guess].
import { randomUUID } from "node:crypto";
import { describe, expect, it } from "vitest";
import { SYNC_SCHEMA_VERSION, type Mutation } from "@/lib/sync/protocol";
import { pushMutations } from "@/lib/sync/server/push";
import { projectWithTeam } from "./helpers";
import { validBody } from "./record-fixtures";
import { countStatements as counted } from "./statement-count";

describe("sync push cost", () => {
  it("a push of 100 trucks sends the same few statements on an empty day and on a day of 500 trucks", async () => {
    const { project, team } = await projectWithTeam();
    const placement = validBody("placements");
    const clientId = randomUUID();
    let next = 1;
    const push = (mutations: Mutation[]) => pushMutations(team.superintendent, { clientId, schemaVersion: SYNC_SCHEMA_VERSION, mutations });
    const create = (recordType: Mutation["recordType"], args: Record<string, unknown>): Mutation => ({
      id: next++,
      name: "create",
      recordType,
      projectId: project.id,
      recordId: args.id as string,
      args,
    });
    const trucks = () => Array.from({ length: 100 }, () => create("deliveries", validBody("deliveries", placement.id as string)));
    await push([create("placements", placement)]);

    const first = await counted(() => push(trucks()));
    for (let k = 0; k < 5; k++) await push(trucks());
    const later = await counted(() => push(trucks()));

    for (const { value } of [first, later]) expect(value.results.every((r) => r.result === "applied")).toBe(true);
    // begin; the device row; the roles; the rows the checks read (one statement); the change
    // numbers; the trucks; their audit entries; the stored results with the watermark; commit.
    expect(first.statements).toBeLessThanOrEqual(9);
    expect(later.statements).toBe(first.statements);
  });
});
