"use client";

// The project the field screens work on, as last pulled to this device: the selected project, the
// project list, the unit system and whether the person's role may write.
import { useLiveQuery } from "dexie-react-hooks";
import { createContext, useContext } from "react";
import { can, type Action } from "@/lib/auth/can";
import type { ProjectRole } from "@/lib/auth/roles";
import type { UnitSystem } from "@/lib/concrete";
import { listProjects, type ProjectRow } from "@/lib/sync/client";
import { useOptionalSyncDb } from "@/lib/sync/client/react";

export type FieldContextValue = { selectedProjectId: string | null; selectProject: (id: string | null) => void };
export const FieldContext = createContext<FieldContextValue>({ selectedProjectId: null, selectProject: () => {} });
export const useFieldContext = () => useContext(FieldContext);

/** The projects the user is on, as last pulled to this device (undefined while loading). */
export function useProjects(): ProjectRow[] | undefined {
  const db = useOptionalSyncDb();
  return useLiveQuery(async () => (db ? (await listProjects(db)).sort((a, b) => a.name.localeCompare(b.name)) : []), [db]);
}

export function useProject(projectId: string | null | undefined): ProjectRow | undefined {
  const projects = useProjects();
  return projects?.find((p) => p.id === projectId);
}

/** Whether the user's role on the project may write with `action` (the office may correct any unsigned record). */
export function mayWrite(project: ProjectRow | undefined, action: Action): boolean {
  const role = (project?.role ?? null) as ProjectRole | null;
  if (!role) return false;
  return can({ isAdmin: false }, action, role) || can({ isAdmin: false }, "record.correct", role);
}

export const unitSystemOf = (project: ProjectRow | undefined): UnitSystem => (project?.unitSystem === "IP" ? "IP" : "SI");
