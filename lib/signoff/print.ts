// The printable record of a placement: the stored rows, the sign-off with its verification and the
// amendments. Membership is checked on the access by the verification (project.read).
import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { mixDesigns } from "@/db/schema";
import type { ProjectAccess } from "@/lib/auth/access";
import { notFound } from "@/lib/errors";
import { assertUuid } from "@/lib/records/guards";
import { verifyPlacementSignOff } from "./sign-off";
import { placementSnapshot } from "./snapshot";

export async function loadPlacementPrint(access: ProjectAccess, placementId: string) {
  const { project } = access;
  const projectId = project.id;
  assertUuid(placementId, "Placement");
  const verification = await verifyPlacementSignOff(access, placementId);
  const snapshot = await placementSnapshot(db, projectId, placementId);
  if (!snapshot.placement || snapshot.placement.deletedAt) throw notFound("Placement");
  const mixId = snapshot.placement.mixId as string | null;
  const [mix] = mixId ? await db.select({ code: mixDesigns.code }).from(mixDesigns).where(and(eq(mixDesigns.projectId, projectId), eq(mixDesigns.id, mixId))) : [];
  return { project, placement: snapshot.placement, children: snapshot.children, photos: snapshot.photos, mixCode: mix?.code ?? null, verification };
}
