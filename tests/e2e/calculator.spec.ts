import { mkdirSync } from "node:fs";
import path from "node:path";
import { expect, test, type Page } from "@playwright/test";

const SCREENSHOTS = path.resolve(".data/screenshots");

/** Page object for the evaporation calculator (no sign-in needed). */
class CalculatorPage {
  constructor(readonly page: Page) {}

  async open() {
    await this.page.goto("/tools/evaporation");
    await this.ready();
  }

  /** Typing before hydration would be lost, so wait for the client to take over. */
  async ready() {
    await expect(this.page.getByTestId("evap-calculator")).toHaveAttribute("data-hydrated", "true");
  }

  field(label: string) {
    return this.page.getByLabel(label, { exact: true });
  }

  async units(system: "SI" | "IP") {
    await this.page.getByRole("radio", { name: system === "SI" ? /^SI/ : /^Inch-pound/ }).check();
  }

  async enter(values: { concrete: string; air: string; humidity: string; wind: string }) {
    await this.field("Concrete temperature").fill(values.concrete);
    await this.field("Air temperature").fill(values.air);
    await this.field("Relative humidity").fill(values.humidity);
    await this.field("Wind speed").fill(values.wind);
  }

  get rate() {
    return this.page.getByTestId("evap-rate");
  }

  /** The result card (a copy of rate and level also sits under the inputs on a phone). */
  get result() {
    return this.page.getByRole("region", { name: "Evaporation rate" });
  }

  get risk() {
    return this.page.getByTestId("evap-risk");
  }
}

