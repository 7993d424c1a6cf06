// One placement state, one look: the held shear walls of the demo (Larkspur Commons, 20 November
// 2026) show the same word, the same colours and a symbol on the superintendent's phone, in the
// office's review table and in the owner's digest e-mail, and those colours are the palette's.
// Screenshots of the screens that use the vocabulary, at phone and desktop size, go to .data/.
import { expect, test, type Locator, type Page } from "@playwright/test";
import { PLACEMENT_STATE_WORDS, toneHex } from "@/lib/ui/vocabulary";
import { DEMO, MAILBOX, signIn } from "./support";

const LARKSPUR = "6f1c3e20-8d44-4b7e-b1a2-00000000000a";
const HELD_WALLS = "5eed0000-0000-4000-8000-000000000205"; // "Shear walls SW-1 to SW-4, level 2 to 3", held
const DAY = "2026-11-20";
const HELD = PLACEMENT_STATE_WORDS.held;

type Look = { label: string; color: string; background: string; border: string };

const rgb = (hex: string) => `rgb(${[1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16)).join(", ")})`;
const expected = (): Look => {
  const t = toneHex(HELD.tone);
  return { label: HELD.label, color: rgb(t.text), background: rgb(t.bg), border: rgb(t.border) };
};

/** The word and the computed colours of a badge, as the browser draws them. */
async function lookOf(badge: Locator): Promise<Look> {
  return badge.evaluate((el) => {
    const s = getComputedStyle(el);
    return { label: el.querySelector("[data-part=label]")?.textContent?.trim() ?? "", color: s.color, background: s.backgroundColor, border: s.borderTopColor };
  });
}

async function shot(page: Page, name: string) {
  await page.waitForTimeout(300);
  await page.screenshot({ path: `.data/screenshots/vocabulary-${name}.png`, fullPage: true });
}

test("a held placement has the same word and colours in Field, Review and the digest e-mail", async ({ browser }) => {
  test.setTimeout(180_000);
  const want = expected();
  expect(want.label).toBe("Held");

  // Field: the superintendent's placement screen, on a phone.
  const field = await browser.newContext({ viewport: { width: 390, height: 844 } });
  const sam = await field.newPage();
  await signIn(sam, DEMO.sam);
  const fieldBadge = sam.getByTestId("placement-title").locator("xpath=..").getByTestId("placement-state");
  await expect(async () => {
    await sam.goto(`/field/placement?id=${HELD_WALLS}`);
    await expect(fieldBadge).toHaveAttribute("data-code", "held", { timeout: 8_000 });
  }).toPass({ timeout: 60_000 });
  const inField = await lookOf(fieldBadge);
  expect(inField).toEqual(want);
  await expect(sam.getByTestId("hold-banner")).toHaveAttribute("data-tone", HELD.tone);
  await expect(sam.getByTestId("placement-who-next")).toHaveText("This placement is held. You can ask for inspection.");
  await shot(sam, "field-held-390");
  await sam.setViewportSize({ width: 1440, height: 900 });
  await shot(sam, "field-held-1440");
  await field.close();

  // Review: the office's table, filtered to that day.
  const office = await browser.newContext({ viewport: { width: 1440, height: 900 } });
  const olu = await office.newPage();
  await signIn(olu, DEMO.olu);
  await olu.goto("/review");
  await olu.getByTestId("placements-filter-from").fill(DAY);
  await olu.getByTestId("placements-filter-to").fill(DAY);
  const row = olu.getByTestId("placements-table-row").filter({ hasText: "Shear walls SW-1 to SW-4, level 2 to 3" });
  await expect(row).toHaveCount(1);
  const inReview = await lookOf(row.getByTestId("placement-state"));
  expect(inReview).toEqual(want);
  await shot(olu, "review-table-1440");
  await olu.setViewportSize({ width: 390, height: 844 });
  await shot(olu, "review-table-390");
  await olu.setViewportSize({ width: 1440, height: 900 });
  await olu.goto(`/projects/${LARKSPUR}/placements/${HELD_WALLS}/review`);
  expect(await lookOf(olu.getByTestId("placement-state"))).toEqual(want);
  await shot(olu, "review-detail-1440");

  // The digest e-mail: the preview the office sees, and the message the owner receives.
  const preview = await olu.request.get(`/api/projects/${LARKSPUR}/digest/preview?date=${DAY}&format=json`);
  expect(preview.ok()).toBe(true);
  const previewHtml = ((await preview.json()) as { html: string }).html;
  const send = await olu.request.post(`/api/projects/${LARKSPUR}/digest/send`, { data: { date: DAY } });
  expect(send.ok()).toBe(true);
  const report = (await send.json()) as { sent: string[]; alreadySent: string[] };
  const owner = [...report.sent, ...report.alreadySent].find((e) => e === DEMO.oona);
  expect(owner, "the owner is on the digest list of Larkspur Commons (demo scenario)").toBe(DEMO.oona);
  let mailHtml = "";
  await expect(async () => {
    const list = (await (await fetch(`${MAILBOX}/messages?to=${encodeURIComponent(DEMO.oona)}`)).json()) as { subject: string; html: string }[];
    const mail = list.reverse().find((m) => m.subject.includes("Nov 20") || m.subject.includes("November 20") || m.html.includes("Shear walls SW-1 to SW-4, level 2 to 3"));
    expect(mail).toBeDefined();
    mailHtml = mail!.html;
  }).toPass({ timeout: 20_000 });

  for (const [name, html] of [["preview", previewHtml], ["mail", mailHtml]] as const) {
    await olu.setViewportSize({ width: 1440, height: 900 });
    await olu.setContent(html);
    const badge = olu.locator('[data-state-badge="held"]');
    await expect(badge).toHaveCount(1);
    expect(await lookOf(badge), name).toEqual(want);
    await shot(olu, `digest-${name}-1440`);
    await olu.setViewportSize({ width: 390, height: 844 });
    await shot(olu, `digest-${name}-390`);
  }
  expect(inField).toEqual(inReview);
  await office.close();
});
