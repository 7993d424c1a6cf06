// An in-memory stand-in for POST /api/sync/push and /api/sync/pull that follows SYNC.md: per-client
// watermark with stored results (replay), gap detection, version checks (stale → conflict with both
// payloads kept), tombstones, per-project change numbers and cursors, paging and reset. It lets the
// device code be tested end to end without a database. It is deliberately simple and not the server.
import type {
  ConflictSummary,
  Cursor,
  Mutation,
  MutationResult,
  PullRequest,
  PullResponse,
  PushRequest,
  PushResponse,
  RecordChange,
  SyncedRecord,
  SyncProject,
} from "@/lib/sync/protocol";
import { LOCAL_TYPES, type RecordType } from "@/lib/sync/client/record-types";

type StoredMutation = MutationResult;

export class FakeServer {
  records = new Map<string, { type: RecordType; row: SyncedRecord }>();
  clients = new Map<string, { userId: string; lastMutationId: number; results: Map<number, StoredMutation> }>();
  conflicts: (ConflictSummary & { resolved: boolean })[] = [];
  seqs = new Map<string, number>();
  projects: SyncProject[];
  /** Every push body received (for assertions). */
  pushes: PushRequest[] = [];
  /** Set to make the next requests fail: a status (e.g. 503) or "network". */
  failNext: (number | "network")[] = [];
  userId = "user-a";
  pageSize = 500;
  /** Ids of records the server keeps signed (writes to them are rejected). */
  signed = new Set<string>();

  constructor(projects: SyncProject[]) {
    this.projects = projects;
  }

  private key(type: string, id: string) {
    return `${type}:${id}`;
  }

  private nextSeq(projectId: string) {
    const seq = (this.seqs.get(projectId) ?? 0) + 1;
    this.seqs.set(projectId, seq);
    return seq;
  }

  /** A row written on the server by someone else (another device, the office). */
  serverWrite(type: RecordType, projectId: string, id: string, values: Record<string, unknown>): SyncedRecord {
    const existing = this.records.get(this.key(type, id))?.row;
    const row: SyncedRecord = {
      ...(existing ?? { ...LOCAL_TYPES[type].defaults, id, projectId, deletedAt: null, createdAt: new Date(0).toISOString() }),
      ...values,
      id,
      projectId,
      version: (existing?.version ?? 0) + 1,
      changeSeq: this.nextSeq(projectId),
      updatedAt: new Date().toISOString(),
    } as SyncedRecord;
    this.records.set(this.key(type, id), { type, row });
    return row;
  }

  live(type: RecordType): SyncedRecord[] {
    return [...this.records.values()].filter((r) => r.type === type && !r.row.deletedAt).map((r) => r.row);
  }

  fetch = async (url: string, init?: RequestInit): Promise<Response> => {
    const fail = this.failNext.shift();
    if (fail === "network") throw new TypeError("fetch failed");
    if (typeof fail === "number") return json({ error: { code: "unavailable", message: "Try again" } }, fail);
    const body = JSON.parse(String(init?.body ?? "{}"));
    if (url.endsWith("/push")) return this.push(body as PushRequest);
    if (url.endsWith("/pull")) return json(this.pull(body as PullRequest));
    return json({ error: { code: "not_found", message: "No such route" } }, 404);
  };

  private client(id: string) {
    let client = this.clients.get(id);
    if (!client) {
      client = { userId: this.userId, lastMutationId: 0, results: new Map() };
      this.clients.set(id, client);
    }
    return client;
  }

  push(request: PushRequest): Response {
    this.pushes.push(structuredClone(request));
    const client = this.client(request.clientId);
    if (client.userId !== this.userId) return json({ error: { code: "forbidden", message: "This device id belongs to another user." } }, 403);
    const results: MutationResult[] = [];
    for (const m of [...request.mutations].sort((a, b) => a.id - b.id)) {
      if (m.id <= client.lastMutationId) {
        results.push(client.results.get(m.id) ?? { id: m.id, result: "applied" });
        continue;
      }
      if (m.id > client.lastMutationId + 1) {
        return json(
          { error: { code: "conflict", reason: "gap", message: "Changes are missing", expectedId: client.lastMutationId + 1 } },
          409,
        );
      }
      const result = { id: m.id, ...this.apply(m) };
      client.results.set(m.id, result);
      client.lastMutationId = m.id;
      results.push(result);
    }
    return json({ lastMutationId: client.lastMutationId, results } satisfies PushResponse);
  }

