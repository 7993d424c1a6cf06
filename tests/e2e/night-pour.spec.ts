// A night pour on a phone with the project clock at 00:50 (Larkspur Commons: inch-pound, America/Chicago):
// a truck batched 23:05 and discharged 00:50 is saved with both dates shown; on a placement that is only
// planned the form asks why and shows the state; the late load (105 min against ASTM C94 §10.7's 90 min
// [published]) asks accept or reject; a discharge still in the future is refused. Then a field test with
// cylinders creates the specimen set the lab page lists.
import { mkdirSync } from "node:fs";
import { expect, test, type Browser, type Page } from "@playwright/test";
import { TodayPage } from "./field-pages";
import { DEMO, signIn } from "./support";

const PHONE = { width: 390, height: 844 };
const DESKTOP = { width: 1440, height: 900 };
const PROJECT = "Larkspur Commons";
const ZONE = "America/Chicago";
// 00:50 CST on 2026-12-03 (UTC−6): a time already past on the server, so the app accepts it as "now".
const CLOCK = new Date("2026-12-03T06:50:00Z");

async function shot(page: Page, name: string) {
  mkdirSync(".data/screenshots", { recursive: true });
  await page.waitForTimeout(300);
  await page.screenshot({ path: `.data/screenshots/night-pour-${name}.png`, fullPage: true });
}

async function fieldPage(browser: Browser, email: string, viewport = PHONE) {
  const context = await browser.newContext({ viewport, timezoneId: ZONE });
  const page = await context.newPage();
  await page.clock.install({ time: CLOCK });
  await signIn(page, email);
  return page;
}

test("a night pour crossing midnight is saved with its dates; a truck on a planned placement asks why; a late load asks accept or reject", async ({ browser }) => {
  test.setTimeout(240_000);
  const stamp = Date.now().toString(36).toUpperCase();
  const page = await fieldPage(browser, DEMO.sam);
  const today = new TodayPage(page);
  await today.open();
  await today.waitAllSaved();
  await today.planPlacement({ project: PROJECT, element: `Night deck ${stamp}`, least: "8", volume: "30", mixCode: "LC-4000-A" });

  await page.getByTestId("add-delivery").click();
  const form = page.getByTestId("delivery-form");
  await page.getByTestId("delivery-ticket").fill(`N-${stamp}`);
  await page.getByTestId("delivery-truck").fill("27");
  await page.getByTestId("delivery-volume").fill("9");
  await page.getByTestId("delivery-batchedAt").fill("23:05");
  await page.getByTestId("delivery-arrivedAt").fill("23:40");
  await page.getByTestId("delivery-dischargeStartedAt").fill("00:10");
  await page.getByTestId("delivery-dischargeFinishedAt").fill("00:50");
  // Logged after midnight: the batch is read on the day before, the discharge on the day after it.
  await expect(page.getByTestId("delivery-batch-date")).toHaveValue("2026-12-02");
  await expect(page.getByTestId("delivery-batchedAt-date")).toHaveText("Wed, Dec 2");
  await expect(page.getByTestId("delivery-dischargeFinishedAt-date")).toHaveText("Thu, Dec 3 · next day");
  await expect(page.getByTestId("delivery-midnight")).toContainText("This truck crossed midnight");
  // The rulebook's verdict while typing: 105 min from batching (23:05 → 00:50).
  await expect(form.getByTestId("discharge-late")).toContainText("105 min from batching");

  // Planned, not cleared: the state is shown and a reason is required.
  await expect(page.getByTestId("delivery-not-cleared")).toBeVisible();
  await expect(page.getByTestId("delivery-placement-state")).toHaveText("Planned");
  await shot(page, "form-phone");
  await page.getByTestId("delivery-save").click();
  await expect(page.getByTestId("delivery-not-cleared")).toContainText("Say why concrete is going onto this placement before it is cleared");
  await page.getByTestId("delivery-not-cleared-reason").fill("Pump priming load; the inspector is on site");

  // Late: accept or reject, with the finding shown; nothing saved until the person decides.
  await page.getByTestId("delivery-save").click();
  await expect(page.getByTestId("delivery-decision-findings")).toContainText("Late truck");
  await expect(page.getByTestId("delivery-row")).toHaveCount(0);
  await shot(page, "decision-phone");
  await page.getByTestId("delivery-decision-accept").click();
  await expect(form).toHaveCount(0);
  const row = page.locator(`[data-testid="delivery-row"][data-ticket="N-${stamp}"]`);
  await expect(row).toContainText("batched Wed, Dec 2 11:05 PM");
  await expect(row).toContainText("discharged by Thu, Dec 3 12:50 AM");
  await expect(row.getByTestId("discharge-late")).toContainText("105 min");
  await shot(page, "row-phone");

  // A discharge that has not happened yet, on a ticket dated today: refused with its reason.
  await page.getByTestId("add-delivery").click();
  await page.getByTestId("delivery-ticket").fill(`F-${stamp}`);
  await page.getByTestId("delivery-volume").fill("9");
  await page.getByTestId("delivery-batchedAt").fill("00:20");
  await page.getByTestId("delivery-arrivedAt").fill("00:40");
  await page.getByTestId("delivery-dischargeStartedAt").fill("00:45");
  await page.getByTestId("delivery-dischargeFinishedAt").fill("01:30");
  await page.getByTestId("delivery-batch-date").fill("2026-12-03");
  await page.getByTestId("delivery-not-cleared-reason").fill("Pump priming load");
  await page.getByTestId("delivery-save").click();
  await expect(page.getByTestId("delivery-form")).toContainText("Discharge end is in the future: enter a time that has already passed");
  await expect(page.locator(`[data-testid="delivery-row"][data-ticket="F-${stamp}"]`)).toHaveCount(0);

  // The synced truck on the server carries the two instants and the reason.
  await today.waitAllSaved();
  const placementId = new URL(page.url()).searchParams.get("id")!;
  const desk = await browser.newContext({ viewport: DESKTOP, timezoneId: ZONE });
  const wide = await desk.newPage();
  await wide.clock.install({ time: CLOCK });
  await signIn(wide, DEMO.sam);
  await wide.goto(`/field/placement?id=${placementId}`);
  await expect(wide.locator(`[data-testid="delivery-row"][data-ticket="N-${stamp}"]`)).toContainText("discharged by Thu, Dec 3 12:50 AM", { timeout: 30_000 });
  await wide.getByTestId("add-delivery").click();
  await wide.getByTestId("delivery-batchedAt").fill("23:05");
  await wide.getByTestId("delivery-dischargeFinishedAt").fill("00:50");
  await shot(wide, "form-desktop");
});
