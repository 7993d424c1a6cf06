import { mkdirSync } from "node:fs";
import { expect, test, type Browser, type BrowserContextOptions, type Locator, type Page } from "@playwright/test";
import { TodayPage } from "./field-pages";
import { InspectionPage } from "./inspection-pages";
import { DEMO, DEMO_PASSWORD, signIn } from "./support";

// Issue 17, what was left: the hold says how much concrete is already on the placement (in the
// project's units); the weather form fits a 390 px phone; move hints say what the reader can do; a new
// site visit asks which project; the visit report uses the project's clock, not the device's; a saved
// finding names its placement; a signed report shows its values in full as text; a pending invitation
// shows in People at once.

const PHONE = { width: 390, height: 844 };
const DESKTOP = { width: 1440, height: 900 };
// 1 yd³ = 0.764554857984 m³ exactly (NIST Handbook 44, Appendix C); ipDigits/siDigits 2 on screen.
const PROJECTS = {
  IP: { name: "Larkspur Commons", mix: "LC-4000-A", least: "12", trucks: ["10", "6.5"], total: "16.50 yd³" },
  SI: { name: "Millrace Pump House", mix: "MPH-30", least: "300", trucks: ["8", "4.25"], total: "12.25 m³" },
} as const;

async function person(browser: Browser, email: string, options: BrowserContextOptions): Promise<Page> {
  const context = await browser.newContext(options);
  const page = await context.newPage();
  await signIn(page, email);
  const today = new TodayPage(page);
  await today.open();
  await expect(page.getByTestId("field-project-switcher")).toBeVisible({ timeout: 30_000 });
  await today.waitAllSaved();
  return page;
}

/** Every box of `inner` lies within `outer`'s box (1 px of rounding allowed). */
async function expectInside(outer: Locator, inner: Locator) {
  const o = (await outer.boundingBox())!;
  for (const box of await inner.evaluateAll((els) => els.map((e) => e.getBoundingClientRect().toJSON() as DOMRect))) {
    expect(box.left, "left edge inside the card").toBeGreaterThanOrEqual(o.x - 1);
    expect(box.right, "right edge inside the card").toBeLessThanOrEqual(o.x + o.width + 1);
  }
}

