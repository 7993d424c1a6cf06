import { mkdirSync } from "node:fs";
import { expect, test, type Page } from "@playwright/test";
import { PlacementPage, TodayPage } from "./field-pages";
import { DEMO, signIn } from "./support";

// The field screens show the rulebook's findings (lib/checks), in the project's unit system, offline;
// and the office's digest for the same day says the same. Check value: 80 °F air and concrete, 50 %,
// 15 mph → 0.2004 lb/ft²/h (Uno's inch-pound form, ACI Materials Journal 95(4), 1998; ../shared
// DOMAIN §1), at ACI 305R's 0.2 lb/ft²/h: a warning. 55 °F is the ACI 306R minimum for a section
// under 12 in, so a 55 °F curing reading is not below it.

const PHONE = { width: 390, height: 844 };
const DESKTOP = { width: 1440, height: 900 };
const PROJECT = "Larkspur Commons"; // inch-pound, America/Chicago
const ZONE = "America/Chicago";

const localDate = (instant: Date) => new Intl.DateTimeFormat("en-CA", { timeZone: ZONE, year: "numeric", month: "2-digit", day: "2-digit" }).format(instant);

async function shot(page: Page, name: string) {
  await page.waitForTimeout(300);
  await page.screenshot({ path: `.data/screenshots/rulebook-${name}.png`, fullPage: true });
}

async function waitForServiceWorker(page: Page) {
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await page.reload();
  await expect.poll(() => page.evaluate(() => !!navigator.serviceWorker.controller), { timeout: 15_000 }).toBe(true);
}

test("an inch-pound project's field screens judge by the rulebook, offline, and agree with the digest", async ({ browser }) => {
  test.setTimeout(300_000);
  mkdirSync(".data/screenshots", { recursive: true });
  const stamp = Date.now().toString(36).toUpperCase();
  const element = `E2E wet well wall ${stamp}`;

  // Online once: sign in, first sync, service worker; then offline for the field work.
  const context = await browser.newContext({ viewport: PHONE, timezoneId: ZONE });
  const first = await context.newPage();
  await signIn(first, DEMO.sam);
  const projects = (await (await first.request.get("/api/projects")).json()) as { id: string; name: string }[];
  const projectId = projects.find((p) => p.name === PROJECT)!.id;
  const today = new TodayPage(first);
  await today.open();
  await expect(first.getByTestId("field-project-switcher")).toBeVisible({ timeout: 30_000 });
  await today.waitAllSaved();
  await waitForServiceWorker(first);
  await context.setOffline(true);
  const page = await context.newPage();
  await page.goto("/field/today");
  await first.close();
  const shell = new TodayPage(page);
  await expect(page.getByRole("heading", { name: "Today", level: 1 })).toBeVisible();
  await expect(shell.syncStatus()).toHaveAttribute("data-state", "Offline");

  // A 10 in wall (least dimension under 12 in) with the ordinary-bleed mix.
  const placementId = await shell.planPlacement({ project: PROJECT, element, least: "10", volume: "12", mixCode: "LC-4000-A" });
  const placement = new PlacementPage(page);

  // 80 °F air and concrete, 50 %, 15 mph: the rulebook's inch-pound verdict while typing and once saved.
  await placement.typeObservation({ air: "80", rh: "50", wind: "15", concrete: "80" });
  await expect(page.getByTestId("weather-live-risk")).toHaveAttribute("data-severity", "warning");
  const live = page.getByTestId("weather-live-rate").locator('[data-rule="evaporation"]');
  await expect(live.getByTestId("finding-title")).toHaveText("Warning: High evaporation: 0.2004 lb/ft²/h");
  await expect(live.getByTestId("finding-source")).toHaveText("Rule: ACI 305R Fig. 2.1.5");
  await placement.saveObservation();
  const observedAt = new Date();
  const high = page.getByTestId("weather-high-risk");
  await expect(high.getByTestId("finding-title")).toContainText("High evaporation: 0.2004 lb/ft²/h");
  await expect(high.getByTestId("finding-message")).toContainText("approaches 0.2 lb/ft²/h (ACI 305R)");
  await expect(high.getByTestId("finding-governs")).toHaveText(/project specification, local codes and the engineer of record govern/);
  await expect(page.getByTestId("weather-row").first()).toContainText("80 °F");

  // 55 °F under blankets: at the inch-pound minimum, not below it; 54 °F is below.
  await expect(page.getByTestId("curing-minimum")).toContainText("55 °F");
  await placement.addCuringReading("55");
  const rows = page.getByTestId("curing-row");
  await expect(rows.first().getByTestId("curing-verdict")).toHaveAttribute("data-ok", "yes");
  await expect(rows.first().getByTestId("curing-finding")).toHaveCount(0);
  await placement.addCuringReading("54");
  await expect(rows.filter({ hasText: "54 °F" }).getByTestId("curing-verdict")).toHaveAttribute("data-ok", "no");
  await expect(rows.filter({ hasText: "54 °F" }).getByTestId("curing-finding")).toContainText("minimum 55 °F");

  // No cold weather on this day: the curing log still shows the rulebook's heater caution, in its words.
  await expect(page.getByTestId("curing-heater-caution")).toContainText(
    "In cold weather: Vent combustion heaters in enclosures to the outside: their exhaust carries carbon monoxide.",
  );

  // A truck with only the discharge start: minutes against the limit, no "in time" verdict.
  await placement.addTruck({ ticket: `T-${stamp}`, volume: "9" });
  const truck = page.locator(`[data-testid="delivery-row"][data-ticket="T-${stamp}"]`);
  await expect(truck.getByTestId("discharge-elapsed")).toContainText(/Discharging: \d+ of 90 min since batching/);
  await expect(truck.getByTestId("discharge-in-time")).toHaveCount(0);

  await page.getByTestId("weather-watch").scrollIntoViewIfNeeded();
  await page.screenshot({ path: ".data/screenshots/rulebook-weather-ip-phone-screen.png" });
  await page.getByTestId("curing-log").scrollIntoViewIfNeeded();
  await page.screenshot({ path: ".data/screenshots/rulebook-curing-ip-phone-screen.png" });
  await page.getByTestId("deliveries").scrollIntoViewIfNeeded();
  await page.screenshot({ path: ".data/screenshots/rulebook-deliveries-ip-phone-screen.png" });
  await shot(page, "placement-ip-phone");

  // A night-time reading the evening before at 38 °F: cold weather under ACI 306R (40 °F on an inch-pound project).
  const eve = new Date(observedAt.getTime() - 24 * 3600_000);
  const eveDate = localDate(eve);
  await placement.typeObservation({ air: "38", rh: "80", wind: "5", concrete: "", observedAt: `${eveDate}T23:30` });
  await expect(page.getByTestId("weather-live-rate").locator('[data-rule="evaporation"]').getByTestId("finding-title")).toContainText("(estimated)");
  await placement.saveObservation();
  const cold = page.getByTestId("weather-cold");
  await expect(cold.getByTestId("finding-title")).toContainText("Cold weather");
  await expect(cold.getByTestId("finding-title")).toContainText("38 °F");
  await expect(cold.getByTestId("finding-source")).toHaveText("Rule: ACI 306R");
  await expect(page.getByTestId("start-cold-checklist")).toBeVisible();
  await page.getByTestId("weather-watch").scrollIntoViewIfNeeded();
  await page.screenshot({ path: ".data/screenshots/rulebook-weather-night-phone-screen.png" });
  await shot(page, "placement-night-phone");
  await page.setViewportSize(DESKTOP);
  await shot(page, "placement-ip-desktop");

  // Today: the cold-weather badge names its rule and who governs.
  await page.getByTestId("back-to-today").click();
  const link = page.getByTestId("field-placement-link").filter({ hasText: element });
  await expect(link.getByTestId("today-cold-weather")).toContainText("ACI 306R");
  await expect(link.getByTestId("today-cold-weather")).toContainText("engineer of record govern");
  await shot(page, "today-ip-desktop");
  await page.setViewportSize(PHONE);
  await shot(page, "today-ip-phone");

  // Online again: everything reaches the server; the office's digest for that day says the same.
  await context.setOffline(false);
  await shell.waitAllSaved(60_000);
  const office = await browser.newContext({ viewport: DESKTOP });
  const olu = await office.newPage();
  await signIn(olu, DEMO.olu);
  const res = await olu.request.get(`/api/projects/${projectId}/digest/preview?date=${localDate(observedAt)}&format=json`);
  expect(res.status()).toBe(200);
  const digest = (await res.json()) as { text: string; html: string };
  expect(digest.text).toContain("High evaporation");
  expect(digest.text).toContain("0.2004 lb/ft²/h");
  await office.close();
  await context.close();
  expect(placementId).toBeTruthy();
});

