// The set-based sync push (lib/records/create-batch.ts) against the promises of the shared sync
// brief (SYNC.md "Promises" 1–3 and "POST /api/sync/push" steps 1–6): a mixed push answers each
// mutation as the one-at-a-time path does, a refused batch falls back without blocking the rest,
// and a push of 100 creates costs a fixed number of statements.
import { randomUUID } from "node:crypto";
import { and, eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { auditEntries, deliveries, syncClients, syncMutations } from "@/db/schema";
import { SYNC_SCHEMA_VERSION, type Mutation } from "@/lib/sync/protocol";
import { pushMutations } from "@/lib/sync/server/push";
import { projectWithTeam, type TestUser } from "./helpers";
import { validBody } from "./record-fixtures";
import { countStatements } from "./statement-count";

const REFUSED_TICKET = `T-REFUSE-${randomUUID().slice(0, 8)}`;

const create = (id: number, projectId: string, type: Mutation["recordType"], args: Record<string, unknown>): Mutation => ({
  id,
  name: "create",
  recordType: type,
  projectId,
  recordId: args.id as string,
  args,
});

const push = (user: TestUser, clientId: string, mutations: Mutation[]) =>
  pushMutations(user, { clientId, schemaVersion: SYNC_SCHEMA_VERSION, mutations: structuredClone(mutations) });

/** The same device changes, with fresh ids, for a second project (to compare the two paths). */
function scenario(projectId: string): Mutation[] {
  const placement = validBody("placements");
  const d1 = validBody("deliveries", placement.id as string);
  const d2 = validBody("deliveries", placement.id as string);
  const test = { ...validBody("field-tests", placement.id as string), deliveryId: d1.id };
  const orphan = validBody("deliveries", randomUUID()); // no such placement
  const badVolume = { ...validBody("deliveries", placement.id as string), volumeM3: -3 };
  const clash = { ...d2, ticketNumber: "T-OTHER" }; // d2's id again with other values
  return [
    create(1, projectId, "placements", placement),
    create(2, projectId, "deliveries", d1),
    create(3, projectId, "field-tests", test),
    create(4, projectId, "deliveries", orphan),
    create(5, projectId, "deliveries", d2),
    create(6, projectId, "deliveries", badVolume),
    create(7, projectId, "deliveries", clash),
    create(8, projectId, "deliveries", d2), // a retry of 5 inside the same push: the stored row
    { id: 9, name: "update", recordType: "deliveries", projectId, recordId: d1.id as string, args: { patch: { truck: "B-22" } }, baseVersion: 1 },
    create(10, projectId, "deliveries", validBody("deliveries", placement.id as string)),
  ];
}

const outcome = (r: { result: string; reason?: string; version?: number }) => `${r.result}${r.reason ? `:${r.reason}` : ""}${r.version ? `@${r.version}` : ""}`;

describe("set-based sync push", () => {
  beforeAll(async () => {
    // A database-side refusal the in-memory checks cannot foresee (it stands for a trigger or a
    // racing writer): the signed-record SQLSTATE, for one ticket number only.
    await db.execute(
      sql.raw(`create or replace function test_refuse_ticket() returns trigger language plpgsql as $$
        begin if new.ticket_number = '${REFUSED_TICKET}' then raise exception 'refused for the test' using errcode = 'PW409'; end if; return new; end $$;
        create trigger test_refuse_ticket before insert on deliveries for each row execute function test_refuse_ticket();`),
    );
  });
  afterAll(async () => {
    await db.execute(sql.raw("drop trigger if exists test_refuse_ticket on deliveries; drop function if exists test_refuse_ticket();"));
  });

  it("answers a mixed push exactly as one mutation per push does", async () => {
    const a = await projectWithTeam();
    const b = await projectWithTeam();
    const batched = await push(a.team.superintendent, randomUUID(), scenario(a.project.id));
    const single = randomUUID();
    const oneByOne = [];
    for (const m of scenario(b.project.id)) oneByOne.push(...(await push(b.team.superintendent, single, [m])).results);
    // Expected per SYNC.md: a role that may not write, a bad link or value is rejected, the same id with other values
    // is a conflict (exists), the same id with the same values is applied again.
    expect(batched.results.map(outcome)).toEqual([
      "applied@1",
      "applied@1",
      "rejected:forbidden", // field tests are the inspector's (lib/auth/can)
      "rejected:invalid",
      "applied@1",
      "rejected:invalid",
      "conflict:exists@1",
      "applied@1",
      "applied@2",
      "applied@1",
    ]);
    expect(oneByOne.map(outcome)).toEqual(batched.results.map(outcome));
    expect(batched.lastMutationId).toBe(10);
    const rows = await db.select().from(deliveries).where(eq(deliveries.projectId, a.project.id));
    expect(rows).toHaveLength(3);
    // Change numbers are distinct and every accepted write has its audit entry with the device id.
    const seqs = (await db.execute(sql`select change_seq from placements where project_id = ${a.project.id} union all select change_seq from deliveries where project_id = ${a.project.id} union all select change_seq from field_tests where project_id = ${a.project.id}`)).rows.map((r) => Number(r.change_seq));
    expect(new Set(seqs).size).toBe(seqs.length);
    const audits = await db.select().from(auditEntries).where(eq(auditEntries.projectId, a.project.id));
    expect(audits.filter((e) => e.action === "create")).toHaveLength(4);
    expect(audits.filter((e) => e.action === "update")).toHaveLength(1);
  });

  it("a batch the database refuses is applied one at a time: the refused one is rejected, the rest applied", async () => {
    const { project, team } = await projectWithTeam();
    const placement = validBody("placements");
    const clientId = randomUUID();
    const mutations = [
      create(1, project.id, "placements", placement),
      ...[0, 1, 2, 3].map((i) =>
        create(i + 2, project.id, "deliveries", { ...validBody("deliveries", placement.id as string), ...(i === 1 ? { ticketNumber: REFUSED_TICKET } : {}) }),
      ),
    ];
    const response = await push(team.superintendent, clientId, mutations);
    expect(response.results.map((r) => r.result)).toEqual(["applied", "applied", "rejected", "applied", "applied"]);
    expect(response.results[2].reason).toBe("signed");
    expect(response.lastMutationId).toBe(5);
    const [client] = await db.select().from(syncClients).where(eq(syncClients.id, clientId));
    expect(client.lastMutationId).toBe(5);
    expect(await db.select().from(deliveries).where(eq(deliveries.projectId, project.id))).toHaveLength(3);
    // Sent again (a lost answer): the stored results, nothing doubled.
    const again = await push(team.superintendent, clientId, mutations);
    expect(again.results).toEqual(response.results);
    expect(await db.select().from(syncMutations).where(and(eq(syncMutations.clientId, clientId)))).toHaveLength(5);
  });

  it("a push of 100 creates runs in a fixed, small number of statements", async () => {
    const { project, team } = await projectWithTeam();
    const placement = validBody("placements");
    const clientId = randomUUID();
    await push(team.superintendent, clientId, [create(1, project.id, "placements", placement)]);
    const mutations = Array.from({ length: 100 }, (_, i) => create(i + 2, project.id, "deliveries", validBody("deliveries", placement.id as string)));
    const { value: response, statements } = await countStatements(() => push(team.superintendent, clientId, mutations));
    expect(response.results.every((r) => r.result === "applied")).toBe(true);
    // A bound that does not grow with the number of creates; the exact count, and that it does not
    // grow with the day either, is in sync-push-cost.test.ts [common practice: count, do not guess].
    expect(statements).toBeLessThanOrEqual(24);
  });
});
