import { sql } from "drizzle-orm";
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
  return reserveChangeSeqs(tx, projectId, 1);
}

/** Reserves `count` consecutive change numbers of a project (same lock as above); returns the first. */
export async function reserveChangeSeqs(tx: Executor, projectId: string, count: number): Promise<number> {
  // One statement: the first writer of a project creates its counter; either way the row stays locked.
  const [row] = await tx
    .insert(projectChangeCounters)
    .values({ projectId, lastSeq: count })
    .onConflictDoUpdate({ target: projectChangeCounters.projectId, set: { lastSeq: sql`${projectChangeCounters.lastSeq} + ${count}` } })
    .returning({ lastSeq: projectChangeCounters.lastSeq });
  return Number(row.lastSeq) - count + 1;
}
