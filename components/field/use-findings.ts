"use client";

// The rulebook's findings for the field screens, live: the project's rows on this device, re-judged
// whenever a row changes and every half minute (a truck still discharging counts its minutes).
import { useLiveQuery } from "dexie-react-hooks";
import { useEffect, useMemo, useState } from "react";
import type { Finding } from "@/lib/checks";
import { listByProject, type ProjectRow } from "@/lib/sync/client";
import type { SyncDb } from "@/lib/sync/client/db";
import { useSyncDb } from "@/lib/sync/client/react";
import { fieldFindings, placementFindings, type FieldRecords } from "./findings-model";

const TICK_MS = 30_000;

/** The time now, renewed every half minute. */
export function useNow(): Date {
  const [now, setNow] = useState(() => new Date());
  useEffect(() => {
    const timer = setInterval(() => setNow(new Date()), TICK_MS);
    return () => clearInterval(timer);
  }, []);
  return now;
}

/** A project's rows as the rulebook reads them, from this device (each typed by its record type). */
export async function readFieldRecords(db: SyncDb, project: ProjectRow) {
  const [mixes, placements, deliveries, fieldTests, weather, curing, specimenSets, breaks] = await Promise.all([
    listByProject(db, "mix-designs", project.id),
    listByProject(db, "placements", project.id),
    listByProject(db, "deliveries", project.id),
    listByProject(db, "field-tests", project.id),
    listByProject(db, "weather-observations", project.id),
    listByProject(db, "curing-readings", project.id),
    listByProject(db, "specimen-sets", project.id),
    listByProject(db, "breaks", project.id),
  ]);
  return { project, mixes, placements, deliveries, fieldTests, weather, curing, specimenSets, breaks } satisfies FieldRecords;
}

export type FieldFindings = {
  records: FieldRecords;
  /** Every finding about the placement (or the project when no placement is named), info included. */
  findings: Finding[];
  /** Set when the rulebook could not read the records: shown, never swallowed. */
  error: string | null;
};

export function useFindings(projectId: string | undefined, placementId?: string): FieldFindings | undefined {
  const db = useSyncDb();
  const now = useNow();
  const records = useLiveQuery(async () => {
    const project = projectId ? await db.projects.get(projectId) : undefined;
    return project ? readFieldRecords(db, project) : undefined;
  }, [db, projectId]);
  return useMemo(() => {
    if (!records) return undefined;
    try {
      const all = fieldFindings(records, now);
      return { records, findings: placementId ? placementFindings(records, all, placementId) : all, error: null };
    } catch (e) {
      return { records, findings: [], error: e instanceof Error ? e.message : String(e) };
    }
  }, [records, now, placementId]);
}
