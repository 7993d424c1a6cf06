// A specimen set cured with a logger (issue 21, item 2): on a phone set to another time zone, the
// superintendent adds a sensor, enters readings on the project's clock and picks the sensor for the
// cylinders made at a field test; the lab breaks the set at 7 days, and the office sees that
// calibration point marked as from the logger.
import { mkdirSync } from "node:fs";
import { expect, test } from "@playwright/test";
import { TodayPage } from "./field-pages";
import { InspectionPage } from "./inspection-pages";
import { DEMO, signIn } from "./support";

const PHONE = { width: 390, height: 844 };
const DESKTOP = { width: 1440, height: 900 };
const LARKSPUR = "6f1c3e20-8d44-4b7e-b1a2-00000000000a";

test("a set cured with a logger: picked on the phone, its break marked as from the logger in the office", async ({ browser }) => {
  test.setTimeout(300_000);
  mkdirSync(".data/screenshots", { recursive: true });
  const stamp = Date.now().toString(36).toUpperCase();
  const sensor = `L-${stamp.slice(-4)}`;

  // The phone is set to Tokyo; the project keeps Chicago time (lib/time/zone.ts).
  const phone = await browser.newContext({ viewport: PHONE, timezoneId: "Asia/Tokyo" });
  const page = await phone.newPage();
  await signIn(page, DEMO.sam);
  const today = new TodayPage(page);
  await today.open();
  await today.waitAllSaved();
  const id = await today.planPlacement({ project: "Larkspur Commons", element: `Logger deck ${stamp}`, least: "8", volume: "20", mixCode: "LC-4000-A" });
  const sam = new InspectionPage(page);
  await sam.addTruck({ ticket: `G-${stamp}`, volume: "9" });

  const panel = page.getByTestId("maturity-panel");
  await panel.getByTestId("add-sensor").click();
  await page.getByTestId("sensor-name").fill(sensor);
  await page.getByTestId("sensor-location").fill("In a field-cured cylinder");
  await page.getByTestId("sensor-save").click();
  const row = page.locator(`[data-testid="sensor-row"][data-sensor="${sensor}"]`);
  await expect(row).toBeVisible();
  // Cast 24 Nov 08:00; the record runs from before the cast to after the 7-day break (°F, an inch-pound project).
  for (const [at, tempF] of [["2026-11-24T07:00", "50"], ["2026-11-25T00:30", "60"], ["2026-12-02T12:00", "58"]]) {
    await row.getByTestId("add-reading").click();
    await row.getByTestId("reading-at").fill(at);
    await row.getByTestId("reading-temp").fill(tempF);
    await row.getByTestId("reading-save").click();
    await expect(row.getByTestId("reading-form")).toHaveCount(0);
  }

  await sam.waitAllSaved();

  // The inspector makes the cylinders at a field test, on her own phone (also set to Tokyo).
  const ines = new InspectionPage(await (await browser.newContext({ viewport: PHONE, timezoneId: "Asia/Tokyo" })).newPage());
  await signIn(ines.page, DEMO.ines);
  await expect(async () => {
    await ines.page.goto(`/field/placement?id=${id}`);
    await expect(ines.page.locator(`[data-testid="sensor-row"][data-sensor="${sensor}"]`)).toBeVisible({ timeout: 8_000 });
  }).toPass({ timeout: 90_000 });
  await ines.page.getByTestId("add-field-test").click();
  await ines.page.getByTestId("field-test-sampled-at").fill("2026-11-24T08:00");
  await ines.page.getByTestId("field-test-slump").fill("4");
  await ines.page.getByTestId("field-test-cylinder-count").fill("2");
  await ines.page.getByTestId("field-test-cylinder-size").selectOption("100");
  await ines.page.getByTestId("field-test-set-code").fill(`LG-${stamp}`);
  await ines.page.getByTestId("field-test-ages").fill("7");
  const curing = ines.page.getByTestId("field-test-set-logger");
  await expect(curing.locator("option")).toHaveText(["Standard curing", `Cured with the set: ${sensor}`]);
  await curing.selectOption({ label: `Cured with the set: ${sensor}` });
  await ines.page.getByTestId("field-test-cylinders").screenshot({ path: ".data/screenshots/set-logger-phone-form.png" });
  await curing.evaluate((el) => el.scrollIntoView({ block: "center" }));
  await ines.page.screenshot({ path: ".data/screenshots/set-logger-phone.png" });
  await ines.page.getByTestId("field-test-save").click();
  await expect(ines.page.getByTestId("field-test-form")).toHaveCount(0);
  await ines.waitAllSaved();

  // Stored on the project's clock: 00:30 in Chicago (CST, UTC−6) on 25 Nov is 06:30 UTC, whatever the phone's zone.
  const office = await (await browser.newContext({ viewport: DESKTOP, timezoneId: "America/Chicago" })).newPage();
  await signIn(office, DEMO.olu);
  const listed = await office.request.get(`/api/projects/${LARKSPUR}/records/sensor-readings?from=2026-11-24&to=2026-11-26&limit=200`);
  expect(listed.ok()).toBe(true);
  const instants = ((await listed.json()).items as { readings: [string, number][] }[]).flatMap((b) => b.readings.map(([at]) => at));
  expect(instants).toContain("2026-11-25T06:30:00.000Z");

  // The lab: the set shows its logger; a 7-day break is entered at its due time.
  await office.goto(`/projects/${LARKSPUR}/lab?placement=${id}`);
  const card = office.locator(`[data-testid="set-card"][data-set="LG-${stamp}"]`);
  await expect(card).toBeVisible({ timeout: 30_000 });
  await expect(card.getByTestId("set-curing-select").locator("option:checked")).toHaveText(`Cured with the set: ${sensor}`);
  const form = card.getByTestId("break-form");
  await form.getByTestId("break-load").fill("45000");
  await form.getByTestId("break-fracture").selectOption("2");
  await form.getByTestId("break-save").click();
  await expect(form.getByTestId("break-message")).toContainText("Break saved");
  await office.screenshot({ path: ".data/screenshots/set-logger-lab-desktop.png", fullPage: true });

  // The placement review: the 7-day point of this set is from the logger; the mix's other breaks are standard-cured.
  // (LC-4000-A, not the demo deck's calibrated LC-5000-D, so the maturity spec's estimate stays as seeded.)
  await office.goto(`/projects/${LARKSPUR}/placements/${id}/review`);
  const points = office.getByTestId("calibration-points");
  await expect(points).toBeVisible({ timeout: 30_000 });
  // Other runs may have added logger points to this mix: this set's point is the one naming its sensor.
  const fromLogger = points.locator('[data-testid="calibration-point"][data-source="logger"]', { hasText: sensor });
  await expect(fromLogger).toHaveCount(1);
  await expect(fromLogger).toContainText("7 d");
  await expect(fromLogger).toContainText(`Cured with the set: ${sensor}`);
  await expect(points.locator('[data-testid="calibration-point"][data-source="standard"]').first()).toContainText("Standard curing");
  await points.screenshot({ path: ".data/screenshots/set-logger-calibration-desktop.png" });
  await office.setViewportSize(PHONE);
  await points.evaluate((el) => el.scrollIntoView({ block: "center" }));
  await office.screenshot({ path: ".data/screenshots/set-logger-calibration-phone.png" });
  await office.goto(`/projects/${LARKSPUR}/lab?placement=${id}`);
  await expect(card).toBeVisible({ timeout: 30_000 });
  await card.screenshot({ path: ".data/screenshots/set-logger-lab-phone.png" });
});
