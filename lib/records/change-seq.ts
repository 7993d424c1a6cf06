import { eq, sql } from "drizzle-orm";
import type { Executor } from "@/db";
import { projectChangeCounters } from "@/db/schema";

/**
 * The next change sequence number of a project (SYNC.md "Change sequence"). Call it inside the
 * write transaction: the UPDATE keeps the counter row locked until commit, so a second writer of
 * the same project waits, and rows become visible to `changeSeq > cursor` pulls in number order.
 * (A plain Postgres sequence hands out numbers in start order, and a slow transaction's row would
 * appear behind a cursor that has already moved past it.)
 */
export async function nextChangeSeq(tx: Executor, projectId: string): Promise<number> {
  await tx.insert(projectChangeCounters).values({ projectId, lastSeq: 0 }).onConflictDoNothing();
  const [row] = await tx
    .update(projectChangeCounters)
    .set({ lastSeq: sql`${projectChangeCounters.lastSeq} + 1` })
    .where(eq(projectChangeCounters.projectId, projectId))
    .returning({ lastSeq: projectChangeCounters.lastSeq });
  return Number(row.lastSeq);
}
