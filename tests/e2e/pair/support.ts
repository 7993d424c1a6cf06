// Two instances of one build behind the round-robin proxy (PLAYWRIGHT_PAIR=1, scripts/serve-pair.mjs):
// nothing in the app may assume one process. Each check talks HTTP to the proxy or to one instance
// directly, and reads PostgreSQL to see what was applied.
import { spawn, type ChildProcess } from "node:child_process";
import { randomUUID } from "node:crypto";
import { hash } from "@node-rs/argon2";
import { expect } from "@playwright/test";
import { Client } from "pg";

export const APP_PORT = Number(process.env.APP_PORT ?? 3100);
export const PROXY = `http://127.0.0.1:${APP_PORT}`;
export const [A, B] = process.env.PAIR_PORTS!.split(",").map((p) => `http://127.0.0.1:${p}`);
export const DOOMED_PORT = APP_PORT + 202;
export const DOOMED = `http://127.0.0.1:${DOOMED_PORT}`;

export async function withDb<T>(fn: (db: Client) => Promise<T>): Promise<T> {
  const db = new Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    return await fn(db);
  } finally {
    await db.end();
  }
}

export const cookiesOf = (res: Response) => res.headers.getSetCookie().map((c) => c.split(";")[0]);

/** next-auth's credentials sign-in over HTTP: the CSRF pair from one address, the POST to another. */
export async function signIn(csrfFrom: string, postTo: string, email: string, password: string): Promise<{ cookie: string | null; error: string | null }> {
  const csrf = await fetch(`${csrfFrom}/api/auth/csrf`);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const res = await fetch(`${postTo}/api/auth/callback/password`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: cookiesOf(csrf).join("; ") },
    body: new URLSearchParams({ csrfToken, email, password, json: "true" }),
  });
  const session = cookiesOf(res).find((c) => c.startsWith("next-auth.session-token="));
  const { url } = (await res.json()) as { url: string };
  return { cookie: session ?? null, error: new URL(url, postTo).searchParams.get("error") };
}

/** A superintendent of a project of their own (so other suites' lists are untouched), signed in. */
export async function superintendentOfNewProject() {
  const tag = randomUUID().slice(0, 8);
  const email = `pair-${tag}@example.test`;
  const password = `pair-password-${tag}`;
  const projectId = randomUUID();
  await withDb(async (db) => {
    const user = await db.query("insert into users (email, name, password_hash) values ($1, $2, $3) returning id", [email, `Pair Tester ${tag}`, await hash(password)]);
    await db.query("insert into projects (id, name, code, time_zone, unit_system) values ($1, $2, $3, 'America/Chicago', 'SI')", [projectId, `Pair ${tag}`, `PAIR-${tag}`]);
    await db.query("insert into memberships (user_id, project_id, role) values ($1, $2, 'superintendent')", [user.rows[0].id, projectId]);
  });
  const { cookie } = await signIn(B, B, email, password);
  expect(cookie).toBeTruthy();
  return { tag, projectId, cookie: cookie! };
}

/** Device mutations `from`..`to`: each creates a placement. */
export function placementCreates(tag: string, projectId: string, from: number, to: number) {
  return Array.from({ length: to - from + 1 }, (_, i) => {
    const id = randomUUID();
    const n = from + i;
    const args = { id, element: `Pair slab ${tag} ${n}`, level: "L2", grid: "A-D/1-4", elementType: "elevated-slab", leastDimensionMm: 250, plannedVolumeM3: 60, plannedStart: "2026-11-16T14:00:00Z" };
    return { id: n, name: "create", recordType: "placements", projectId, recordId: id, args };
  });
}

export function startDoomed(): Promise<{ child: ChildProcess; output: () => string }> {
  const child = spawn(process.execPath, ["scripts/serve.mjs", "-H", "127.0.0.1", "-p", String(DOOMED_PORT)], {
    env: { ...process.env, DIGEST_WORKER: "off", INSTANCE_NAME: "doomed", LOG_LEVEL: "info" },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let out = "";
  child.stdout!.on("data", (d) => (out += d));
  child.stderr!.on("data", (d) => (out += d));
  return new Promise((resolve, reject) => {
    const until = Date.now() + 120_000;
    const poll = async () => {
      if (child.exitCode !== null) return reject(new Error(`the instance exited: ${out}`));
      const ok = await fetch(`${DOOMED}/api/health/ready`).then((r) => r.ok, () => false);
      if (ok) return resolve({ child, output: () => out });
      if (Date.now() > until) return reject(new Error("the instance did not start"));
      setTimeout(poll, 250);
    };
    void poll();
  });
}