test.describe("evaporation calculator", () => {
  test("computes the DOMAIN check values in both unit systems", async ({ page }) => {
    const calc = new CalculatorPage(page);
    await calc.open();
    await expect(page.getByRole("link", { name: "Back to Today" })).toHaveAttribute("href", "/today");
    await expect(page.getByRole("radio", { name: /^Inch-pound/ })).toBeChecked();

    // 80 °F / 80 °F / 50 % / 15 mph → 0.2004 lb/ft²/h, on the 0.2 threshold [computed, Uno 1998].
    await calc.enter({ concrete: "80", air: "80", humidity: "50", wind: "15" });
    await expect(calc.rate).toHaveText("0.20");
    await expect(calc.result).toContainText("lb/ft²/h");
    await expect(calc.risk).toHaveText(/high/i);
    await expect(page.getByTestId("evap-chart")).toContainText("high level (0.20) at about 15 mph");
    // Hot air (80 °F) brings the crew caution; the governance line is always there.
    await expect(page.getByText(/heat stress/)).toBeVisible();
    await expect(page.getByTestId("finding-governs").first()).toContainText("engineer of record govern");

    // 30 °C / 25 °C / 50 % / 20 km/h → 1.1880 kg/m²/h [computed, Uno 1998].
    await calc.units("SI");
    await expect(calc.field("Wind speed")).toHaveValue("24.1");
    await calc.enter({ concrete: "30", air: "25", humidity: "50", wind: "20" });
    await expect(calc.rate).toHaveText("1.19");
    await expect(calc.result).toContainText("kg/m²/h");
    await expect(calc.risk).toHaveText(/high/i);

    // 25 °C / 25 °C / 50 % / 20 km/h → 0.7275 kg/m²/h, between 0.5 and 1.0 [computed; the caution band
    // from 0.5 is this product's choice, not a published limit; 1.0 is ACI 305R].
    await calc.field("Concrete temperature").fill("25");
    await expect(calc.rate).toHaveText("0.73");
    await expect(calc.risk).toHaveText(/caution/i);

    // The low-bleed box halves the levels: 0.73 is above 0.5.
    await page.getByLabel(/Low-bleed mix/).check();
    await expect(calc.risk).toHaveText(/high/i);
    await page.getByLabel(/Low-bleed mix/).uncheck();
    await expect(calc.risk).toHaveText(/caution/i);

    // An impossible humidity: a plain message on its field, the last good result stays, no NaN.
    await calc.field("Relative humidity").fill("150");
    await expect(page.getByText("Relative humidity must be between 0 and 100 %")).toBeVisible();
    await expect(calc.field("Relative humidity")).toHaveAttribute("aria-invalid", "true");
    await expect(calc.rate).toHaveText("0.73");
    await expect(page.getByText(/last complete entry/)).toBeVisible();
    await expect(page.locator("body")).not.toContainText("NaN");
    await calc.field("Relative humidity").fill("");
    await expect(page.getByText("Enter the relative humidity")).toBeVisible();
    await expect(page.locator("body")).not.toContainText("NaN");
    await calc.field("Relative humidity").fill("50");
    await expect(page.getByText(/last complete entry/)).toHaveCount(0);

    // The unit choice is remembered on the device.
    await page.reload();
    await calc.ready();
    await expect(page.getByRole("radio", { name: /^SI/ })).toBeChecked();
    expect(await page.evaluate(() => localStorage.getItem("pw-units"))).toBe("SI");
  });

  test("shows no evaporation, and cold-weather cautions, on a cold humid day", async ({ page }) => {
    const calc = new CalculatorPage(page);
    await calc.open();
    await calc.units("SI");
    await calc.enter({ concrete: "2", air: "3", humidity: "95", wind: "5" });
    await expect(calc.rate).toHaveText("0.00");
    await expect(calc.risk).toHaveText(/low/i);
    await expect(page.getByText(/cooler than the dew point/)).toBeVisible();
    await expect(page.getByText(/carbon monoxide/)).toBeVisible();
    await expect(page.getByText(/heat stress/)).toHaveCount(0);
  });

  test("opens and computes offline once the service worker has it", async ({ page, context }) => {
    // Phone size: the chart sits below the form, so its drawing (recharts) is not loaded online here
    // and must come from the service worker's precache when the offline page scrolls to it.
    await page.setViewportSize({ width: 390, height: 844 });
    const calc = new CalculatorPage(page);
    await calc.open();
    await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
    await page.reload();
    await calc.ready();
    expect(await page.evaluate(() => navigator.serviceWorker.controller !== null)).toBe(true);

    await context.setOffline(true);
    try {
      await page.reload();
      await calc.ready();
      // Example: 88 °F concrete, 90 °F air, 30 %, 12 mph → 0.288; at 20 mph → 0.446 lb/ft²/h [computed].
      await expect(calc.rate).toHaveText("0.29");
      await calc.field("Wind speed").fill("20");
      await expect(calc.rate).toHaveText("0.45");
      await expect(calc.risk).toHaveText(/high/i);

      const second = new CalculatorPage(await context.newPage());
      await second.open();
      await expect(second.rate).toHaveText("0.29");
      await second.field("Air temperature").fill("70");
      await expect(second.rate).not.toHaveText("0.29");
      await expect(second.page.locator("body")).not.toContainText("NaN");
      await second.page.getByTestId("evap-chart").scrollIntoViewIfNeeded();
      await expect(second.page.getByTestId("evap-chart").locator("svg").first()).toBeVisible();
    } finally {
      await context.setOffline(false);
    }
  });

  test("screenshots at phone and desktop size", async ({ page }) => {
    mkdirSync(SCREENSHOTS, { recursive: true });
    const calc = new CalculatorPage(page);
    for (const [name, size] of [
      ["phone", { width: 390, height: 844 }],
      ["desktop", { width: 1280, height: 800 }],
    ] as const) {
      await page.setViewportSize(size);
      await calc.open();
      // The drawing loads when the chart comes near the screen (below the form on a phone).
      await page.getByTestId("evap-chart").scrollIntoViewIfNeeded();
      await expect(page.getByTestId("evap-chart").locator("svg").first()).toBeVisible();
      const width = await page.evaluate(() => document.documentElement.scrollWidth);
      expect(width, `no sideways scrolling at ${name} size`).toBeLessThanOrEqual(size.width);
      await page.screenshot({ path: path.join(SCREENSHOTS, `calculator-${name}.png`), fullPage: true });
    }
  });
});
