// The lab queue: every planned test age of every specimen set in the user's projects, by due date.
import { and, eq, inArray, isNull, sql } from "drizzle-orm";
import { db } from "@/db";
import { breaks, mixDesigns, placements, specimenSets } from "@/db/schema";
import { parseOrThrow } from "@/lib/validation";
import { readableProjects } from "@/lib/projects/readable";
import { can } from "@/lib/auth/can";
import type { SessionUser } from "@/lib/auth/options";
import { dueAt, dueStatus, testWindow, type DueStatus } from "./due";
import { queueQuerySchema } from "./schemas";

export type QueueItem = {
  key: string;
  projectId: string;
  projectName: string;
  unitSystem: "SI" | "IP";
  timeZone: string;
  specimenSetId: string;
  setCode: string;
  placementId: string;
  placementElement: string;
  mixCode: string | null;
  cylinderDiameterMm: number;
  castAt: string;
  ageDays: number;
  dueAt: string;
  windowClosesAt: string;
  status: DueStatus;
  brokenCount: number;
  /** Average strength of the cylinders broken at this age, MPa (null before any). */
  averageMPa: number | null;
};

export type LabQueue = {
  projects: { id: string; name: string; canEnterBreaks: boolean }[];
  items: QueueItem[];
};

/**
 * Due tests across the projects the user belongs to (or one of them), ordered by due date, then
 * set code. `now` decides overdue (ASTM C39 age tolerance; see ./due.ts).
 */
export async function listLabQueue(user: SessionUser, query: unknown, now = new Date()): Promise<LabQueue> {
  const q = parseOrThrow(queueQuerySchema, query ?? {});
  const readable = await readableProjects(user);
  // A project the user is not a member of is simply not in the queue (nothing about it leaks).
  const scope = readable.filter((p) => !q.projectId || p.id === q.projectId);
  const result: LabQueue = {
    projects: readable.map((p) => ({ id: p.id, name: p.name, canEnterBreaks: can(user, "break.write", p.role) })),
    items: [],
  };
  if (scope.length === 0) return result;
  const projectIds = scope.map((p) => p.id);
  const byProject = new Map(scope.map((p) => [p.id, p]));
  const sets = await db
    .select({
      id: specimenSets.id,
      projectId: specimenSets.projectId,
      setCode: specimenSets.setCode,
      castAt: specimenSets.castAt,
      testAgesDays: specimenSets.testAgesDays,
      cylinderDiameterMm: specimenSets.cylinderDiameterMm,
      placementId: placements.id,
      placementElement: placements.element,
      mixCode: mixDesigns.code,
    })
    .from(specimenSets)
    .innerJoin(placements, and(eq(placements.id, specimenSets.placementId), eq(placements.projectId, specimenSets.projectId)))
    .leftJoin(mixDesigns, eq(mixDesigns.id, placements.mixId))
    .where(and(inArray(specimenSets.projectId, projectIds), isNull(specimenSets.deletedAt), isNull(placements.deletedAt)));
  const tallies = sets.length
    ? await db
        .select({
          specimenSetId: breaks.specimenSetId,
          ageDays: breaks.ageDays,
          n: sql<number>`count(*)::int`,
          avg: sql<number>`avg(${breaks.strengthMPa})::float8`,
        })
        .from(breaks)
        .where(and(inArray(breaks.projectId, projectIds), isNull(breaks.deletedAt)))
        .groupBy(breaks.specimenSetId, breaks.ageDays)
    : [];
  const tally = new Map(tallies.map((t) => [`${t.specimenSetId}:${t.ageDays}`, t]));
  for (const s of sets) {
    const project = byProject.get(s.projectId)!;
    for (const ageDays of [...s.testAgesDays].sort((a, b) => a - b)) {
      const t = tally.get(`${s.id}:${ageDays}`);
      const brokenCount = t?.n ?? 0;
      const status = dueStatus(s.castAt, ageDays, brokenCount, now);
      if (q.status && !q.status.includes(status)) continue;
      result.items.push({
        key: `${s.id}:${ageDays}`,
        projectId: s.projectId,
        projectName: project.name,
        unitSystem: project.unitSystem,
        timeZone: project.timeZone,
        specimenSetId: s.id,
        setCode: s.setCode,
        placementId: s.placementId,
        placementElement: s.placementElement,
        mixCode: s.mixCode,
        cylinderDiameterMm: s.cylinderDiameterMm,
        castAt: s.castAt.toISOString(),
        ageDays,
        dueAt: dueAt(s.castAt, ageDays).toISOString(),
        windowClosesAt: testWindow(s.castAt, ageDays).closesAt.toISOString(),
        status,
        brokenCount,
        averageMPa: t?.avg ?? null,
      });
    }
  }
  result.items.sort((a, b) => a.dueAt.localeCompare(b.dueAt) || a.setCode.localeCompare(b.setCode));
  return result;
}
