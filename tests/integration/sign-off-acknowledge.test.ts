// The signer acknowledges each caution and warning of the rulebook before the signature is stored,
// and the acknowledgements stay with it in the audit trail. Checks: ASTM C94 §10.7 discharge within
// 90 min of batching [ASTM C94]; ACI 318-19 §26.12.2.1 strength samples at least once a day for a
// class of concrete [memory: clause number], as lib/checks/sampling.ts words it.
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db";
import { auditEntries, signOffs, users } from "@/db/schema";
import { POST as signRoute } from "@/app/api/projects/[projectId]/placements/[id]/sign-off/route";
import { GET as findingsRoute } from "@/app/api/projects/[projectId]/placements/[id]/findings/route";
import { hashPassword } from "@/lib/auth/password";
import { transitionPlacement } from "@/lib/placements/transition";
import { createRecord } from "@/lib/records/write";
import { callRoute, projectWithTeam } from "./helpers";
import { validBody } from "./record-fixtures";

const PASSWORD = "inspector-password-2";
const SIGNATURE = "data:image/png;base64,iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==";
let s: Awaited<ReturnType<typeof projectWithTeam>>;

beforeAll(async () => {
  s = await projectWithTeam();
  await db.update(users).set({ passwordHash: await hashPassword(PASSWORD) }).where(eq(users.id, s.team.inspector.id));
});

/** A placed placement of a 32 MPa mix with one truck 99 min from batching to the end of discharge, and no cylinders. */
async function lateTruckNoCylinders() {
  const mix = validBody("mix-designs");
  await createRecord({ user: s.team.office }, "mix-designs", s.project.id, mix);
  const p: Record<string, unknown> = { ...validBody("placements"), mixId: mix.id };
  await createRecord({ user: s.team.superintendent }, "placements", s.project.id, p);
  const d = validBody("deliveries", p.id as string);
  const batched = new Date(d.batchedAt as string).getTime();
  const at = (min: number) => new Date(batched + min * 60_000).toISOString();
  await createRecord({ user: s.team.superintendent }, "deliveries", s.project.id, { ...d, arrivedAt: at(60), dischargeStartedAt: at(70), dischargeFinishedAt: at(99) });
  let v = 1;
  for (const [to, who] of [["ready", "superintendent"], ["cleared", "inspector"], ["placing", "superintendent"], ["placed", "superintendent"]] as const) {
    v = (await transitionPlacement({ user: s.team[who] }, s.project.id, p.id as string, { to, baseVersion: v })).version;
  }
  return { id: p.id as string, version: v };
}

const sign = (id: string, body: Record<string, unknown>) =>
  callRoute(signRoute, { user: s.team.inspector, params: { projectId: s.project.id, id }, body: { password: PASSWORD, typedName: "Ines Marchetti", signatureImage: SIGNATURE, ...body } });

describe("acknowledging the rulebook's findings at sign-off", () => {
  it("lists the late truck and the missing cylinders; refuses a signature that skips one; keeps the acknowledgements in the audit", async () => {
    const p = await lateTruckNoCylinders();
    const listed = await callRoute(findingsRoute, { user: s.team.inspector, params: { projectId: s.project.id, id: p.id } });
    expect(listed.status).toBe(200);
    const findings = listed.json.findings as { rule: string; title: string; subject: { type: string; id: string }; severity: string }[];
    expect(findings.map((f) => f.rule).sort()).toEqual(["discharge-time", "sampling-frequency"]);
    expect(findings.find((f) => f.rule === "discharge-time")!.title).toContain("99 min");
    const keys = findings.map((f) => `${f.rule}:${f.subject.type}:${f.subject.id}:${f.severity}`);

    const none = await sign(p.id, { baseVersion: p.version });
    expect(none.status).toBe(409);
    expect(none.json.error.message).toMatch(/Acknowledge each warning before signing/);
    expect(none.json.error.message).toContain("No cylinders made");
    const one = await sign(p.id, { baseVersion: p.version, acknowledged: [keys[0]] });
    expect(one.status).toBe(409);
    expect(await db.select().from(signOffs).where(eq(signOffs.recordId, p.id))).toHaveLength(0);

    const ok = await sign(p.id, { baseVersion: p.version, acknowledged: keys });
    expect(ok.status).toBe(200);
    const [audit] = await db
      .select()
      .from(auditEntries)
      .where(and(eq(auditEntries.recordId, ok.json.signOff.id), eq(auditEntries.action, "sign")));
    const kept = (audit.after as { acknowledged: { key: string; title: string }[] }).acknowledged;
    expect(kept.map((k) => k.key).sort()).toEqual([...keys].sort());
    expect(kept.map((k) => k.title).join(" | ")).toContain("Late truck");
  });

  it("a placement the rulebook says nothing about signs with no acknowledgement", async () => {
    const p = validBody("placements");
    await createRecord({ user: s.team.superintendent }, "placements", s.project.id, p);
    let v = 1;
    for (const [to, who] of [["ready", "superintendent"], ["cleared", "inspector"], ["placing", "superintendent"], ["placed", "superintendent"]] as const) {
      v = (await transitionPlacement({ user: s.team[who] }, s.project.id, p.id as string, { to, baseVersion: v })).version;
    }
    const listed = await callRoute(findingsRoute, { user: s.team.inspector, params: { projectId: s.project.id, id: p.id as string } });
    expect(listed.json.findings).toEqual([]);
    expect((await sign(p.id as string, { baseVersion: v })).status).toBe(200);
  });
});
