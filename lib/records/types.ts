import type { Executor } from "@/db";
import type { AccessSource } from "@/lib/auth/access";

/**
 * Who is writing, with their access resolved once (the door's, or the sync push's per project),
 * from which device, and optionally the transaction to write in. The sync push passes its
 * per-mutation transaction; every write then runs in a savepoint inside it, so a refused write
 * rolls back alone and the push can record it as rejected.
 */
export type RecordContext = AccessSource & { deviceId?: string | null; tx?: Executor };

/** The fields every synced record has; the rest depend on the type (see db/schema). */
export type SyncedFields = {
  id: string;
  projectId: string;
  version: number;
  changeSeq: number;
  createdAt: Date;
  updatedAt: Date;
  updatedBy: string | null;
  deletedAt: Date | null;
};
export type RecordRow = SyncedFields & Record<string, unknown>;
