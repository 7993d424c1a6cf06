import { mkdirSync, writeFileSync } from "node:fs";
import { expect, test, type Page } from "@playwright/test";
import { DEMO, MAILBOX, signIn } from "./support";

// Issue 17: the office's and the owner's outputs as a person sees them, at a phone's width (390×844)
// and a desktop's (1440×900): the review's CSV buttons, the lab page, the digest e-mail as received,
// and the daily report PDF (saved for rendering to PNG). Nothing may run off the side of a phone
// [common practice: WCAG 2.1 SC 1.4.10 Reflow, content at 320 CSS px without horizontal scrolling].

const LARKSPUR = "6f1c3e20-8d44-4b7e-b1a2-00000000000a";
const DAY = "2026-11-20"; // the demo day with the held shear walls, trucks and tests (scripts/seed)
const SIZES = { 390: { width: 390, height: 844 }, 1440: { width: 1440, height: 900 } } as const;
const DIR = ".data/screenshots/outputs";

async function noSideways(page: Page, what: string) {
  const { scroll, width } = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, width: window.innerWidth }));
  expect(scroll, `${what}: no horizontal scrolling`).toBeLessThanOrEqual(width);
}

test("the review's CSV buttons, the lab page, the digest e-mail and the daily PDF at phone and desktop size", async ({ browser }) => {
  test.setTimeout(240_000);
  mkdirSync(DIR, { recursive: true });
  const context = await browser.newContext({ viewport: SIZES[1440] });
  const olu = await context.newPage();
  await signIn(olu, DEMO.olu);

  for (const [size, viewport] of Object.entries(SIZES)) {
    await olu.setViewportSize(viewport);
    await olu.goto("/review");
    await olu.getByTestId("placements-filter-from").fill(DAY);
    await olu.getByTestId("placements-filter-to").fill(DAY);
    for (const testId of ["placements-csv", "placements-csv-si"]) {
      const csv = olu.getByTestId(testId);
      await csv.scrollIntoViewIfNeeded();
      const box = (await csv.boundingBox())!;
      expect(box.x).toBeGreaterThanOrEqual(0);
      expect(box.x + box.width).toBeLessThanOrEqual(viewport.width);
      if (viewport.width < 768) expect(box.height, "a tap target of at least 44 px on a phone [WCAG 2.1 SC 2.5.5]").toBeGreaterThanOrEqual(44);
      // One line of 14 px text with its padding: a label broken over two lines is taller than 48 px.
      expect(box.height, `${testId} keeps its label on one line`).toBeLessThanOrEqual(48);
      await expect(csv).toContainText("CSV");
    }
    await olu.screenshot({ path: `${DIR}/review-csv-${size}.png` });

    await olu.goto("/lab");
    await expect(olu.getByRole("heading", { level: 1 })).toBeVisible();
    await noSideways(olu, `lab page at ${size}`);
    await olu.screenshot({ path: `${DIR}/lab-${size}.png`, fullPage: true });
  }

  // The daily report PDF, saved to be rendered page by page (pdftoppm) and looked at.
  const pdf = await olu.request.get(`/api/projects/${LARKSPUR}/reports/daily?date=${DAY}`);
  expect(pdf.ok()).toBe(true);
  expect(pdf.headers()["content-type"]).toContain("application/pdf");
  writeFileSync(`${DIR}/daily-${DAY}.pdf`, await pdf.body());

  // The digest e-mail as the owner receives it.
  const since = Date.now() - 1000;
  const send = await olu.request.post(`/api/projects/${LARKSPUR}/digest/send`, { data: { date: DAY } });
  expect(send.ok()).toBe(true);
  let html = "";
  await expect(async () => {
    const list = (await (await fetch(`${MAILBOX}/messages?to=${encodeURIComponent(DEMO.oona)}`)).json()) as { html: string; receivedAt: string }[];
    const mail = list.reverse().find((m) => Date.parse(m.receivedAt) >= since || m.html.includes("Shear walls SW-1 to SW-4"));
    expect(mail).toBeDefined();
    html = mail!.html;
  }).toPass({ timeout: 20_000 });
  for (const [size, viewport] of Object.entries(SIZES)) {
    await olu.setViewportSize(viewport);
    await olu.setContent(html);
    await noSideways(olu, `digest e-mail at ${size}`);
    await olu.screenshot({ path: `${DIR}/digest-${size}.png`, fullPage: true });
  }
  await context.close();
});
