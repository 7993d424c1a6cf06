// POST /api/sync/pull (SYNC.md): what changed in the user's projects since the device's cursor,
// read in one snapshot. Change numbers are allocated per project under a row lock held to commit
// (lib/records/change-seq.ts), so within a project they become visible in order and a cursor never
// skips a row committed late.
//
// Cost: an incremental pull that finds nothing new is ONE statement (the overview: the device's
// row, the readable projects with their change counters, the open conflicts), which is its own
// snapshot. Only when a counter is past the cursor does it open a read-only repeatable-read
// transaction, read the overview again in it, and read each changed project's page in one
// statement across the record tables. PostgreSQL builds the records' JSON; the answer is assembled
// as text around it (pullBody), so a page costs no JavaScript object per record.
import type { PoolClient, QueryConfig } from "pg";
import { getReadPool } from "@/db";
import { decodeRow } from "@/db/json-rows";
import { conflicts, projects, syncClients } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/options";
import { forbidden } from "@/lib/errors";
import { readableAmong } from "@/lib/projects/readable";
import type { ProjectRole } from "@/lib/auth/roles";
import { MAX_CHANGES_PER_PULL, SYNC_SCHEMA_VERSION, type ConflictSummary, type Cursor, type PullRequest, type PullResponse, type SyncProject } from "../protocol";
import { overviewQuery, pageQuery } from "./pull-sql";

type Runner = Pick<PoolClient, "query">;
type Overview = {
  client: Record<string, unknown> | null;
  projects: { role: ProjectRole; lastSeq: number | string; project: Record<string, unknown> }[];
  conflicts: Record<string, unknown>[];
};

async function readOverview(runner: Runner, user: SessionUser, request: PullRequest) {
  const { rows } = await runner.query<Overview>(overviewQuery(user.id, request.clientId));
  const { client: rawClient, projects: memberships, conflicts: rawConflicts } = rows[0];
  const client = rawClient ? decodeRow(syncClients, rawClient) : undefined;
  if (client && client.userId !== user.id) {
    throw forbidden("This device id belongs to another user. Sign out and in again on this device.");
  }
  const counted = readableAmong(user, memberships).map(({ role, lastSeq, project }) => ({
    project: { ...decodeRow(projects, project), role, createdAt: undefined, updatedAt: undefined } as SyncProject,
    lastSeq: Number(lastSeq),
  }));
  const ids = new Set(counted.map((c) => c.project.id));
  const open = rawConflicts.map((raw) => decodeRow(conflicts, raw)).filter((c) => ids.has(c.projectId));
  // A first pull, another schema, or a project the user has lost: start again from a snapshot.
  const reset =
    request.cursor === null ||
    request.schemaVersion !== SYNC_SCHEMA_VERSION ||
    Object.keys(request.cursor).some((projectId) => !ids.has(projectId));
  const cursor: Cursor = reset ? {} : { ...request.cursor };
  // Nothing written past the cursor (the counter is read in the same snapshot): no page to read.
  const changed = counted.filter(({ project, lastSeq }) => lastSeq > (cursor[project.id] ?? 0)).map((c) => c.project.id);
  for (const { project } of counted) cursor[project.id] ??= 0;
  return { reset, cursor, changed, projects: counted.map((c) => c.project), open, lastMutationId: client?.lastMutationId ?? 0 };
}

/** The body of the pull's answer (a PullResponse as JSON), the records' JSON as PostgreSQL built it. */
export async function pullBody(user: SessionUser, request: PullRequest): Promise<string> {
  const pool = getReadPool();
  // A first pull (no cursor) reads pages; any other asks first whether anything changed.
  if (request.cursor !== null) {
    const first = await readOverview({ query: (q: QueryConfig) => pool.query(q) } as Runner, user, request);
    if (first.changed.length === 0) return assemble(first, [], false);
  }

  const client = await pool.connect();
  try {
    // The generic plan from the first execution: the page statement spans every record table, and
    // planning it anew (PostgreSQL's custom plans, the first five runs on a connection) cost more
    // than running it. Its generic plan reads each table's change index and fetches rows by key.
    await client.query("begin isolation level repeatable read read only; set local plan_cache_mode = force_generic_plan");
    const overview = await readOverview(client, user, request);
    const limit = request.limit ?? MAX_CHANGES_PER_PULL;
    const pages: string[] = [];
    let hasMore = false;
    for (const projectId of overview.changed) {
      const { rows } = await client.query<{ found: number; last_seq: string | null; changes: string | null }>(pageQuery(projectId, overview.cursor[projectId], limit));
      const [page] = rows;
      hasMore ||= page.found > limit;
      if (page.changes) pages.push(page.changes);
      if (page.last_seq !== null) overview.cursor[projectId] = Number(page.last_seq);
    }
    await client.query("commit");
    client.release();
    return assemble(overview, pages, hasMore);
  } catch (error) {
    // Give the connection back only once it is out of the transaction; otherwise drop it.
    await client.query("rollback").then(
      () => client.release(),
      (lost: Error) => client.release(lost),
    );
    throw error;
  }
}

function assemble(overview: Awaited<ReturnType<typeof readOverview>>, pages: string[], hasMore: boolean): string {
  const summaries = overview.open.map(
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
  );
  const json = JSON.stringify;
  // The keys in PullResponse's order; `changes` is spliced in as PostgreSQL wrote it.
  return `{"reset":${json(overview.reset)},"cursor":${json(overview.cursor)},"hasMore":${json(hasMore)},"changes":[${pages.join(",")}],"projects":${json(overview.projects)},"conflicts":${json(summaries)},"lastMutationId":${json(overview.lastMutationId)}}`;
}

/** The pull's answer as the device receives it (dates as ISO strings). */
export async function pullChanges(user: SessionUser, request: PullRequest): Promise<PullResponse> {
  return JSON.parse(await pullBody(user, request)) as PullResponse;
}
