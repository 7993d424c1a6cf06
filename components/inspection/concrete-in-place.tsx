"use client";

// How much concrete a placement already has, in the project's units: a hold on work with trucks on it
// stops the rest of the pour, not what is already in the forms, and the people deciding need the figure.
import { useLiveQuery } from "dexie-react-hooks";
import { unitSystemOf } from "@/components/field/field-project";
import { formatVolume } from "@/lib/concrete";
import { listByParent, type LocalRecord, type ProjectRow } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";

export function ConcreteInPlace({ placement, project, className }: { placement: LocalRecord<"placements">; project: ProjectRow; className?: string }) {
  const db = useSyncDb();
  const placed = useLiveQuery(async () => {
    const trucks = (await listByParent(db, "deliveries", "placementId", placement.id)).filter((d) => d.status !== "rejected" && !d.deletedAt);
    return { trucks: trucks.length, volumeM3: trucks.reduce((sum, d) => sum + (d.volumeM3 ?? 0), 0) };
  }, [db, placement.id]);
  if (!placed || placed.trucks === 0) return null;
  return (
    <p className={className ?? "mt-1 text-base font-semibold text-ink-950"} data-testid="concrete-in-place">
      Already on this placement: {formatVolume(placed.volumeM3, unitSystemOf(project))} from {placed.trucks} {placed.trucks === 1 ? "truck" : "trucks"}. Say what
      happens to it (left in place, tested, removed) with the engineer of record.
    </p>
  );
}
