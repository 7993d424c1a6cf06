// Finding 12 (second half): the app connected as the role that owns every table, so a bug or an
// injected statement could switch off the append-only and freeze triggers, or drop the audit
// trail. Now the app connects as a role that owns nothing (lib/db-roles/app-role.ts, set up by
// scripts/app-role.mts). The attack, on a connection as that role: disable the triggers, drop or
// truncate the tables, turn triggers off for the session, create objects. Each is refused with
// SQLSTATE 42501 (insufficient_privilege) and the triggers stay enabled; ordinary reads and writes work.
// [PostgreSQL docs: ALTER TABLE "must own the table"; DROP TABLE "only the table owner";
//  session_replication_role needs superuser or the SET privilege; 42501 in Appendix A]
import { sql } from "drizzle-orm";
import { Client } from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { ensureAppRole } from "@/lib/db-roles/app-role";
import { getBoss, stopQueue } from "@/lib/digest/queue";

const ownerUrl = new URL(process.env.DATABASE_URL!);
const appUrl = new URL(ownerUrl);
appUrl.username = "placewright_app_check";
appUrl.password = "app-role-check-password";
let app: Client;

const triggersEnabled = async () =>
  (
    await db.execute(sql`select tgname, tgenabled from pg_trigger where not tgisinternal
      and tgrelid in ('sign_offs'::regclass, 'audit_entries'::regclass, 'amendments'::regclass, 'placements'::regclass, 'mix_designs'::regclass) order by tgname`)
  ).rows;

beforeAll(async () => {
  await getBoss(); // the queue schema exists before the grants, as after scripts/app-role.mts
  await stopQueue();
  await ensureAppRole(db, appUrl.href);
  await ensureAppRole(db, appUrl.href); // idempotent: a second run changes nothing and does not fail
  app = new Client({ connectionString: appUrl.href });
  await app.connect();
});
afterAll(async () => {
  await app?.end();
});

const refused = async (statement: string) => {
  const error = await app.query(statement).then(
    () => null,
    (e: { code?: string }) => e,
  );
  return error?.code;
};

describe("the app's database role owns nothing (finding 12)", () => {
  it.each([
    "alter table sign_offs disable trigger sign_offs_append_only",
    "alter table audit_entries disable trigger all",
    "alter table placements disable trigger placements_signed_frozen",
    "alter table mix_designs disable trigger user",
    "drop table audit_entries",
    "drop trigger sign_offs_append_only on sign_offs",
    "truncate audit_entries",
    "set session_replication_role = replica",
    "create table public.scratch (id int)",
    "create or replace function placewright_refuse_append_only() returns trigger language plpgsql as $$ begin return new; end $$",
  ])("refused (42501): %s", async (statement) => {
    const before = await triggersEnabled();
    expect(before.length).toBeGreaterThanOrEqual(6);
    expect(await refused(statement)).toBe("42501");
    expect(await triggersEnabled()).toEqual(before);
  });

  it("is not a superuser and owns no table, and still reads and writes rows", async () => {
    const me = await app.query("select rolsuper, rolcreaterole, rolcreatedb, rolbypassrls from pg_roles where rolname = current_user");
    expect(me.rows[0]).toEqual({ rolsuper: false, rolcreaterole: false, rolcreatedb: false, rolbypassrls: false });
    const owned = await app.query("select count(*)::int as n from pg_class c join pg_roles r on r.oid = c.relowner where r.rolname = current_user");
    expect(owned.rows[0].n).toBe(0);
    expect((await app.query("select count(*)::int as n from projects")).rows[0].n).toBeGreaterThanOrEqual(0);
    await app.query("begin");
    await app.query("insert into rate_limits (key, points, expire) values ('app-role-check', 1, 0)");
    await app.query("rollback");
  });
});
