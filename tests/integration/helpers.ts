// Helpers for integration tests: real database rows, real session cookies, real route handlers.
import { randomUUID } from "node:crypto";
import { inArray, sql } from "drizzle-orm";
import { NextRequest } from "next/server";
import { encode } from "next-auth/jwt";
import { db } from "@/db";
import { memberships, projects, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import type { ProjectRole } from "@/lib/auth/roles";
import { openSession } from "@/lib/auth/user-sessions";

export type TestUser = { id: string; email: string; name: string; isAdmin: boolean };

export async function createUser(opts: { isAdmin?: boolean; name?: string } = {}): Promise<TestUser> {
  const tag = randomUUID().slice(0, 8);
  const [row] = await db
    .insert(users)
    .values({ email: `user-${tag}@example.test`, name: opts.name ?? `Test User ${tag}`, isAdmin: opts.isAdmin ?? false })
    .returning();
  return { id: row.id, email: row.email, name: row.name, isAdmin: row.isAdmin };
}

export async function createProject(opts: { unitSystem?: "SI" | "IP" } = {}) {
  const tag = randomUUID().slice(0, 8).toUpperCase();
  const [row] = await db
    .insert(projects)
    .values({ name: `Test Project ${tag}`, code: `T-${tag}`, timeZone: "America/Chicago", unitSystem: opts.unitSystem ?? "SI" })
    .returning();
  return row;
}

export async function addMembership(userId: string, projectId: string, role: ProjectRole) {
  await db.insert(memberships).values({ userId, projectId, role });
}

/** A project with one member per role, plus an outsider who belongs to another project. */
/** A project with its team, and an inspector of another project; both inspectors sign with `password`. */
export async function projectWithSigningInspectors(password: string) {
  const setup = await projectWithTeam();
  const other = await projectWithTeam();
  const hash = await hashPassword(password);
  await db.update(users).set({ passwordHash: hash }).where(inArray(users.id, [setup.team.inspector.id, other.team.inspector.id]));
  return { setup, otherInspector: other.team.inspector };
}

export async function projectWithTeam() {
  const project = await createProject();
  const team = {} as Record<ProjectRole, TestUser>;
  for (const role of ["superintendent", "inspector", "office", "owner"] as const) {
    team[role] = await createUser({ name: `${role} ${project.code}` });
    await addMembership(team[role].id, project.id, role);
  }
  const otherProject = await createProject();
  const outsider = await createUser({ name: `outsider ${project.code}` });
  await addMembership(outsider.id, otherProject.id, "superintendent");
  const admin = await createUser({ isAdmin: true, name: `admin ${project.code}` });
  return { project, team, outsider, otherProject, admin };
}

/** A signed-in browser: its session row and the cookie next-auth would set (same secret, same encoding). */
export async function signedInSession(user: TestUser): Promise<{ sessionId: string; cookie: string }> {
  const sessionId = await openSession(user.id);
  const token = await encode({
    token: { sub: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin, sid: sessionId },
    secret: process.env.NEXTAUTH_SECRET!,
  });
  return { sessionId, cookie: `next-auth.session-token=${token}` };
}

// One signed-in browser per test user, reused by every call (as a real browser would), so a call
// costs the same statements as in production. Tests of revocation use signedInSession() directly.
const cookies = new Map<string, string>();

/** The session cookie of this user's (shared) test session. */
export async function sessionCookie(user: TestUser): Promise<string> {
  let cookie = cookies.get(user.id);
  if (!cookie) {
    cookie = (await signedInSession(user)).cookie;
    cookies.set(user.id, cookie);
  }
  return cookie;
}

type Handler<P> = (req: NextRequest, ctx: { params: Promise<P> }) => Promise<Response>;

/** Calls a route handler the way Next does, as `user` (or anonymously), with a JSON or raw body. */
export async function callRoute<P = Record<string, string>>(
  handler: Handler<P>,
  opts: { user?: TestUser | null; cookie?: string; method?: string; url?: string; params?: P; body?: unknown; rawBody?: string },
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- tests read arbitrary JSON bodies
): Promise<{ status: number; json: any }> {
  const headers = new Headers({ "content-type": "application/json" });
  if (opts.cookie) headers.set("cookie", opts.cookie);
  else if (opts.user) headers.set("cookie", await sessionCookie(opts.user));
  const body = opts.rawBody ?? (opts.body === undefined ? undefined : JSON.stringify(opts.body));
  const req = new NextRequest(new URL(opts.url ?? "/api/test", "http://localhost:3100"), {
    method: opts.method ?? (body === undefined ? "GET" : "POST"),
    headers,
    body,
  });
  const res = await handler(req, { params: Promise.resolve((opts.params ?? {}) as P) });
  const text = await res.text();
  return { status: res.status, json: text ? JSON.parse(text) : null };
}

/** Row count of a table, to show that a refused request changed nothing. */
export async function countRows(table: string): Promise<number> {
  const result = await db.execute(sql.raw(`select count(*)::int as n from "${table}"`));
  return (result.rows[0] as { n: number }).n;
}
