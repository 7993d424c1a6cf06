// The signer acknowledges each caution and warning the rulebook raises on the placement before
// signing. The server judges the placement itself (lib/review/placement-findings.ts) and refuses a
// signature that leaves one unacknowledged, so a device that missed a finding cannot skip it.
import type { Executor } from "@/db";
import type { Project } from "@/lib/auth/access";
import { conflict, notFound } from "@/lib/errors";
import { loadProject } from "@/lib/findings/load";
import { acknowledgementOf, placementWarnings, type Acknowledgement } from "@/lib/review/placement-findings";
import { placementSnapshot, type PlacementSnapshot } from "./snapshot";

/** What the signer must acknowledge now, most severe first (GET before the dialog opens). */
export async function findingsToAcknowledge(tx: Executor, project: Project, placementId: string) {
  const snapshot = await placementSnapshot(tx, project.id, placementId);
  if (!snapshot.placement || snapshot.placement.deletedAt) throw notFound("Placement");
  return { findings: await placementWarnings(tx, project, snapshot) };
}

/** Inside the sign-off transaction: every current finding acknowledged, or a 409 naming what is not. */
export async function assertAcknowledged(tx: Executor, projectId: string, snapshot: PlacementSnapshot, acknowledged: string[]): Promise<Acknowledgement[]> {
  const findings = (await placementWarnings(tx, await loadProject(tx, projectId), snapshot)).map(acknowledgementOf);
  const given = new Set(acknowledged);
  const missing = findings.filter((f) => !given.has(f.key));
  if (missing.length) {
    throw conflict(`Acknowledge each warning before signing: ${missing.map((m) => m.title).join("; ")}.`, {
      reason: "unacknowledged",
      findings: missing.map((m) => m.key),
    });
  }
  return findings;
}