test("a hold on a placement with trucks on it says how much concrete is already there, in the project's units", async ({ browser }) => {
  test.setTimeout(600_000);
  mkdirSync(".data/screenshots", { recursive: true });
  const sam = new InspectionPage(await person(browser, DEMO.sam, { viewport: PHONE }));
  const ines = new InspectionPage(await person(browser, DEMO.ines, { viewport: DESKTOP }));
  for (const [units, p] of Object.entries(PROJECTS)) {
    const stamp = `${units}-${Date.now().toString(36).toUpperCase()}`;
    await new TodayPage(sam.page).open();
    const id = await new TodayPage(sam.page).planPlacement({ project: p.name, element: `E2E hold figure ${stamp}`, least: p.least, volume: "30", mixCode: p.mix });
    await expect(sam.page.getByTestId("placement-who-next")).toHaveText("This placement is planned. You can ask for inspection.");

    if (units === "SI") {
      // The weather form on a 390 px phone: every input and select inside its card.
      await sam.page.getByTestId("add-weather").click();
      const form = sam.page.getByTestId("weather-form");
      await expect(form).toBeVisible();
      // Inside the card's content box: inputs, their unit boxes, the "Now" button, the sun choices.
      await expectInside(form, form.locator("input, select, button, label, fieldset, span"));
      const formBox = (await form.boundingBox())!;
      expect(formBox.x + formBox.width).toBeLessThanOrEqual(PHONE.width);
      expect(await sam.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(PHONE.width);
      await sam.shoot("weather-form-390");
      await form.getByRole("button", { name: /cancel/i }).click();
    }

    await sam.startReadiness();
    await sam.answerAllYes();
    await sam.page.getByTestId("transition-ready").click();
    await expect(sam.state()).toHaveText("Ready for inspection");
    // Two trucks on work not yet cleared (each asks why, PlacementPage.saveTruck answers).
    for (const [i, volume] of p.trucks.entries()) await sam.addTruck({ ticket: `H${i + 1}-${stamp}`, volume });
    await sam.waitAllSaved();

    await ines.waitForState(id, "Ready for inspection");
    await expect(ines.page.getByTestId("placement-who-next")).toHaveText(
      "This placement is ready for inspection. You can clear it to place or hold it; the superintendent can take it back to planned.",
    );
    await ines.page.getByTestId("transition-held").click();
    await expect(ines.page.getByTestId("concrete-in-place")).toContainText(`Already on this placement: ${p.total} from 2 trucks`);
    await ines.page.getByTestId("hold-reason").fill(`Cover short at the east edge (${stamp})`);
    await ines.shoot(`hold-figure-${units}`);
    await ines.page.getByRole("button", { name: "Hold the placement" }).click();
    await expect(ines.state()).toHaveText("Held");
    await expect(ines.page.getByTestId("hold-banner").getByTestId("concrete-in-place")).toContainText(p.total);
    await ines.waitAllSaved();

    // The superintendent's phone shows the same figure under the hold.
    await sam.waitForState(id, "Held");
    await expect(sam.page.getByTestId("hold-banner").getByTestId("concrete-in-place")).toContainText(`${p.total} from 2 trucks`);
    await sam.shoot(`hold-banner-${units}-390`);
  }
});

test("a site visit asks which project, keeps the project's clock on a device in another zone, names the finding's placement and shows the signed report as text", async ({ browser }) => {
  test.setTimeout(420_000);
  mkdirSync(".data/screenshots", { recursive: true });
  // The projects keep America/Chicago (scripts/seed/ids.ts); the devices are in Tokyo and London.
  // 05:30 UTC is 23:30 the day before in Chicago (CST, UTC−6) and 14:30 in Tokyo (JST, UTC+9) [IANA tz].
  const nowUtc = new Date(`${new Date().toISOString().slice(0, 10)}T05:30:00Z`);
  const chicagoDay = new Intl.DateTimeFormat("en-US", { timeZone: "America/Chicago", weekday: "short", month: "short", day: "numeric" }).format(nowUtc);
  const ines = new InspectionPage(await person(browser, DEMO.ines, { viewport: PHONE, timezoneId: "Asia/Tokyo" }));
  await ines.page.clock.setFixedTime(nowUtc);
  const stamp = Date.now().toString(36).toUpperCase();
  const longValue = `Pump pit north wall, ties at truck 31 discharge point and the sump, ${stamp}`;
  const description = `Wall ties not cut back near truck 31 (${stamp})`;

  // No project is chosen in the switcher: the picker offers her two projects and preselects none.
  await ines.page.goto("/field/visits");
  await ines.page.getByTestId("new-visit").click();
  const picker = ines.page.getByTestId("new-visit-project");
  await expect(picker.locator("option")).toHaveText(["Choose a project", "Larkspur Commons", "Millrace Pump House"]);
  await ines.page.getByTestId("start-visit").click();
  await expect(ines.page.getByTestId("new-visit-error")).toContainText("Choose the project");
  await ines.shoot("new-visit-picker-390");
  await picker.selectOption({ label: "Millrace Pump House" });
  await ines.page.getByTestId("start-visit").click();
  // Dated today in Chicago, not in Tokyo.
  await expect(ines.page.getByTestId("visit-title")).toContainText(`Site visit ${chicagoDay}`);

  await ines.page.getByTestId("visit-arrived").fill("20:10");
  await ines.page.getByTestId("visit-left").fill("22:45");
  await ines.page.getByTestId("visit-areasInspected").fill(longValue);
  await ines.page.getByTestId("visit-save").click();
  await ines.page.getByTestId("add-finding").click();
  await ines.page.getByTestId("finding-description").fill(description);
  const option = ines.page.getByTestId("finding-placement").locator("option").nth(1);
  const placementLabel = (await option.textContent())!;
  await ines.page.getByTestId("finding-placement").selectOption({ index: 1 });
  await ines.page.getByTestId("finding-save").click();
  const finding = ines.page.getByTestId("finding").filter({ hasText: description });
  await expect(finding.getByTestId("finding-placement-name")).toHaveText(placementLabel);
  await expect(ines.page.getByTestId("visit-who-next")).toHaveText("This visit report is a draft. You can submit it.");
  await ines.page.getByTestId("visit-submitted").click();
  await expect(ines.page.getByTestId("visit-title")).toContainText("Submitted");
  await ines.waitAllSaved();
  await ines.page.getByTestId("visit-sign").click();
  const dialog = ines.page.getByTestId("sign-off-dialog");
  await dialog.getByTestId("sign-off-password").fill(DEMO_PASSWORD);
  await dialog.getByTestId("sign-off-name").fill("Ines Marchetti");
  await ines.drawSignature();
  await dialog.getByTestId("sign-off-submit").click();
  await expect(ines.page.getByTestId("visit-signed")).toBeVisible({ timeout: 60_000 });
  const visitUrl = new URL(ines.page.url());

  // Signed: the report is text, no input cuts a value off, and the whole value is there.
  const report = ines.page.getByTestId("visit-report");
  await expect(report.locator("input, select, textarea")).toHaveCount(0);
  await expect(report.getByTestId("visit-text-areasInspected")).toHaveText(longValue);
  await expect(report).toContainText("20:10 to 22:45");
  await expectInside(report, report.getByTestId("visit-text-areasInspected"));
  await ines.shoot("visit-signed-text-390");
  await ines.page.setViewportSize(DESKTOP);
  await ines.shoot("visit-signed-text-1440");

  // The superintendent, on a device in London, reads the same Chicago times and the finding's placement.
  const sam = new InspectionPage(await person(browser, DEMO.sam, { viewport: PHONE, timezoneId: "Europe/London" }));
  await expect(async () => {
    await sam.page.goto(`/field/visit${visitUrl.search}`);
    await expect(sam.page.getByTestId("visit-report")).toContainText("20:10 to 22:45", { timeout: 8_000 });
  }).toPass({ timeout: 60_000 });
  await expect(sam.page.getByTestId("finding").filter({ hasText: description }).getByTestId("finding-placement-name")).toHaveText(placementLabel);
  await sam.page.goto("/field/visits");
  await expect(sam.page.getByRole("heading", { name: "Site visits" })).toBeVisible();
  await expect(sam.page.getByTestId("new-visit")).toHaveCount(0);
});

test("an invitation just sent shows in People without a reload", async ({ page }) => {
  const email = `pending.${Date.now()}@example.test`;
  await page.setViewportSize(DESKTOP);
  await signIn(page, DEMO.ada);
  await page.goto("/admin");
  await expect(page.getByTestId("people-table")).toBeVisible();
  await page.evaluate(() => ((window as unknown as { __marker?: number }).__marker = 1));
  await page.getByLabel("Name").fill("Wren Halloway");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Project (optional)").selectOption({ label: "Larkspur Commons" });
  await page.getByLabel("Role on that project").selectOption("office");
  await page.getByRole("button", { name: "Send invitation" }).click();
  await expect(page.getByTestId("invite-result")).toContainText(`Invitation sent to ${email}`);
  const row = page.getByTestId("pending-invitation").filter({ hasText: email });
  await expect(row).toContainText("Wren Halloway");
  await expect(row).toContainText("Larkspur Commons, Office");
  // Same document: no reload happened.
  expect(await page.evaluate(() => (window as unknown as { __marker?: number }).__marker)).toBe(1);
  await page.screenshot({ path: ".data/screenshots/people-pending-1440.png", fullPage: true });
  await page.setViewportSize(PHONE);
  await page.screenshot({ path: ".data/screenshots/people-pending-390.png", fullPage: true });
});
