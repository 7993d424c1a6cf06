import { expect, type Locator, type Page } from "@playwright/test";
import { PlacementPage } from "./field-pages";

/** The placement screen's inspection parts: readiness check, clear or hold, sign-off, signed record. */
export class InspectionPage extends PlacementPage {
  constructor(page: Page) {
    super(page);
  }

  state(): Locator {
    return this.page.getByTestId("placement-title").locator("xpath=..").getByTestId("placement-state");
  }

  /** Reloads until the device has pulled the placement in `label` (the other person's change). */
  async waitForState(id: string, label: string, timeout = 60_000) {
    await expect(async () => {
      await this.page.goto(`/field/placement?id=${id}`);
      await expect(this.state()).toHaveText(label, { timeout: 8_000 });
    }).toPass({ timeout });
  }

  item(key: string): Locator {
    return this.page.locator(`[data-testid="readiness-item"][data-item-key="${key}"]`);
  }

  async startReadiness() {
    await this.page.getByTestId("start-readiness").click();
    await expect(this.page.getByTestId("readiness-item")).toHaveCount(10);
  }

  async answer(key: string, answer: "yes" | "no" | "na", note?: string) {
    const row = this.item(key);
    // A second tap on the chosen answer clears it, so tap only when it changes.
    if ((await row.getAttribute("data-answer")) !== answer) await row.getByTestId(`readiness-answer-${answer}`).click();
    await expect(row).toHaveAttribute("data-answer", answer);
    if (note !== undefined) {
      await row.getByTestId("readiness-note").fill(note);
      await row.getByTestId("readiness-note").blur();
      await expect(row.getByTestId("readiness-note")).toHaveValue(note);
    }
  }

  async answerAllYes() {
    const keys = await this.page.getByTestId("readiness-item").evaluateAll((els) => els.map((e) => e.getAttribute("data-item-key")!));
    for (const key of keys) await this.answer(key, "yes");
  }

  /** Draws a signature with the mouse: three strokes across the pad. */
  async drawSignature() {
    const pad = this.page.getByTestId("sign-off-pad");
    await pad.evaluate((el) => el.scrollIntoView({ block: "center" }));
    const box = (await pad.boundingBox())!;
    const strokes: [number, number][][] = [
      [[0.1, 0.7], [0.2, 0.3], [0.3, 0.75], [0.4, 0.35], [0.5, 0.7]],
      [[0.55, 0.6], [0.65, 0.4], [0.75, 0.65], [0.85, 0.45]],
      [[0.15, 0.85], [0.5, 0.82], [0.9, 0.8]],
    ];
    for (const stroke of strokes) {
      const [[x0, y0], ...rest] = stroke;
      await this.page.mouse.move(box.x + x0 * box.width, box.y + y0 * box.height);
      await this.page.mouse.down();
      for (const [x, y] of rest) await this.page.mouse.move(box.x + x * box.width, box.y + y * box.height, { steps: 6 });
      await this.page.mouse.up();
    }
    await expect(pad).toHaveAttribute("data-empty", "no");
  }

  async shoot(name: string) {
    await this.page.waitForTimeout(300);
    await this.page.screenshot({ path: `.data/screenshots/inspection-${name}.png`, fullPage: true });
    await this.page.screenshot({ path: `.data/screenshots/inspection-${name}-screen.png` });
  }
}
