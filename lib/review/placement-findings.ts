// The rulebook's cautions and warnings about one placement, judged on the server: every record of
// the placement whatever day it was made, and the day-level findings (cold or hot weather) of its
// planned date, as the review table counts them. The placement review page and the sign-off (what
// the signer must acknowledge) both read it here.
import { and, eq, inArray } from "drizzle-orm";
import type { Executor } from "@/db";
import { breaks, mixDesigns, projects } from "@/db/schema";
import { attention, evaluate, findingKey, toCheckInput, type Finding } from "@/lib/checks";
import { dayFindings, loadCheckDay } from "@/lib/findings/load";
import { localDate } from "@/lib/time/zone";
import type { PlacementSnapshot } from "@/lib/signoff/snapshot";

type Row = Record<string, unknown>;
type Project = typeof projects.$inferSelect;

export async function placementWarnings(tx: Executor, project: Project, snapshot: PlacementSnapshot): Promise<Finding[]> {
  const placement = snapshot.placement as Row;
  const mixId = placement.mixId as string | null;
  const [mix] = mixId ? await tx.select().from(mixDesigns).where(and(eq(mixDesigns.id, mixId), eq(mixDesigns.projectId, project.id))) : [];
  const setIds = snapshot.children["specimen-sets"].map((s) => s.id as string);
  const breaksOfSets = setIds.length ? await tx.select().from(breaks).where(and(eq(breaks.projectId, project.id), inArray(breaks.specimenSetId, setIds))) : [];
  const date = localDate(placement.plannedStart as Date, project.timeZone);
  const dayLevel = dayFindings(await loadCheckDay(tx, project, date), date).filter((f) => f.subject.type === "day");
  return attention([
    ...dayLevel,
    ...evaluate(
      toCheckInput({
        project,
        mixes: mix ? [mix] : [],
        placements: [placement],
        deliveries: snapshot.children.deliveries,
        fieldTests: snapshot.children["field-tests"],
        weather: snapshot.children["weather-observations"],
        curing: snapshot.children["curing-readings"],
        specimenSets: snapshot.children["specimen-sets"],
        breaks: breaksOfSets,
      }),
    ),
  ]);
}

/** What the signer acknowledges: the finding's identity across surfaces and the words they saw. */
export type Acknowledgement = { key: string; title: string };

export const acknowledgementOf = (f: Finding): Acknowledgement => ({ key: findingKey(f), title: f.title });
