// npm run fuzz: generated bodies against every write route and the sync push, as each role (and
// signed out), called in process like the integration tests, against DATABASE_URL (use a test
// database: it creates a project and people). Prints requests, 4xx, 5xx and the rows changed by
// refused (4xx) requests; exits 1 when a 5xx or a changed row was seen.
// FUZZ_COUNT (default 10000) and FUZZ_SEED (default 1) change the run.
import { randomUUID } from "node:crypto";
import fc from "fast-check";
import { sql } from "drizzle-orm";
import { NextRequest } from "next/server";
import { encode } from "next-auth/jwt";

process.env.NEXTAUTH_SECRET ??= "test-secret-not-for-production-0123456789";
process.env.NEXTAUTH_URL ??= "http://localhost:3100";
// Loaded after the environment is set, like scripts/bench-sync.mts.
const { closeDb, db } = await import("../db/index.ts");
const { memberships, projects, users } = await import("../db/schema/index.ts");
const { RECORD_TYPES } = await import("../lib/records/record-types.ts");
const { SYNC_SCHEMA_VERSION } = await import("../lib/sync/protocol.ts");
const COUNT = Number(process.env.FUZZ_COUNT ?? 10_000);
const SEED = Number(process.env.FUZZ_SEED ?? 1);

type Handler = (req: NextRequest, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>;
type Route = { name: string; method: string; handler: Handler; params: () => Record<string, string> };

const ROLES = ["superintendent", "inspector", "office", "owner", "outsider", "admin", "anonymous"] as const;
type Actor = (typeof ROLES)[number];

async function setup() {
  const tag = randomUUID().slice(0, 8);
  const [project] = await db.insert(projects).values({ name: `Fuzz ${tag}`, code: `F-${tag}`, timeZone: "America/Chicago", unitSystem: "SI" }).returning();
  const [other] = await db.insert(projects).values({ name: `Fuzz other ${tag}`, code: `FO-${tag}`, timeZone: "UTC", unitSystem: "IP" }).returning();
  const cookies = {} as Record<Actor, string | null>;
  for (const role of ROLES) {
    if (role === "anonymous") {
      cookies[role] = null;
      continue;
    }
    const [u] = await db.insert(users).values({ email: `fuzz-${role}-${tag}@example.test`, name: `Fuzz ${role}`, isAdmin: role === "admin" }).returning();
    if (role === "outsider") await db.insert(memberships).values({ userId: u.id, projectId: other.id, role: "superintendent" });
    else if (role !== "admin") await db.insert(memberships).values({ userId: u.id, projectId: project.id, role });
    const token = await encode({ token: { sub: u.id, email: u.email, name: u.name, isAdmin: u.isAdmin }, secret: process.env.NEXTAUTH_SECRET! });
    cookies[role] = `next-auth.session-token=${token}`;
  }
  return { project, other, cookies };
}

async function routes(projectId: string): Promise<Route[]> {
  const r = async (path: string) => (await import(`../app/api/${path}/route.ts`)) as Record<string, Handler>;
  const id = () => randomUUID();
  const type = () => fc.sample(fc.constantFrom(...RECORD_TYPES, "nope", "../x"), 1)[0];
  const p = (extra: () => Record<string, string> = () => ({})) => () => ({ projectId: Math.random() < 0.05 ? "not-a-uuid" : projectId, ...extra() });
  const list: [string, string, Route["params"]][] = [
    ["projects/[projectId]/records/[type]", "POST", p(() => ({ type: type() }))],
    ["projects/[projectId]/records/[type]/[id]", "PATCH", p(() => ({ type: type(), id: id() }))],
    ["projects/[projectId]/records/[type]/[id]", "DELETE", p(() => ({ type: type(), id: id() }))],
    ["projects/[projectId]/placements/[id]/transition", "POST", p(() => ({ id: id() }))],
    ["projects/[projectId]/placements/[id]/sign-off", "POST", p(() => ({ id: id() }))],
    ["projects/[projectId]/placements/[id]/amendments", "POST", p(() => ({ id: id() }))],
    ["projects/[projectId]/placements/[id]/amendments/[amendmentId]/sign-off", "POST", p(() => ({ id: id(), amendmentId: id() }))],
    ["projects/[projectId]/site-visits/[id]/sign-off", "POST", p(() => ({ id: id() }))],
    ["projects/[projectId]/digest/settings", "PUT", p()],
    ["projects/[projectId]/digest/recipients", "POST", p()],
    ["projects/[projectId]/digest/recipients/[recipientId]", "PATCH", p(() => ({ recipientId: id() }))],
    ["projects/[projectId]/digest/recipients/[recipientId]", "DELETE", p(() => ({ recipientId: id() }))],
    ["projects/[projectId]/photos/[photoId]", "POST", p(() => ({ photoId: id() }))],
    ["projects/[projectId]/photos/[photoId]/complete", "POST", p(() => ({ photoId: id() }))],
    ["admin/projects", "POST", () => ({})],
    ["admin/projects/[projectId]/members", "POST", p()],
    ["admin/projects/[projectId]/members/[userId]", "PATCH", p(() => ({ userId: id() }))],
    ["admin/projects/[projectId]/members/[userId]", "DELETE", p(() => ({ userId: id() }))],
    ["review/views", "PUT", () => ({})],
    ["review/views", "DELETE", () => ({})],
    ["invitations", "POST", () => ({})],
    ["invitations/accept", "POST", () => ({})],
    ["sign-in-link", "POST", () => ({})],
    ["digest/unsubscribe", "POST", () => ({})],
    ["sync/push", "POST", () => ({})],
    ["sync/pull", "POST", () => ({})],
  ];
  const out: Route[] = [];
  for (const [path, method, params] of list) out.push({ name: `${method} ${path}`, method, handler: (await r(path))[method], params });
  return out;
}

/** Bodies: arbitrary JSON, near-valid shapes with hostile values, sync pushes, broken JSON, huge strings. */
function bodies(projectId: string): fc.Arbitrary<string> {
  const hostile = fc.oneof(
    fc.string(),
    fc.integer(),
    fc.double(),
    fc.constantFrom(null, true, -1, 0, 1e308, "", "=cmd|' /C calc'!A0", "/\\evil.example", "' or 1=1--", "\u0000", "9".repeat(400)),
    fc.uuid(),
    fc.date().map((d) => (Number.isNaN(d.getTime()) ? "x" : d.toISOString())),
  );
  const keys = fc.constantFrom("id", "baseVersion", "patch", "to", "reason", "password", "typedName", "signatureImage", "what", "why", "email", "name", "role", "digestHour", "hourOverride", "date", "token", "callbackUrl", "contentType", "sizeBytes", "sha256", "code", "timeZone", "unitSystem", "list", "columns", "slumpMm", "volumeM3", "placementId", "mixDesignId");
  const shaped = fc.dictionary(keys, fc.oneof(hostile, fc.dictionary(keys, hostile)), { maxKeys: 8 });
  const mutation = fc.record({
    id: fc.oneof(fc.integer({ min: 1, max: 3 }), fc.integer()),
    name: fc.constantFrom("create", "update", "delete", "transition", "resolve", "drop"),
    recordType: fc.constantFrom(...RECORD_TYPES, "users"),
    projectId: fc.oneof(fc.constant(projectId), fc.uuid()),
    recordId: fc.uuid(),
    args: shaped,
    baseVersion: fc.option(fc.integer({ min: -1, max: 5 }), { nil: undefined }),
  });
  const push = fc.record({ clientId: fc.uuid(), schemaVersion: fc.constantFrom(SYNC_SCHEMA_VERSION, 0), mutations: fc.array(mutation, { maxLength: 5 }) });
  return fc.oneof(
    { weight: 3, arbitrary: shaped.map((b) => JSON.stringify(b)) },
    { weight: 3, arbitrary: push.map((b) => JSON.stringify(b)) },
    { weight: 2, arbitrary: fc.jsonValue().map((b) => JSON.stringify(b)) },
    { weight: 1, arbitrary: fc.string().map((s) => `{"broken": ${s}`) },
    { weight: 1, arbitrary: fc.integer({ min: 70_000, max: 300_000 }).map((n) => JSON.stringify({ what: "x".repeat(n), why: "y" })) },
  );
}

/** Row count and newest row version (xmin) per table: any insert, update or delete changes it. */
async function fingerprint(): Promise<Map<string, string>> {
  const tables = (await db.execute(sql`select tablename from pg_tables where schemaname = 'public' and tablename <> 'rate_limits'`)).rows as { tablename: string }[];
  const union = tables.map((t) => `select '${t.tablename}' as t, count(*)::text || '/' || coalesce(max(xmin::text::bigint), 0)::text as f from "${t.tablename}"`).join(" union all ");
  const rows = (await db.execute(sql.raw(union))).rows as { t: string; f: string }[];
  return new Map(rows.map((r) => [r.t, r.f]));
}

async function main() {
  const { project, cookies } = await setup();
  const all = await routes(project.id);
  const samples = fc.sample(bodies(project.id), { numRuns: COUNT, seed: SEED });
  let requests = 0, clientErrors = 0, serverErrors = 0, changedRows = 0;
  const fives: string[] = [];
  const changed: string[] = [];
  let before = await fingerprint();
  for (let i = 0; i < COUNT; i++) {
    const route = all[i % all.length];
    const actor = ROLES[Math.floor(i / all.length) % ROLES.length];
    const headers = new Headers({ "content-type": "application/json", "x-forwarded-for": `203.0.113.${i % 250}` });
    if (cookies[actor]) headers.set("cookie", cookies[actor]!);
    const req = new NextRequest(new URL("/api/fuzz", process.env.NEXTAUTH_URL), { method: route.method, headers, body: samples[i] });
    const res = await route.handler(req, { params: Promise.resolve(route.params()) });
    await res.arrayBuffer();
    requests++;
    const after = await fingerprint();
    if (res.status >= 500) {
      serverErrors++;
      fives.push(`${res.status} ${route.name} as ${actor}: ${samples[i].slice(0, 200)}`);
    } else if (res.status >= 400) {
      clientErrors++;
      const diff = [...after].filter(([t, f]) => before.get(t) !== f).map(([t]) => t);
      if (diff.length) {
        changedRows += diff.length;
        changed.push(`${res.status} ${route.name} as ${actor} changed ${diff.join(", ")}`);
      }
    }
    before = after;
    if ((i + 1) % 1000 === 0) console.log(`… ${i + 1} requests`);
  }
  console.log(`routes: ${all.length} write routes × ${ROLES.length} roles (signed out included), seed ${SEED}`);
  console.log(`requests: ${requests}`);
  console.log(`4xx: ${clientErrors}`);
  console.log(`5xx: ${serverErrors}`);
  console.log(`tables changed by refused requests: ${changedRows}`);
  for (const line of [...fives, ...changed].slice(0, 20)) console.log(`  ${line}`);
  await closeDb();
  process.exit(serverErrors || changedRows ? 1 : 0);
}

main().catch(async (error) => {
  console.error(error);
  await closeDb();
  process.exit(1);
});
