// POST /api/sync/pull (SYNC.md): what changed in the user's projects since the device's cursor,
// read in one snapshot. Change numbers are allocated per project under a row lock held to commit
// (lib/records/change-seq.ts), so within a project they become visible in order and a cursor never
// skips a row committed late.
import { and, asc, eq, gt, inArray, isNull } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { conflicts, memberships, projects, syncClients } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/options";
import { forbidden } from "@/lib/errors";
import { getRecordDef, RECORD_TYPES } from "@/lib/records/registry";
import type { RecordRow } from "@/lib/records/types";
import {
  MAX_CHANGES_PER_PULL,
  SYNC_SCHEMA_VERSION,
  type ConflictSummary,
  type Cursor,
  type PullRequest,
  type PullResponse,
  type RecordChange,
  type SyncProject,
  type SyncedRecord,
} from "../protocol";

async function userProjects(tx: Transaction, userId: string): Promise<SyncProject[]> {
  const rows = await tx
    .select({ project: projects, role: memberships.role })
    .from(memberships)
    .innerJoin(projects, eq(projects.id, memberships.projectId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(projects.name));
  return rows.map(({ project, role }) => ({ ...project, role, createdAt: undefined, updatedAt: undefined }) as SyncProject);
}

/** The next page of one project's changes across every record table, in change-number order. */
async function projectChanges(tx: Transaction, projectId: string, since: number, limit: number) {
  // One connection per transaction: the tables are read one after another.
  const pages: { recordType: (typeof RECORD_TYPES)[number]; record: RecordRow }[][] = [];
  for (const recordType of RECORD_TYPES) {
    const def = getRecordDef(recordType);
    const rows = (await tx
      .select()
      .from(def.table)
      .where(and(eq(def.table.projectId, projectId), gt(def.table.changeSeq, since)))
      .orderBy(asc(def.table.changeSeq))
      .limit(limit + 1)) as RecordRow[];
    pages.push(rows.map((record) => ({ recordType, record })));
  }
  const merged = pages.flat().sort((a, b) => a.record.changeSeq - b.record.changeSeq);
  return { changes: merged.slice(0, limit), hasMore: merged.length > limit };
}

export async function pullChanges(user: SessionUser, request: PullRequest): Promise<PullResponse> {
  const limit = request.limit ?? MAX_CHANGES_PER_PULL;
  return db.transaction(
    async (tx) => {
      const [client] = await tx.select().from(syncClients).where(eq(syncClients.id, request.clientId));
      if (client && client.userId !== user.id) {
        throw forbidden("This device id belongs to another user. Sign out and in again on this device.");
      }
      const visible = await userProjects(tx, user.id);
      const ids = new Set(visible.map((p) => p.id));
      // A first pull, another schema, or a project the user has lost: start again from a snapshot.
      const reset =
        request.cursor === null ||
        request.schemaVersion !== SYNC_SCHEMA_VERSION ||
        Object.keys(request.cursor).some((projectId) => !ids.has(projectId));
      const cursor: Cursor = reset ? {} : { ...request.cursor };

      const changes: RecordChange[] = [];
      let hasMore = false;
      for (const project of visible) {
        const page = await projectChanges(tx, project.id, cursor[project.id] ?? 0, limit);
        hasMore ||= page.hasMore;
        for (const change of page.changes) changes.push(change as unknown as RecordChange);
        const last = page.changes.at(-1);
        cursor[project.id] = last ? last.record.changeSeq : (cursor[project.id] ?? 0);
      }

      const open = ids.size
        ? await tx
            .select()
            .from(conflicts)
            .where(and(inArray(conflicts.projectId, [...ids]), eq(conflicts.createdBy, user.id), isNull(conflicts.resolvedAt)))
            .orderBy(asc(conflicts.createdAt))
        : [];

      return {
        reset,
        cursor,
        hasMore,
        changes: changes.map((c) => ({ recordType: c.recordType, record: c.record as SyncedRecord })),
        projects: visible,
        conflicts: open.map(
          (c): ConflictSummary => ({
            id: c.id,
            projectId: c.projectId,
            recordType: c.recordType,
            recordId: c.recordId,
            baseVersion: c.baseVersion,
            serverVersion: c.serverVersion,
            clientPayload: c.clientPayload,
            serverPayload: c.serverPayload,
            reason: c.reason,
            createdAt: c.createdAt.toISOString(),
          }),
        ),
        lastMutationId: client?.lastMutationId ?? 0,
      };
    },
    { isolationLevel: "repeatable read", accessMode: "read only" },
  );
}