  private conflict(m: Mutation, reason: string, server: SyncedRecord | undefined): Omit<MutationResult, "id"> {
    const id = crypto.randomUUID();
    this.conflicts.push({
      id,
      projectId: m.projectId,
      recordType: m.recordType,
      recordId: m.recordId,
      baseVersion: m.baseVersion ?? null,
      serverVersion: server?.version ?? null,
      clientPayload: { name: m.name, args: m.args },
      serverPayload: server ?? null,
      reason,
      createdAt: new Date().toISOString(),
      resolved: false,
    });
    return { result: "conflict", reason, conflictId: id, version: server?.version, message: `Changed elsewhere (${reason}).` };
  }

  private apply(m: Mutation): Omit<MutationResult, "id"> {
    const key = this.key(m.recordType, m.recordId);
    const existing = this.records.get(key)?.row;
    if (!this.projects.some((p) => p.id === m.projectId)) return { result: "rejected", reason: "forbidden", message: "Not your project." };
    if (existing && this.signed.has(existing.id) && m.name !== "create") {
      return { result: "rejected", reason: "signed", message: "This placement is signed." };
    }
    switch (m.name) {
      case "create": {
        const { id: _id, ...values } = m.args as Record<string, unknown>;
        void _id;
        if (existing) {
          const same = Object.entries(values).every(([k, v]) => JSON.stringify(existing[k]) === JSON.stringify(v));
          return same ? { result: "applied", version: existing.version } : this.conflict(m, "exists", existing);
        }
        if (m.recordType === "diary-crew" && typeof values.count === "number" && values.count > 400) {
          return { result: "rejected", reason: "invalid", message: "Crew count must be at most 400 here." };
        }
        const row = this.serverWrite(m.recordType, m.projectId, m.recordId, { ...values, ...(m.recordType === "placements" ? { state: "planned" } : {}) });
        return { result: "applied", version: row.version };
      }
      case "update":
      case "resolve": {
        if (!existing) return { result: "rejected", reason: "not_found", message: "Not found." };
        if (existing.deletedAt) return this.conflict(m, "deleted", existing);
        if (existing.version !== m.baseVersion) return this.conflict(m, "stale", existing);
        const patch = (m.args.patch ?? {}) as Record<string, unknown>;
        if (m.name === "resolve") {
          const open = this.conflicts.find((c) => c.id === m.args.conflictId);
          if (!open) return { result: "rejected", reason: "not_found", message: "No such conflict." };
          open.resolved = true;
          if (Object.keys(patch).length === 0) return { result: "applied", version: existing.version };
        }
        const row = this.serverWrite(m.recordType, m.projectId, m.recordId, patch);
        return { result: "applied", version: row.version };
      }
      case "delete": {
        if (!existing) return { result: "rejected", reason: "not_found", message: "Not found." };
        if (existing.deletedAt) return { result: "applied", version: existing.version };
        if (existing.version !== m.baseVersion) return this.conflict(m, "stale", existing);
        const row = this.serverWrite(m.recordType, m.projectId, m.recordId, { deletedAt: new Date().toISOString() });
        return { result: "applied", version: row.version };
      }
      case "transition": {
        if (!existing) return { result: "rejected", reason: "not_found", message: "Not found." };
        if (existing.version !== m.baseVersion) return this.conflict(m, "stale", existing);
        const to = m.args.to as string;
        const row = this.serverWrite(m.recordType, m.projectId, m.recordId, { state: to, holdReason: to === "held" ? (m.args.reason ?? null) : null });
        return { result: "applied", version: row.version };
      }
    }
  }

  pull(request: PullRequest): PullResponse {
    const client = this.client(request.clientId);
    const reset = request.cursor === null || request.cursor === undefined;
    const cursor: Cursor = { ...(request.cursor ?? {}) };
    const limit = Math.min(request.limit ?? this.pageSize, this.pageSize);
    const all: RecordChange[] = [...this.records.values()]
      .filter(({ row }) => row.changeSeq > (cursor[row.projectId] ?? 0))
      .sort((a, b) => a.row.projectId.localeCompare(b.row.projectId) || a.row.changeSeq - b.row.changeSeq)
      .map(({ type, row }) => ({ recordType: type, record: structuredClone(row) }));
    const changes = all.slice(0, limit);
    for (const change of changes) cursor[change.record.projectId] = change.record.changeSeq;
    for (const project of this.projects) cursor[project.id] ??= 0;
    return {
      reset,
      cursor,
      hasMore: all.length > changes.length,
      changes,
      projects: this.projects,
      conflicts: this.conflicts.filter((c) => !c.resolved).map(({ resolved: _r, ...c }) => {
        void _r;
        return c;
      }),
      lastMutationId: client.lastMutationId,
    };
  }
}

export function json(body: unknown, status = 200): Response {
  return new Response(JSON.stringify(body), { status, headers: { "content-type": "application/json" } });
}
