// The stored findings after set-based sync pushes (lib/records/create-batch.ts, lib/findings): trucks
// and curing readings pushed in batches are judged on their own, so after every push the stored
// findings must be exactly what judging every day of the project whole gives (refreshProject, the
// day loader of lib/findings/load.ts, is the reference) [common practice: compare the fast path with
// the plain one]. Random projects, placements with and without a strength mix and cylinders, and
// trucks around midnight (a night pour's findings fall on the next day) (fast-check).
import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { checkFindings, projects } from "@/db/schema";
import { refreshProject } from "@/lib/findings/store";
import { createRecord } from "@/lib/records/write";
import { SYNC_SCHEMA_VERSION, type Mutation } from "@/lib/sync/protocol";
import { pushMutations } from "@/lib/sync/server/push";
import { projectWithTeam } from "./helpers";

// A past evening in Chicago (CST, UTC−6): times in the future are refused by the record schemas.
const T = (minutes: number) => new Date(Date.parse("2026-01-15T22:00:00-06:00") + minutes * 60_000).toISOString();

const truckArb = fc.record({
  start: fc.constantFrom(-600, 0, 90, 150),
  finish: fc.constantFrom(null, 60, 95, 130),
  revolutions: fc.constantFrom(null, 250, 310),
  water: fc.constantFrom(null, 30, 100),
  rejected: fc.boolean(),
  mixCode: fc.constantFrom(null, "same", "other"),
  onSecond: fc.boolean(),
});
const caseArb = fc.record({
  unitSystem: fc.constantFrom("SI" as const, "IP" as const),
  dischargeLimitMinutes: fc.constantFrom(90, 60),
  revolutionLimit: fc.constantFrom(null, 300),
  strengthMix: fc.boolean(),
  cylinders: fc.boolean(),
  // The placement's planned start: the evening of the pour, or the morning before.
  plannedAt: fc.constantFrom(0, -720),
  // The placements created in the first push, ahead of their trucks, or written before.
  placementsInPush: fc.boolean(),
  pushes: fc.array(
    fc.record({
      trucks: fc.array(truckArb, { minLength: 1, maxLength: 6 }),
      curing: fc.array(fc.constantFrom(5, 12, 20), { maxLength: 2 }),
    }),
    { minLength: 1, maxLength: 3 },
  ),
});

type Stored = typeof checkFindings.$inferSelect;
/** Rolls the reference's transaction back, carrying what it read. */
class PutBack extends Error {
  constructor(readonly rows: Stored[]) {
    super("put back");
  }
}
const comparable = (rows: Stored[]) =>
  rows
    .map((r) => JSON.stringify([r.placementId, r.localDate, r.rule, r.severity, r.subjectType, r.subjectId, r.title, r.message, r.appliedValue, r.appliedLimit, r.appliedUnit, r.source]))
    .sort();

describe("stored findings after set-based pushes", () => {
  it("equal judging every day whole, after every push", async () => {
    let withFindings = 0;
    await fc.assert(
      fc.asyncProperty(caseArb, async (c) => {
        const { project, team } = await projectWithTeam();
        await db
          .update(projects)
          .set({ unitSystem: c.unitSystem, dischargeLimitMinutes: c.dischargeLimitMinutes, revolutionLimit: c.revolutionLimit })
          .where(eq(projects.id, project.id));
        const mix = c.strengthMix
          ? await createRecord({ user: team.office }, "mix-designs", project.id, {
              id: randomUUID(), code: `PF-${project.code}`, fcMPa: 27.6, fcAgeDays: 28, slumpTargetMm: 100, slumpType: "target", airTargetPct: 6, siteWaterAllowedLPerM3: 10,
            })
          : null;
        const placementBodies = ["Deck A", "Deck B"].map((element) => ({
          id: randomUUID(), element, elementType: "elevated-slab", leastDimensionMm: 250, plannedVolumeM3: 40, plannedStart: T(c.plannedAt), mixId: mix?.record.id ?? null,
        }));
        const placementIds = placementBodies.map((b) => b.id);
        if (!c.placementsInPush) {
          for (const body of placementBodies) await createRecord({ user: team.superintendent }, "placements", project.id, body);
        }
        if (c.cylinders && !c.placementsInPush) {
          await createRecord({ user: team.inspector }, "specimen-sets", project.id, {
            id: randomUUID(), placementId: placementIds[0], setCode: `PF-${project.code}`, cylinderDiameterMm: 150, cylinderLengthMm: 300, count: 4, castAt: T(30), testAgesDays: [28],
          });
        }
        const clientId = randomUUID();
        let next = 1;
        for (const [p, batch] of c.pushes.entries()) {
          const mutations: Mutation[] = [];
          const add = (recordType: Mutation["recordType"], args: Record<string, unknown>) =>
            mutations.push({ id: next++, name: "create", recordType, projectId: project.id, recordId: args.id as string, args });
          if (p === 0 && c.placementsInPush) for (const body of placementBodies) add("placements", body);
          for (const [k, d] of batch.trucks.entries()) {
            const b = d.start + p * 7 + k;
            add("deliveries", {
              id: randomUUID(), placementId: placementIds[d.onSecond ? 1 : 0], ticketNumber: `PF-${p}-${k}`, truck: String(10 + k), volumeM3: 8,
              mixCode: d.mixCode === null ? null : d.mixCode === "same" ? `pf ${project.code}` : "LC-5000-B",
              batchedAt: T(b), arrivedAt: T(b + 25), dischargeStartedAt: T(b + 30),
              dischargeFinishedAt: d.finish === null ? null : T(b + d.finish), revolutions: d.revolutions,
              ...(d.water === null ? {} : { waterAddedL: d.water, waterFirstAt: T(b + 26), waterLastAt: T(b + 40), waterAddedBy: "Driver", waterAuthorisedBy: "Sam" }),
              ...(d.rejected ? { status: "rejected", rejectReason: "Too hot" } : {}),
            });
          }
          for (const [k, tempC] of batch.curing.entries()) {
            add("curing-readings", { id: randomUUID(), placementId: placementIds[0], method: "Blankets", readAt: T(200 + p * 60 + k), tempC, location: "Edge" });
          }
          const response = await pushMutations(team.superintendent, { clientId, schemaVersion: SYNC_SCHEMA_VERSION, mutations });
          expect(response.results.map((r) => r.result)).toEqual(mutations.map(() => "applied"));

          const stored = await db.select().from(checkFindings).where(eq(checkFindings.projectId, project.id));
          // The reference: every day of the project judged again whole, then put back as it was.
          const whole = await db
            .transaction(async (tx) => {
              await refreshProject(tx, project.id);
              throw new PutBack(await tx.select().from(checkFindings).where(eq(checkFindings.projectId, project.id)));
            })
            .catch((error: unknown) => {
              if (error instanceof PutBack) return error.rows;
              throw error;
            });
          expect(comparable(stored)).toEqual(comparable(whole));
          if (stored.length) withFindings += 1;
        }
      }),
      { numRuns: 12, seed: 20 },
    );
    // The random cases cover pushes that store findings (and so can disagree).
    expect(withFindings).toBeGreaterThan(0);
  });
});
