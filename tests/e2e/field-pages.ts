import { expect, type Locator, type Page } from "@playwright/test";

/** Page objects of the offline field screens. */
export class FieldShellPage {
  constructor(readonly page: Page) {}

  syncStatus(): Locator {
    return this.page.getByTestId("sync-status");
  }

  async waitAllSaved(timeout = 45_000) {
    await expect(this.syncStatus()).toHaveAttribute("data-state", "All saved", { timeout });
  }

  async expectUser(name: RegExp | string) {
    await expect(this.page.getByTestId("field-user-name")).toContainText(name);
  }

  /** Marks the page so a full reload (which would clear it) can be told from a soft navigation. */
  async mark() {
    await this.page.evaluate(() => {
      (window as unknown as { __marker?: number }).__marker = 1;
    });
  }

  async expectMarked() {
    expect(await this.page.evaluate(() => (window as unknown as { __marker?: number }).__marker)).toBe(1);
  }

  async nav(label: "Today" | "Diary" | "To reconcile") {
    await this.page.getByTestId(`field-nav-${label.toLowerCase().replace(/\s+/g, "-")}`).click();
  }

  async screenshot(name: string) {
    await this.page.waitForTimeout(300);
    await this.page.screenshot({ path: `.data/screenshots/field-${name}.png`, fullPage: true });
    // The first screen as the phone shows it (the full page puts the sticky bars mid-page).
    await this.page.screenshot({ path: `.data/screenshots/field-${name}-screen.png` });
  }
}

export class TodayPage extends FieldShellPage {
  async open() {
    await this.page.goto("/field/today");
    await expect(this.page.getByRole("heading", { name: "Today", level: 1 })).toBeVisible();
  }

  async planPlacement(v: { project: string; element: string; least: string; volume: string; mixCode: string }): Promise<string> {
    await this.page.getByTestId("plan-placement").click();
    const form = this.page.getByTestId("plan-placement-form");
    await form.locator("select").first().selectOption({ label: v.project });
    await this.page.getByTestId("plan-element").fill(v.element);
    await this.page.getByTestId("plan-element-type").selectOption("elevated-slab");
    await this.page.getByTestId("plan-level").fill("Roof");
    await this.page.getByTestId("plan-grid").fill("A–C / 1–3");
    await this.page.getByTestId("plan-least").fill(v.least);
    await this.page.getByTestId("plan-volume").fill(v.volume);
    const mix = this.page.getByTestId("plan-mix");
    await expect(mix.locator("option", { hasText: v.mixCode })).toHaveCount(1);
    const value = await mix.locator("option", { hasText: v.mixCode }).getAttribute("value");
    await mix.selectOption(value!);
    await this.page.getByTestId("plan-save").click();
    await expect(this.page).toHaveURL(/\/field\/placement\?id=/);
    await expect(this.page.getByTestId("placement-title")).toHaveText(v.element);
    return new URL(this.page.url()).searchParams.get("id")!;
  }
}

export class PlacementPage extends FieldShellPage {
  async open(id: string) {
    await this.page.goto(`/field/placement?id=${id}`);
    await expect(this.page.getByTestId("placement-title")).toBeVisible();
  }

  deliveries(): Locator {
    return this.page.getByTestId("delivery-row");
  }

  async addTruck(v: { ticket: string; volume: string; waterL?: string }) {
    await this.page.getByTestId("add-delivery").click();
    await this.page.getByTestId("delivery-ticket").fill(v.ticket);
    await this.page.getByTestId("delivery-truck").fill("BR-12");
    await this.page.getByTestId("delivery-volume").fill(v.volume);
    await this.page.getByTestId("delivery-batchedAt-now").click();
    await this.page.getByTestId("delivery-arrivedAt-now").click();
    await this.page.getByTestId("delivery-dischargeStartedAt-now").click();
    if (v.waterL) {
      await this.page.getByTestId("delivery-water").fill(v.waterL);
      await this.page.getByTestId("delivery-waterFirstAt-now").click();
      await this.page.getByTestId("delivery-water-by").fill("Driver");
      await this.page.getByTestId("delivery-water-authorised").fill("Sam");
      await expect(this.page.getByTestId("delivery-form").getByTestId("water-check")).toBeVisible();
    }
    await expect(this.page.getByTestId("delivery-form").getByTestId("discharge-check")).toContainText("ASTM C94");
    await this.saveTruck();
    await expect(this.page.locator(`[data-testid="delivery-row"][data-ticket="${v.ticket}"]`)).toBeVisible();
  }

