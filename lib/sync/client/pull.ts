// Pulling the server's changes page by page (POST /api/sync/pull) until hasMore is false. Each page
// is applied in one transaction (apply-pull.ts) before the next is asked for, so an interrupted pull
// resumes from the last saved cursor.
import { SYNC_SCHEMA_VERSION, type PullRequest, type PullResponse } from "@/lib/sync/protocol";
import { applyPull } from "./apply-pull";
import { ensureMeta, getMeta, type SyncDb } from "./db";
import { MESSAGES, postSyncJson, type FetchLike } from "./sync-http";

export type PullOptions = { fetch: FetchLike; url?: string; limit?: number };

export type PullOutcome =
  | { kind: "ok"; pages: number; changes: number; reset: boolean }
  | { kind: "unauthenticated"; message: string }
  | { kind: "transient"; message: string; status?: number }
  | { kind: "failed"; message: string; status: number };

function isPullResponse(value: unknown): value is PullResponse {
  const v = value as PullResponse | null;
  return (
    !!v &&
    typeof v.reset === "boolean" &&
    typeof v.hasMore === "boolean" &&
    typeof v.lastMutationId === "number" &&
    Array.isArray(v.changes) &&
    Array.isArray(v.projects) &&
    Array.isArray(v.conflicts) &&
    typeof v.cursor === "object"
  );
}

export async function pullOnce(db: SyncDb, options: PullOptions): Promise<PullOutcome & { hasMore?: boolean }> {
  const { clientId } = await ensureMeta(db, SYNC_SCHEMA_VERSION);
  const cursor = (await getMeta(db, "cursor")) ?? null;
  // Entries up to the last acknowledged id left the outbox with that pull: they are never sent again.
  const ackedMutationId = (await getMeta(db, "lastMutationId")) ?? 0;
  const body: PullRequest = {
    clientId,
    schemaVersion: SYNC_SCHEMA_VERSION,
    cursor,
    ackedMutationId,
    ...(options.limit ? { limit: options.limit } : {}),
  };
  const res = await postSyncJson(options.fetch, options.url ?? "/api/sync/pull", body);
  if (!res) return { kind: "transient", message: MESSAGES.offline };
  if (res.status === 401) return { kind: "unauthenticated", message: MESSAGES.signIn };
  if ([408, 429, 502, 503, 504].includes(res.status)) return { kind: "transient", message: MESSAGES.busy, status: res.status };
  const json: unknown = await res.json().catch(() => null);
  if (res.status !== 200 || !isPullResponse(json)) {
    const error = (json as { error?: { message?: string } } | null)?.error;
    return { kind: "failed", message: error?.message ?? `Could not fetch the latest records (the server answered ${res.status}).`, status: res.status };
  }
  const applied = await applyPull(db, json);
  return { kind: "ok", pages: 1, changes: applied.applied, reset: applied.reset, hasMore: applied.hasMore };
}

/** Pulls until the server has nothing more (bounded, in case a server keeps saying hasMore). */
export async function pullAll(db: SyncDb, options: PullOptions, maxPages = 10_000): Promise<PullOutcome> {
  let pages = 0;
  let changes = 0;
  let reset = false;
  for (; pages < maxPages; ) {
    const outcome = await pullOnce(db, options);
    if (outcome.kind !== "ok") return outcome;
    pages += 1;
    changes += outcome.changes;
    reset ||= outcome.reset;
    if (!outcome.hasMore) break;
  }
  return { kind: "ok", pages, changes, reset };
}
