// Finding 14 (remainder). Attacks:
// 1. An unsubscribe link never expired and carried no nonce: a link from an old e-mail (forwarded,
//    leaked, kept by a scanner) unsubscribed the person for ever. Now every digest carries a new
//    link and the older ones stop working: the old link is refused with a message, nothing changes.
// 2. Reading the recipient list (a GET, any member, even an owner) inserted rows. Now an owner's
//    row is written with the membership, and a GET changes no row.
import nodemailer from "nodemailer";
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import * as unsubscribeRoute from "@/app/api/digest/unsubscribe/route";
import * as recipientsRoute from "@/app/api/projects/[projectId]/digest/recipients/route";
import { db } from "@/db";
import { digestRecipients } from "@/db/schema";
import { REPLACED_LINK_MESSAGE } from "@/lib/digest/recipients";
import { sendDigest } from "@/lib/digest/send";
import { addMembership, callRoute, createUser, projectWithTeam } from "../integration/helpers";
import { tableCounts } from "./attack";

let s: Awaited<ReturnType<typeof projectWithTeam>>;
beforeAll(async () => {
  s = await projectWithTeam();
});

/** Sends the day's digest into memory (nodemailer's JSON transport) and returns the owner's unsubscribe token. */
async function digestToken(date: string): Promise<string> {
  const sent: string[] = [];
  const transport = nodemailer.createTransport({ jsonTransport: true });
  const original = transport.sendMail.bind(transport);
  transport.sendMail = (async (mail: nodemailer.SendMailOptions) => {
    if (mail.to === s.team.owner.email.toLowerCase()) sent.push(String(mail.text));
    return original(mail);
  }) as typeof transport.sendMail;
  await sendDigest(s.project.id, date, { transport, origin: "http://localhost:3100" });
  expect(sent).toHaveLength(1);
  return sent[0].match(/unsubscribe\?token=([A-Za-z0-9_.-]+)/)![1];
}

const unsubscribe = (token: string) => callRoute(unsubscribeRoute.POST, { method: "POST", url: `/api/digest/unsubscribe?token=${token}` });
const ownerRow = async () =>
  (await db.select().from(digestRecipients).where(eq(digestRecipients.projectId, s.project.id))).find((r) => r.userId === s.team.owner.id)!;

describe("unsubscribe links rotate (finding 14)", () => {
  it("the link of an older digest stops working once a newer one is sent; the newest works", async () => {
    const older = await digestToken("2026-11-16");
    const newer = await digestToken("2026-11-17");
    expect(newer).not.toBe(older);
    const before = await ownerRow();
    const stale = await unsubscribe(older);
    expect(stale.status).toBe(400);
    expect(stale.json.error.message).toBe(REPLACED_LINK_MESSAGE);
    expect(await ownerRow()).toEqual(before); // still receiving
    const ok = await unsubscribe(newer);
    expect(ok.status).toBe(200);
    expect((await ownerRow()).unsubscribedAt).not.toBeNull();
  });
});

describe("reading the recipient list writes nothing (finding 14)", () => {
  it("an owner added to the project is on the list at once, and every GET leaves every table as it was", async () => {
    const newOwner = await createUser({ name: "Oona Owner (second)" });
    await addMembership(newOwner.id, s.project.id, "owner");
    const counts = await tableCounts();
    const office = await callRoute(recipientsRoute.GET, { user: s.team.office, params: { projectId: s.project.id } });
    expect(office.status).toBe(200);
    expect(office.json.recipients.map((r: { email: string }) => r.email)).toContain(newOwner.email.toLowerCase());
    const own = await callRoute(recipientsRoute.GET, { user: newOwner, params: { projectId: s.project.id } });
    expect(own.json.recipients.map((r: { email: string; status: string }) => [r.email, r.status])).toEqual([[newOwner.email.toLowerCase(), "receiving"]]);
    await callRoute(recipientsRoute.GET, { user: s.team.owner, params: { projectId: s.project.id } });
    expect(await tableCounts()).toEqual(counts);
  });
});