  /** Saves the open truck form, answering its questions: why on work not cleared, and accept a flagged load. */
  async saveTruck(reason = "Blinding under the slab; the inspector agreed on site") {
    const why = this.page.getByTestId("delivery-not-cleared-reason");
    if (await why.isVisible()) await why.fill(reason);
    await this.page.getByTestId("delivery-save").click();
    const accept = this.page.getByTestId("delivery-decision-accept");
    await expect(this.page.getByTestId("delivery-form").and(this.page.locator(":not(:has([data-testid=delivery-decision]))"))).toHaveCount(0);
    if (await accept.isVisible()) await accept.click();
    await expect(this.page.getByTestId("delivery-form")).toHaveCount(0);
  }

  async editTicket(from: string, to: string) {
    const row = this.page.locator(`[data-testid="delivery-row"][data-ticket="${from}"]`);
    await row.getByTestId("edit-delivery").click();
    await row.getByTestId("delivery-ticket").fill(to);
    await row.getByTestId("delivery-save").click();
    await expect(this.page.locator(`[data-testid="delivery-row"][data-ticket="${to}"]`)).toBeVisible();
  }

  async addFieldTestOutOfTolerance(slump: string) {
    await this.page.getByTestId("add-field-test").click();
    await this.page.getByTestId("field-test-slump").fill(slump);
    await expect(this.page.getByTestId("live-slump-verdict")).toHaveAttribute("data-ok", "no");
    await this.page.getByTestId("field-test-air").fill("6");
    await this.page.getByTestId("field-test-concrete-temp").fill("24");
    await this.page.getByTestId("field-test-save").click();
    await expect(this.page.getByTestId("field-test-warning")).toBeVisible();
  }

  /** Types a weather reading (in the project's units) and leaves the form open with the live verdict. */
  async typeObservation(v: { air: string; rh: string; wind: string; concrete: string; observedAt?: string }) {
    await this.page.getByTestId("add-weather").click();
    const form = this.page.getByTestId("weather-form");
    if (v.observedAt) await form.locator('input[type="datetime-local"]').fill(v.observedAt);
    await this.page.getByTestId("weather-air-temp").fill(v.air);
    await this.page.getByTestId("weather-rh").fill(v.rh);
    await this.page.getByTestId("weather-wind").fill(v.wind);
    await this.page.getByTestId("weather-concrete-temp").fill(v.concrete);
  }

  async saveObservation() {
    await this.page.getByTestId("weather-save").click();
    await expect(this.page.getByTestId("weather-form")).toHaveCount(0);
  }

  async addHotWindyObservation(v: { air: string; rh: string; wind: string; concrete: string }) {
    await this.typeObservation(v);
    await expect(this.page.getByTestId("weather-live-risk")).toHaveAttribute("data-severity", "warning");
    await this.saveObservation();
    await expect(this.page.getByTestId("weather-high-risk")).toBeVisible();
  }

  /** A protection or curing reading, in the project's units. */
  async addCuringReading(temp: string) {
    await this.page.getByTestId("add-curing").click();
    await this.page.getByTestId("curing-temp").fill(temp);
    await this.page.getByTestId("curing-save").click();
    await expect(this.page.getByTestId("curing-form")).toHaveCount(0);
  }

  async startHotChecklist() {
    await this.page.getByTestId("start-hot-checklist").click();
    const list = this.page.getByTestId("checklist-hot-weather");
    await expect(list.getByTestId("checklist-item")).toHaveCount(8);
    await list.getByTestId("checklist-item").first().getByRole("button", { name: "Yes" }).click();
    await expect(list.getByTestId("checklist-item").first().getByRole("button", { name: "Yes" })).toHaveAttribute("aria-pressed", "true");
  }
}
