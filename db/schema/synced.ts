import { foreignKey, index, type AnyPgColumn } from "drizzle-orm/pg-core";
import { projects, users } from "./auth";

type SyncedKeys = { projectId: AnyPgColumn; changeSeq: AnyPgColumn; updatedBy: AnyPgColumn };

/**
 * The constraints every synced table shares: its project and last writer as foreign keys, and the
 * (projectId, changeSeq) index a pull pages over ("everything of this project since N").
 */
export function syncedConstraints(table: string, t: SyncedKeys) {
  return [
    index(`${table}_project_seq_idx`).on(t.projectId, t.changeSeq),
    foreignKey({ name: `${table}_project_fk`, columns: [t.projectId], foreignColumns: [projects.id] }).onDelete("cascade"),
    foreignKey({ name: `${table}_updated_by_fk`, columns: [t.updatedBy], foreignColumns: [users.id] }),
  ];
}
