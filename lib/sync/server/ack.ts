import { and, eq, sql } from "drizzle-orm";
import { db } from "@/db";
import { syncClients } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/options";

/**
 * The device says (on pull) the highest mutation id it has dropped from its outbox: it will never
 * send those again, so their stored results may be pruned (lib/housekeeping/prune.ts). Never moves
 * back and never past what the server applied; a device of another user changes nothing.
 */
export async function recordAck(user: SessionUser, clientId: string, ackedMutationId: number | undefined): Promise<void> {
  if (!ackedMutationId) return;
  await db
    .update(syncClients)
    .set({ ackedMutationId: sql`greatest(${syncClients.ackedMutationId}, least(${ackedMutationId}, ${syncClients.lastMutationId}))` })
    .where(and(eq(syncClients.id, clientId), eq(syncClients.userId, user.id)));
}
