// Benches write into a throwaway database and remove what they made. The audit trail is append-only
// in the database (migration 0014), so its rows go first, in a transaction with the triggers off
// (session_replication_role: the local cluster owner's superuser right, never the app's role);
// then the projects and users are deleted as usual, their records going by the foreign keys'
// cascades. Where that is refused, the rows stay, named "Bench …".
import { inArray, or, sql } from "drizzle-orm";
import type { Database } from "../../db/index.ts";
import { auditEntries, projects, users } from "../../db/schema/index.ts";

export async function deleteBenchRows(db: Database, projectIds: string[], userIds: string[]): Promise<void> {
  try {
    await db.transaction(async (tx) => {
      await tx.execute(sql`set local session_replication_role = replica`);
      await tx.delete(auditEntries).where(or(inArray(auditEntries.projectId, projectIds), inArray(auditEntries.userId, userIds)));
    });
    await db.delete(projects).where(inArray(projects.id, projectIds));
    await db.delete(users).where(inArray(users.id, userIds));
  } catch (error) {
    console.warn(`bench rows left in the database: ${(error as Error).message.split("\n")[0]}`);
  }
}
