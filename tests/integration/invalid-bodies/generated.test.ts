// ≥ 1,000 generated invalid bodies sent to the write routes: each a 400 naming a field, no 5xx, no row changed.
import fc from "fast-check";
import { beforeAll, describe, expect, it } from "vitest";
import { POST as transitionRoute } from "@/app/api/projects/[projectId]/placements/[id]/transition/route";
import { PATCH } from "@/app/api/projects/[projectId]/records/[type]/[id]/route";
import { POST } from "@/app/api/projects/[projectId]/records/[type]/route";
import { type RecordType } from "@/lib/records/registry";
import type { RecordRow } from "@/lib/records/types";
import { callRoute, projectWithTeam } from "../helpers";
import { makeRecord, RECORD_TYPES, validBody, WRITER } from "../record-fixtures";
import { notString, badValue, MISSING, mutations, CROSS, counts, expect400 } from "./generators";

describe("invalid bodies", () => {
  let s: Awaited<ReturnType<typeof projectWithTeam>>;
  const existing = {} as Record<RecordType, RecordRow>;
  let sent = 0;

  beforeAll(async () => {
    s = await projectWithTeam();
    for (const type of RECORD_TYPES) existing[type] = await makeRecord(type, s.project.id, s.team);
  });

  it("≥ 1,000 generated invalid bodies: each a 400 naming a field, no 5xx, no row changed", async () => {
    const before = await counts();
    for (const type of RECORD_TYPES) {
      const user = s.team[WRITER[type]];
      const params = { projectId: s.project.id, type };
      const parentId = "0b7d2a51-5c1e-4f0a-9a55-0000000000ff"; // never reached: validation comes first

      await fc.assert(
        fc.asyncProperty(mutations(type, "create"), async (muts) => {
          const body: Record<string, unknown> = validBody(type, parentId);
          for (const { field, value } of muts) {
            if (value === MISSING) delete body[field];
            else body[field] = value;
          }
          sent++;
          expect400(await callRoute(POST, { user, params, body }), muts.map((m) => m.field));
        }),
        { numRuns: 40 },
      );

      const record = existing[type];
      await fc.assert(
        fc.asyncProperty(
          fc.oneof(
            { weight: 5, arbitrary: mutations(type, "patch").map((muts) => ({ body: { baseVersion: 1, patch: Object.fromEntries(muts.map((m) => [m.field, m.value])) }, fields: muts.map((m) => m.field) })) },
            { weight: 1, arbitrary: fc.oneof(fc.constant(0), fc.constant(1.5), fc.constant("1"), fc.constant(null), fc.constant(-3)).map((v) => ({ body: { baseVersion: v, patch: {} }, fields: ["baseVersion"] })) },
            { weight: 1, arbitrary: fc.oneof(fc.constant(null), fc.constant([]), fc.constant("grid=Z"), fc.constant(7)).map((v) => ({ body: { baseVersion: 1, patch: v }, fields: ["patch"] })) },
          ),
          async ({ body, fields }) => {
            sent++;
            expect400(await callRoute(PATCH, { user, method: "PATCH", params: { ...params, id: record.id }, body }), fields);
          },
        ),
        { numRuns: 30 },
      );

      for (const cross of CROSS[type] ?? []) {
        sent++;
        expect400(await callRoute(POST, { user, params, body: { ...validBody(type, existing[type].placementId as string), ...cross.body } }), [cross.field]);
      }
    }

    const placement = existing.placements;
    await fc.assert(
      fc.asyncProperty(
        fc.oneof(
          fc.record({ to: badValue({ k: "enum", values: ["planned", "ready", "cleared", "placing", "placed", "signed", "held"], required: true }), baseVersion: fc.constant(1) }).map((body) => ({ body, field: "to" })),
          fc.record({ to: fc.constant("ready"), baseVersion: badValue({ k: "num", min: 1, max: 1e9, int: true, required: true }) }).map((body) => ({ body, field: "baseVersion" })),
          fc.record({ to: fc.constant("held"), baseVersion: fc.constant(1), reason: fc.constantFrom(undefined, "", "   ") }).map((body) => ({ body, field: "reason" })),
          fc.record({ to: fc.constant("held"), baseVersion: fc.constant(1), reason: notString }).map((body) => ({ body, field: "reason" })),
        ),
        async ({ body, field }) => {
          sent++;
          expect400(await callRoute(transitionRoute, { user: s.team.inspector, params: { projectId: s.project.id, id: placement.id }, body }), [field]);
        },
      ),
      { numRuns: 60 },
    );

    expect(sent).toBeGreaterThanOrEqual(1_000);
    expect(await counts()).toEqual(before);
  }, 120_000);

});