test("the calculator's hot and cold notices are the rulebook's, with rule and who governs", async ({ page }) => {
  mkdirSync(".data/screenshots", { recursive: true });
  await page.setViewportSize(PHONE);
  await page.goto("/tools/evaporation");
  await expect(page.getByTestId("evap-calculator")).toHaveAttribute("data-hydrated", "true");
  await page.getByRole("radio", { name: /^Inch-pound/ }).check();
  const enter = async (v: { concrete: string; air: string; humidity: string; wind: string }) => {
    await page.getByLabel("Concrete temperature", { exact: true }).fill(v.concrete);
    await page.getByLabel("Air temperature", { exact: true }).fill(v.air);
    await page.getByLabel("Relative humidity", { exact: true }).fill(v.humidity);
    await page.getByLabel("Wind speed", { exact: true }).fill(v.wind);
  };
  // 80 °F with 0.2004 lb/ft²/h, over ACI 305R's 0.2: ACI 305.1 hot weather.
  await enter({ concrete: "80", air: "80", humidity: "50", wind: "15" });
  const hot = page.getByTestId("evap-hot-weather");
  await expect(hot.getByTestId("finding-source")).toHaveText("Rule: ACI 305.1-14");
  await expect(hot.getByTestId("finding-governs")).toContainText("engineer of record");
  await expect(page.getByTestId("evap-cold-weather")).toHaveCount(0);
  await shot(page, "calculator-hot-phone");
  // 38 °F air: ACI 306R cold weather (40 °F on the inch-pound side).
  await enter({ concrete: "60", air: "38", humidity: "70", wind: "5" });
  const cold = page.getByTestId("evap-cold-weather");
  await expect(cold.getByTestId("finding-source")).toHaveText("Rule: ACI 306R");
  await expect(cold).toContainText("carbon monoxide");
  await expect(page.getByTestId("evap-hot-weather")).toHaveCount(0);
  await page.setViewportSize(DESKTOP);
  await shot(page, "calculator-cold-desktop");
});
