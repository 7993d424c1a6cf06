// Helpers for the attack tests: raw requests with any header or body (a lying Content-Length,
// another site's Origin, a form post), and a snapshot of every table's row count to show that a
// refused request changed nothing.
import { sql } from "drizzle-orm";
import { NextRequest } from "next/server";
import { db } from "@/db";
import { sessionCookie, type TestUser } from "../integration/helpers";

type Handler<P> = (req: NextRequest, ctx: { params: Promise<P> }) => Promise<Response>;

export const APP_URL = process.env.NEXTAUTH_URL ?? "http://localhost:3100";

export async function attack<P = Record<string, string>>(
  handler: Handler<P>,
  opts: {
    user?: TestUser | null;
    method?: string;
    url?: string;
    params?: P;
    body?: BodyInit | null;
    headers?: Record<string, string>;
  },
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- tests read arbitrary JSON bodies
): Promise<{ status: number; json: any; text: string }> {
  const headers = new Headers({ "content-type": "application/json", ...(opts.headers ?? {}) });
  if (opts.user) headers.set("cookie", await sessionCookie(opts.user));
  const init: ConstructorParameters<typeof NextRequest>[1] & { duplex?: "half" } = {
    method: opts.method ?? (opts.body == null ? "GET" : "POST"),
    headers,
    body: opts.body ?? undefined,
  };
  if (opts.body instanceof ReadableStream) init.duplex = "half";
  const req = new NextRequest(new URL(opts.url ?? "/api/test", APP_URL), init);
  const res = await handler(req, { params: Promise.resolve((opts.params ?? {}) as P) });
  const text = await res.text();
  let json: unknown = null;
  try {
    json = text ? JSON.parse(text) : null;
  } catch {
    json = null;
  }
  return { status: res.status, json, text };
}

/**
 * Row counts of every table of the public schema. Left out: the migrations' own table, and the
 * sign-in sessions a test user's first request opens (bookkeeping of who is signed in, not a write
 * of the route under attack).
 */
export async function tableCounts(): Promise<Record<string, number>> {
  const tables = await db.execute(sql`select tablename from pg_tables where schemaname = 'public' and tablename <> 'user_sessions' order by tablename`);
  const counts: Record<string, number> = {};
  for (const { tablename } of tables.rows as { tablename: string }[]) {
    const result = await db.execute(sql.raw(`select count(*)::int as n from "${tablename}"`));
    counts[tablename] = (result.rows[0] as { n: number }).n;
  }
  return counts;
}

/** A body stream of `bytes` bytes that never declares its length (chunked upload). */
export function streamOf(bytes: number, chunk = 64 * 1024): ReadableStream<Uint8Array> {
  let sent = 0;
  return new ReadableStream({
    pull(controller) {
      if (sent >= bytes) return controller.close();
      const n = Math.min(chunk, bytes - sent);
      sent += n;
      controller.enqueue(new Uint8Array(n).fill(0x20));
    },
  });
}
