// Every route handler goes through a door: the project door (lib/api/project-route.ts: path ids,
// role resolved once, can() for the declared action) or, for the few routes that are not about one
// project, a named entry below with the reason. A new route that does neither fails here.
// [common practice: an architecture rule checked by walking the source tree]
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

const root = path.resolve(import.meta.dirname, "../..");

/** Routes outside the project door, each with why (the only list to edit when adding one). */
const NOT_PROJECT_ROUTES: Record<string, string> = {
  "app/api/auth/[...nextauth]/route.ts": "public: next-auth's own sign-in endpoints",
  "app/api/sign-in-link/route.ts": "public: asks for a sign-in link",
  "app/api/invitations/accept/route.ts": "public: the invitation token is the credential",
  "app/api/digest/unsubscribe/route.ts": "public: the signed unsubscribe token is the credential",
  "app/api/health/route.ts": "public: readiness probe",
  "app/api/health/live/route.ts": "public: liveness probe",
  "app/api/health/ready/route.ts": "public: readiness probe",
  "app/api/account/password/route.ts": "the signed-in person's own account",
  "app/api/account/sign-out-everywhere/route.ts": "the signed-in person's own account",
  "app/api/account/device-policy/route.ts": "administration: decided by the admin flag (authorizeAdmin)",
  "app/api/admin/settings/route.ts": "administration: decided by the admin flag (authorizeAdmin)",
  "app/api/admin/projects/route.ts": "administration: decided by the admin flag (authorizeAdmin)",
  "app/api/admin/projects/[projectId]/members/route.ts": "administration of a project's memberships: the admin flag, not a role on it",
  "app/api/admin/projects/[projectId]/members/[userId]/route.ts": "administration of a project's memberships: the admin flag, not a role on it",
  "app/api/admin/users/[userId]/status/route.ts": "administration: decided by the admin flag (authorizeAdmin)",
  "app/api/invitations/route.ts": "administration: decided by the admin flag (authorizeAdmin)",
  "app/api/projects/route.ts": "across projects: readableProjects()",
  "app/api/review/placements/route.ts": "across projects: readableProjects()",
  "app/api/review/diaries/route.ts": "across projects: readableProjects()",
  "app/api/review/views/route.ts": "the signed-in person's own saved views",
  "app/api/lab/queue/route.ts": "across projects: readableProjects()",
  "app/api/sync/pull/route.ts": "across projects: readableProjects()",
  "app/api/sync/push/route.ts": "per mutation: the push resolves the sender's access to its projects once (lib/sync/server/push.ts) and the shared write path permits each",
};

function sourceFiles(dir: string, wanted: (name: string) => boolean): string[] {
  return readdirSync(path.join(root, dir), { withFileTypes: true }).flatMap((entry) => {
    const rel = `${dir}/${entry.name}`;
    if (entry.isDirectory()) return sourceFiles(rel, wanted);
    return wanted(entry.name) ? [rel] : [];
  });
}

const files = sourceFiles("app", (name) => name === "route.ts");

/**
 * The role lookup: resolving a person's access to a project (lib/auth/access.ts). Lib receives the
 * resolved { user, role, project } and applies can() to it with permit()/allows(); it never looks
 * the role up again. accessIn()/authorizeIn() read the access a write context carries.
 */
const ROLE_LOOKUP = /\b(resolveAccess|resolveMemberAccess|accessTo|getRole|getRoles)\s*\(|memberships\.role\b/;
/** Lib modules outside lib/auth and lib/api that may still resolve access, each with why. */
const LOOKUP_ENTRY_POINTS: Record<string, string> = {
  "lib/sync/server/push.ts": "the sync push is its own door: the sender's access to every project of the batch, once",
  "lib/users/queries.ts": "listUserProjects(): the memberships behind readableProjects(), the one cross-project view",
  "lib/projects/queries.ts": "the member list of a project the access already permits (names and roles to show)",
};
const HANDLER = /export const (GET|POST|PUT|PATCH|DELETE)\s*=\s*([A-Za-z]+)\s*[(<]/g;

describe("the route door", () => {
  it("finds the route handlers", () => {
    expect(files.length).toBeGreaterThan(30);
  });

  it("every handler of a project route goes through projectRoute()", () => {
    const wrong: string[] = [];
    for (const file of files.filter((f) => !(f in NOT_PROJECT_ROUTES))) {
      const source = readFileSync(path.join(root, file), "utf8");
      const handlers = [...source.matchAll(HANDLER)];
      if (handlers.length === 0) wrong.push(`${file}: no handler through a door`);
      for (const [, method, wrapper] of handlers) if (wrapper !== "projectRoute") wrong.push(`${file} ${method}: ${wrapper}`);
      if (/export (async )?function (GET|POST|PUT|PATCH|DELETE)/.test(source)) wrong.push(`${file}: a bare handler function`);
    }
    expect(wrong).toEqual([]);
  });

  it("every project-scoped path outside administration is a project route", () => {
    const scoped = files.filter((f) => f.includes("[projectId]") && !f.startsWith("app/api/admin/"));
    expect(scoped.filter((f) => f in NOT_PROJECT_ROUTES)).toEqual([]);
  });

  it("no route decides a permission inline (the rules live in lib/auth/can.ts)", () => {
    const inline = files.filter((f) => /from "@\/lib\/auth\/can"|getRole\(|\brole\s*[!=]==/.test(readFileSync(path.join(root, f), "utf8")));
    expect(inline).toEqual([]);
  });

  it("no lib module outside lib/auth and lib/api looks up the role itself (lib takes the resolved access)", () => {
    const lib = sourceFiles("lib", (name) => /\.tsx?$/.test(name)).filter((f) => !f.startsWith("lib/auth/") && !f.startsWith("lib/api/"));
    expect(lib.length).toBeGreaterThan(50);
    const lookups = lib.filter((f) => !(f in LOOKUP_ENTRY_POINTS) && ROLE_LOOKUP.test(readFileSync(path.join(root, f), "utf8")));
    expect(lookups).toEqual([]);
    for (const f of Object.keys(LOOKUP_ENTRY_POINTS)) expect(ROLE_LOOKUP.test(readFileSync(path.join(root, f), "utf8")), f).toBe(true);
  });

  it("the second authorization helper is gone: authorizeAny exists nowhere", () => {
    const all = [...sourceFiles("lib", (n) => /\.tsx?$/.test(n)), ...sourceFiles("app", (n) => /\.tsx?$/.test(n))];
    expect(all.filter((f) => /\bauthorizeAny\b/.test(readFileSync(path.join(root, f), "utf8")))).toEqual([]);
  });

  it("the list names only routes that exist and do not use the door", () => {
    for (const file of Object.keys(NOT_PROJECT_ROUTES)) {
      expect(files).toContain(file);
      expect(readFileSync(path.join(root, file), "utf8")).not.toMatch(/projectRoute/);
    }
  });
});
