// POST /api/sync/pull (SYNC.md): what changed in the user's projects since the device's cursor,
// read in one snapshot. Change numbers are allocated per project under a row lock held to commit
// (lib/records/change-seq.ts), so within a project they become visible in order and a cursor never
// skips a row committed late.
import { and, asc, eq, inArray, isNull, sql } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { decodeRow } from "@/db/json-rows";
import { conflicts, projectChangeCounters, projects, syncClients } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/options";
import { forbidden } from "@/lib/errors";
import { readableProjects } from "@/lib/projects/readable";
import { getRecordDef, RECORD_TYPES, type RecordType } from "@/lib/records/registry";
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

/** The projects the user may read (lib/projects/readable.ts) with each one's last change number (0 before its first write). */
async function userProjects(tx: Transaction, user: SessionUser) {
  const readable = await readableProjects(user, undefined, tx);
  if (readable.length === 0) return [];
  const roleById = new Map(readable.map((p) => [p.id, p.role]));
  const rows = await tx
    .select({ project: projects, lastSeq: projectChangeCounters.lastSeq })
    .from(projects)
    .leftJoin(projectChangeCounters, eq(projectChangeCounters.projectId, projects.id))
    .where(inArray(projects.id, [...roleById.keys()]))
    .orderBy(asc(projects.name));
  return rows.map(({ project, lastSeq }) => ({
    project: { ...project, role: roleById.get(project.id)!, createdAt: undefined, updatedAt: undefined } as SyncProject,
    lastSeq: Number(lastSeq ?? 0),
  }));
}

/**
 * The next page of one project's changes across every record table, in change-number order, in
 * ONE statement: the page's keys first (each table's (projectId, changeSeq) index, `limit + 1`
 * rows at most), then only those rows, as JSON, decoded by the ORM's own column mappers
 * (db/json-rows.ts) into the shape select() gives.
 */
async function projectChanges(tx: Transaction, projectId: string, since: number, limit: number) {
  const tables = RECORD_TYPES.map((recordType) => ({ recordType, table: getRecordDef(recordType).table }));
  const keys = tables.map(
    ({ recordType, table }) =>
      sql`(select ${recordType}::text as record_type, change_seq, id from ${table} where project_id = ${projectId} and change_seq > ${since} order by change_seq limit ${limit + 1})`,
  );
  const rows = tables.map(
    ({ recordType, table }) =>
      sql`select page.record_type, page.change_seq, row_to_json(t) as row from page join ${table} t on t.id = page.id where page.record_type = ${recordType}`,
  );
  const result = await tx.execute(sql`with page as materialized (
    select * from (${sql.join(keys, sql` union all `)}) k order by change_seq limit ${limit + 1}
  ) ${sql.join(rows, sql` union all `)} order by change_seq`);
  const found = result.rows as { record_type: RecordType; row: Record<string, unknown> }[];
  const changes = found.slice(0, limit).map((r) => ({
    recordType: r.record_type,
    record: decodeRow(getRecordDef(r.record_type).table, r.row) as RecordRow,
  }));
  return { changes, hasMore: found.length > limit };
}

export async function pullChanges(user: SessionUser, request: PullRequest): Promise<PullResponse> {
  const limit = request.limit ?? MAX_CHANGES_PER_PULL;
  return db.transaction(
    async (tx) => {
      const [client] = await tx.select().from(syncClients).where(eq(syncClients.id, request.clientId));
      if (client && client.userId !== user.id) {
        throw forbidden("This device id belongs to another user. Sign out and in again on this device.");
      }
      const counted = await userProjects(tx, user);
      const visible = counted.map((c) => c.project);
      const ids = new Set(visible.map((p) => p.id));
      // A first pull, another schema, or a project the user has lost: start again from a snapshot.
      const reset =
        request.cursor === null ||
        request.schemaVersion !== SYNC_SCHEMA_VERSION ||
        Object.keys(request.cursor).some((projectId) => !ids.has(projectId));
      const cursor: Cursor = reset ? {} : { ...request.cursor };

      const changes: RecordChange[] = [];
      let hasMore = false;
      for (const { project, lastSeq } of counted) {
        // Nothing written past the cursor (the counter is read in the same snapshot): no statement.
        if (lastSeq <= (cursor[project.id] ?? 0)) {
          cursor[project.id] = cursor[project.id] ?? 0;
          continue;
        }
        const page = await projectChanges(tx, project.id, cursor[project.id] ?? 0, limit);
        hasMore ||= page.hasMore;
        for (const change of page.changes) changes.push(change as RecordChange);
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
