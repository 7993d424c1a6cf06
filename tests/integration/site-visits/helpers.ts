// The inspection log (issue 7 item 7 and its acceptance): a finding's life through the sync push
// with the roles allowed at each step, and a signed visit report frozen like a signed placement
// (records route, sync push, raw SQL). Roles: issue 7 ("the superintendent answers a finding …;
// the inspector closes it after re-inspection or reopens it") [product brief].
import { randomUUID } from "node:crypto";
import { eq, sql } from "drizzle-orm";
import { beforeAll, expect } from "vitest";
import { POST as signRoute } from "@/app/api/projects/[projectId]/site-visits/[id]/sign-off/route";
import { POST as pushRoute } from "@/app/api/sync/push/route";
import { db } from "@/db";
import { findings, siteVisits } from "@/db/schema";
import { SYNC_SCHEMA_VERSION, type Mutation } from "@/lib/sync/protocol";
import { callRoute, projectWithSigningInspectors, projectWithTeam, type TestUser } from "../helpers";
import { validBody } from "../record-fixtures";

export const PASSWORD = "inspector-password-7";
export const SIGNATURE = "data:image/png;base64,iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==";

type Setup = Awaited<ReturnType<typeof projectWithTeam>>;
export let s: Setup;
export let otherInspector: TestUser;

/** One device per user, with its own mutation counter (SYNC.md: ids rise by one per client). */
const devices = new Map<string, { clientId: string; next: number }>();
export async function push(user: TestUser, m: Omit<Mutation, "id" | "projectId">) {
  const device = devices.get(user.id) ?? { clientId: randomUUID(), next: 1 };
  devices.set(user.id, device);
  const mutation = { ...m, id: device.next++, projectId: s.project.id } as Mutation;
  const res = await callRoute(pushRoute, { user, body: { clientId: device.clientId, schemaVersion: SYNC_SCHEMA_VERSION, mutations: [mutation] } });
  expect(res.status).toBe(200);
  return res.json.results[0] as { result: string; reason?: string; conflictId?: string; message?: string; record?: { version: number } };
}

export const findingRow = async (id: string) => (await db.select().from(findings).where(eq(findings.id, id)))[0];
export const visitRow = async (id: string) => (await db.select().from(siteVisits).where(eq(siteVisits.id, id)))[0];
export const move = (user: TestUser, id: string, args: Record<string, unknown>, baseVersion: number) =>
  push(user, { name: "transition", recordType: "findings", recordId: id, args, baseVersion });

export async function newVisit() {
  const visit = validBody("site-visits");
  expect((await push(s.team.inspector, { name: "create", recordType: "site-visits", recordId: visit.id as string, args: visit })).result).toBe("applied");
  const finding = validBody("findings", visit.id as string);
  expect((await push(s.team.inspector, { name: "create", recordType: "findings", recordId: finding.id as string, args: finding })).result).toBe("applied");
  return { visitId: visit.id as string, findingId: finding.id as string };
}

export async function pgErrorOf(statement: ReturnType<typeof sql>): Promise<{ code?: string }> {
  try {
    await db.execute(statement);
  } catch (error) {
    return (error as { cause?: { code?: string } }).cause ?? (error as { code?: string });
  }
  return {};
}

export const sign = (user: TestUser, id: string, body: Record<string, unknown>) =>
  callRoute(signRoute, { user, params: { projectId: s.project.id, id }, body: { password: PASSWORD, typedName: "Ines Marchetti", signatureImage: SIGNATURE, ...body } });

/** Submits the report through the sync push and returns the version to sign. */
export async function submit(visitId: string) {
  const v = await visitRow(visitId);
  expect((await push(s.team.inspector, { name: "transition", recordType: "site-visits", recordId: visitId, args: { to: "submitted" }, baseVersion: v.version })).result).toBe("applied");
  return (await visitRow(visitId)).version;
}

/** A project with its team and an inspector of another project, both inspectors with PASSWORD, made before the calling file's tests. */
export function setUpSiteVisits() {
  beforeAll(async () => {
    ({ setup: s, otherInspector } = await projectWithSigningInspectors(PASSWORD));
  });
}
