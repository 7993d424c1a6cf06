// Findings 4–7: open redirect in the e-mailed link, conflict resolution by someone who may not,
// an amendment id that reads across projects, and formulae in the CSV export. Each test performs the
// attack, asserts the refusal and that nothing changed.
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { POST as amendRoute } from "@/app/api/projects/[projectId]/placements/[id]/amendments/route";
import { POST as pushRoute } from "@/app/api/sync/push/route";
import { POST as linkRoute } from "@/app/api/sign-in-link/route";
import { db } from "@/db";
import { amendments, conflicts, placements } from "@/db/schema";
import { safeCallbackPath } from "@/lib/auth/callback-url";
import { placementsCsv } from "@/lib/review/csv";
import type { PlacementReviewRow } from "@/lib/review/query-schemas";
import { SYNC_SCHEMA_VERSION } from "@/lib/sync/protocol";
import { callRoute, createUser } from "../integration/helpers";
import { makeRecord } from "../integration/record-fixtures";
import { APP_URL, tableCounts } from "./attack";
import { signedPlacement, teamWithPasswords, type Setup } from "./fixtures";

const mailbox = process.env.MAILBOX_URL ?? "http://127.0.0.1:2581";
async function lastMailTo(address: string): Promise<string> {
  for (let i = 0; i < 50; i++) {
    const list = (await (await fetch(`${mailbox}/messages?to=${encodeURIComponent(address)}`)).json()) as { text: string }[];
    if (list.length) return list[list.length - 1].text;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail for ${address}`);
}

// Browsers read "\" as "/" and drop tab and newline in special-scheme URLs [WHATWG URL Standard].
const ESCAPES = ["/\\evil.example", "/\t/evil.example", "/\n/evil.example", "//evil.example", "\\\\evil.example", "https://evil.example/x", "javascript:alert(1)"];

describe("finding 4: open redirect after sign-in", () => {
  it.each(ESCAPES.map((e) => [JSON.stringify(e), e]))("%s never leaves the app, in the form or in the e-mailed link", async (_label, escape) => {
    expect(new URL(safeCallbackPath(escape), APP_URL).origin).toBe(new URL(APP_URL).origin);
    const user = await createUser();
    expect((await callRoute(linkRoute, { body: { email: user.email, callbackUrl: escape } })).status).toBe(200);
    const link = (await lastMailTo(user.email)).match(/https?:\/\/\S+/)![0];
    const callback = new URL(link).searchParams.get("callbackUrl")!;
    // The browser resolves the callback against the page it is on: it must stay on our origin.
    expect(new URL(callback, APP_URL).origin).toBe(new URL(APP_URL).origin);
  });

  it("a same-origin path with its query survives", () => {
    expect(safeCallbackPath("/review?tab=diaries#top")).toBe("/review?tab=diaries#top");
  });
});

describe("finding 5: resolving a conflict needs its author or the right to write the record", () => {
  let s: Setup;
  beforeAll(async () => {
    s = await teamWithPasswords();
  });

  async function openConflict() {
    const placement = await makeRecord("placements", s.project.id, s.team);
    const [c] = await db
      .insert(conflicts)
      .values({
        projectId: s.project.id,
        recordType: "placements",
        recordId: placement.id,
        baseVersion: 1,
        serverVersion: 1,
        clientPayload: { name: "update", args: { patch: { element: "Level 2 slab, pour 3" } } },
        reason: "stale",
        createdBy: s.team.superintendent.id,
      })
      .returning();
    return { placement, conflict: c };
  }
  const resolve = (user: Setup["outsider"], placementId: string, conflictId: string) =>
    callRoute(pushRoute, {
      user,
      body: {
        clientId: randomUUID(),
        schemaVersion: SYNC_SCHEMA_VERSION,
        mutations: [{ id: 1, name: "resolve", recordType: "placements", projectId: s.project.id, recordId: placementId, args: { conflictId, patch: {} }, baseVersion: 1 }],
      },
    });

  it("an owner and an inspector cannot discard the superintendent's values; the conflict stays open", async () => {
    const { placement, conflict } = await openConflict();
    for (const who of ["owner", "inspector"] as const) {
      const res = await resolve(s.team[who], placement.id, conflict.id);
      expect(res.json.results[0], who).toMatchObject({ result: "rejected", reason: "forbidden" });
    }
    const [still] = await db.select().from(conflicts).where(eq(conflicts.id, conflict.id));
    expect(still.resolvedAt).toBeNull();
    expect(still.resolvedBy).toBeNull();
  });

  it("the author resolves it", async () => {
    const { placement, conflict } = await openConflict();
    const res = await resolve(s.team.superintendent, placement.id, conflict.id);
    expect(res.json.results[0]).toMatchObject({ result: "applied" });
    const [closed] = await db.select().from(conflicts).where(eq(conflicts.id, conflict.id));
    expect(closed.resolvedBy).toBe(s.team.superintendent.id);
  });
});

describe("finding 6: an amendment id from another project", () => {
  it("is refused (409) instead of answering with the other project's amendment; nothing written", async () => {
    const a = await teamWithPasswords();
    const b = await teamWithPasswords();
    const pa = await signedPlacement(a);
    const pb = await signedPlacement(b);
    const secret = { id: randomUUID(), what: "Cylinder set 4 was dropped at the lab", why: "Reported by the lab on the 18th" };
    expect((await callRoute(amendRoute, { user: a.team.inspector, params: { projectId: a.project.id, id: pa.id }, body: secret })).status).toBe(200);

    const before = await tableCounts();
    const probe = await callRoute(amendRoute, {
      user: b.team.inspector,
      params: { projectId: b.project.id, id: pb.id },
      body: { id: secret.id, what: "probe probe", why: "probe probe" },
    });
    expect(probe.status).toBe(409);
    expect(JSON.stringify(probe.json)).not.toContain("dropped at the lab");
    expect(await tableCounts()).toEqual(before);
    const [kept] = await db.select().from(amendments).where(and(eq(amendments.id, secret.id), eq(amendments.projectId, a.project.id)));
    expect(kept.what).toBe(secret.what);
    expect((await db.select().from(placements).where(eq(placements.id, pb.id)))[0].state).toBe("signed");
  });
});

describe("finding 7: CSV formula injection", () => {
  it("cells typed on site that start with = + - @ are quoted with ' so a spreadsheet shows text", () => {
    const row = {
      date: "2026-11-17",
      projectName: "@SUM(A1:A9)",
      element: '=HYPERLINK("http://evil.example","Slab")',
      level: "+1",
      grid: "-A",
      mixCode: "\t=1+1",
      orderedM3: 12,
      placedM3: -1,
      trucks: 2,
      lateTrucks: 0,
      waterAddedL: 0,
      testsOut: 0,
      evaporationRisk: null,
      state: "placed",
      signedBy: "=cmd|' /C calc'!A0",
    } as unknown as PlacementReviewRow;
    const csv = placementsCsv([row]);
    const cells = csv.split("\r\n")[1];
    // [OWASP, CSV Injection: prefix cells starting with = + - @ tab CR with a single quote]
    for (const cell of ['"\'=HYPERLINK', '"\'@SUM', '"\'\t=1+1"', "\"'=cmd"]) expect(cells).toContain(cell);
    expect(cells).toContain(",-1,"); // numbers stay numbers
  });
});
