// The digest job for the demo project and a demo day: one e-mail per recipient, no rerun, signed unsubscribe links, the preview.
import { and, eq } from "drizzle-orm";
import { NextRequest } from "next/server";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import { sentDigests } from "@/db/schema";
import * as preview from "@/app/api/projects/[projectId]/digest/preview/route";
import * as recipientsRoute from "@/app/api/projects/[projectId]/digest/recipients/route";
import * as sendRoute from "@/app/api/projects/[projectId]/digest/send/route";
import * as unsubscribeRoute from "@/app/api/digest/unsubscribe/route";
import { activeRecipients } from "@/lib/digest/recipients";
import { runDigestJob } from "@/lib/digest/worker";
import { callRoute, sessionCookie } from "../helpers";
import { LARKSPUR, DAY, NEXT_ACTIVE_DAY, office, owner, added, Stored, mailTo, waitForMail, raw, setUpDigest } from "./helpers";

setUpDigest();

describe("the digest job for Larkspur Commons on 2026-11-17", () => {
  const first: Stored[] = [];

  it("the office adds an address; the owner cannot", async () => {
    const refused = await callRoute(recipientsRoute.POST, { user: owner, params: { projectId: LARKSPUR }, body: { email: "someone@example.test" } });
    expect(refused.status).toBe(403);
    const res = await callRoute(recipientsRoute.POST, { user: office, params: { projectId: LARKSPUR }, body: { email: added.toUpperCase() } });
    expect(res.status).toBe(201);
    expect(res.json.email).toBe(added);
    const again = await callRoute(recipientsRoute.POST, { user: office, params: { projectId: LARKSPUR }, body: { email: added } });
    expect(again.status).toBe(409);
  });

  it("sends one e-mail per recipient, with the subject, the placements and the warnings", async () => {
    const since = new Date();
    const expected = (await activeRecipients(LARKSPUR)).map((r) => r.email).sort();
    expect(expected).toEqual(expect.arrayContaining([owner.email, added]));

    const report = await runDigestJob({ projectId: LARKSPUR, date: DAY });
    expect([...report!.sent].sort()).toEqual(expected);

    for (const email of expected) {
      const mails = await waitForMail(email, since, "Nov 17");
      expect(mails, email).toHaveLength(1);
      first.push(mails[0]);
    }
    const mail = await raw(first.find((m) => m.to.includes(added))!);
    expect(mail.subject).toBe("Larkspur Commons, Tue, Nov 17: 1 placement, 5 warnings");
    expect(mail.to && "text" in mail.to ? mail.to.text : "").toContain(added);
    // Placements of the day with volume in the project's units, state and signature.
    expect(mail.text).toContain("Level 2 deck [Placed]");
    expect(mail.text).toContain("118.0 yd³ planned · 30.0 yd³ delivered in 3 trucks");
    expect(mail.text).toContain("Not signed yet");
    // Warnings: the rulebook's findings (lib/checks), each naming its rule and who governs.
    expect(mail.text).toContain("! Warning: High evaporation: 0.449 lb/ft²/h (2:00 PM · Level 2 deck)");
    expect(mail.text).toContain("0.1 lb/ft²/h, half the ACI 305R level for a low-bleed mix");
    expect(mail.text).toContain("The project specification, local codes and the engineer of record govern");
    expect(mail.text).toContain("! Caution: Slump out of tolerance: 6.5 in (range 3.0–5.0 in)");
    expect(mail.text).toContain("Rejected: Concrete at 97 °F on arrival");
    expect(mail.text).toContain("Crew on site: 17");
    expect(mail.html).toContain('data-rule="evaporation" data-severity="warning"');
    expect(mail.html).toContain('data-rule="slump" data-severity="caution"');
    expect(mail.html).toContain(`/projects/${LARKSPUR}?date=${DAY}`);
    const listUnsubscribe = mail.headerLines.find((h) => h.key === "list-unsubscribe")?.line ?? "";
    expect(listUnsubscribe).toContain("/api/digest/unsubscribe?token=");
    expect(mail.headerLines.find((h) => h.key === "list-unsubscribe-post")?.line).toContain("List-Unsubscribe=One-Click");
  });

  it("running the job again sends nothing", async () => {
    const since = new Date();
    const report = await runDigestJob({ projectId: LARKSPUR, date: DAY });
    expect(report!.sent).toEqual([]);
    expect(report!.alreadySent.sort()).toEqual(first.map((m) => m.to[0]).sort());
    const sendNow = await callRoute(sendRoute.POST, { user: office, params: { projectId: LARKSPUR }, body: { date: DAY } });
    expect(sendNow.status).toBe(200);
    expect(sendNow.json.sent).toEqual([]);
    await new Promise((r) => setTimeout(r, 500));
    for (const m of first) expect(await mailTo(m.to[0], since, "Nov 17")).toHaveLength(0);
    const rows = await db.select().from(sentDigests).where(and(eq(sentDigests.projectId, LARKSPUR), eq(sentDigests.date, DAY)));
    expect(rows.map((r) => r.status)).toEqual(first.map(() => "sent"));
  });

  it("refuses a tampered unsubscribe link and honours the genuine one: the next digest skips the address", async () => {
    const mail = await raw(first.find((m) => m.to.includes(added))!);
    const href = String(mail.html).match(/href="([^"]+)"[^>]*data-link="unsubscribe"/)![1].replace(/&amp;/g, "&");
    const token = new URL(href).searchParams.get("token")!;
    const [payload, signature] = token.split(".");
    const forged = Buffer.from(JSON.stringify({ ...JSON.parse(Buffer.from(payload, "base64url").toString()), e: owner.email })).toString("base64url");
    for (const bad of [`${payload}.${signature.slice(0, -2)}xx`, `${forged}.${signature}`, payload, ""]) {
      const res = await callRoute(unsubscribeRoute.POST, { method: "POST", url: `/api/digest/unsubscribe?token=${bad}` });
      expect(res.status, bad).toBe(400);
    }
    const ok = await callRoute(unsubscribeRoute.POST, { method: "POST", url: `/api/digest/unsubscribe?token=${token}` });
    expect(ok.status).toBe(200);
    expect(ok.json.email).toBe(added);

    const since = new Date();
    const report = await runDigestJob({ projectId: LARKSPUR, date: NEXT_ACTIVE_DAY });
    expect(report!.sent).toContain(owner.email);
    expect(report!.sent).not.toContain(added);
    expect(await waitForMail(owner.email, since, "Nov 19")).toHaveLength(1);
    expect(await mailTo(added, since, "")).toHaveLength(0);
  });

  it("previews the day as HTML for the office only", async () => {
    const url = `/api/projects/${LARKSPUR}/digest/preview?date=${DAY}`;
    const req = new NextRequest(new URL(url, "http://localhost:3100"), { headers: { cookie: await sessionCookie(office) } });
    const asOffice = await preview.GET(req, { params: Promise.resolve({ projectId: LARKSPUR }) });
    expect(asOffice.status).toBe(200);
    expect(asOffice.headers.get("content-type")).toContain("text/html");
    expect(await asOffice.text()).toContain("Level 2 deck");
    expect((await callRoute(preview.GET, { user: owner, url, params: { projectId: LARKSPUR } })).status).toBe(403);
  });
});
