// Shared by the sync push and pull tests: a push through the route, a placement create, counts,
// the device's watermark, and a placement walked to placed.
import { eq, sql } from "drizzle-orm";
import { db } from "@/db";
import { placements, syncClients } from "@/db/schema";
import { POST as pushRoute } from "@/app/api/sync/push/route";
import { transitionPlacement } from "@/lib/placements/transition";
import { SYNC_SCHEMA_VERSION, type Mutation } from "@/lib/sync/protocol";
import { callRoute, projectWithTeam, type TestUser } from "../helpers";
import { validBody } from "../record-fixtures";

export const push = (user: TestUser, clientId: string, mutations: Mutation[]) =>
  callRoute(pushRoute, { user, body: { clientId, schemaVersion: SYNC_SCHEMA_VERSION, mutations } });

export function createPlacement(id: number, projectId: string, extra: Record<string, unknown> = {}): Mutation {
  const body = validBody("placements");
  return { id, name: "create", recordType: "placements", projectId, recordId: body.id as string, args: { ...body, ...extra } };
}

export async function countPlacements(projectId: string) {
  const r = await db.select({ n: sql<number>`count(*)::int` }).from(placements).where(eq(placements.projectId, projectId));
  return r[0].n;
}

export async function watermark(clientId: string) {
  const [c] = await db.select().from(syncClients).where(eq(syncClients.id, clientId));
  return c?.lastMutationId ?? 0;
}

/** Moves a placement to "placed" the way the crew would. */
export async function toPlaced(team: Awaited<ReturnType<typeof projectWithTeam>>["team"], projectId: string, id: string) {
  let v = 1;
  for (const [to, who] of [["ready", "superintendent"], ["cleared", "inspector"], ["placing", "superintendent"], ["placed", "superintendent"]] as const) {
    v = (await transitionPlacement({ user: team[who] }, projectId, id, { to, baseVersion: v })).version;
  }
  return v;
}
