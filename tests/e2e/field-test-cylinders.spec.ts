// Cylinders made at a field test (ASTM C31: count, 4 × 8 in or 6 × 12 in, the set's id) create the
// specimen set the lab page then lists with its test ages; the test shows when it ran and who ran it.
import { expect, test } from "@playwright/test";
import { TodayPage } from "./field-pages";
import { InspectionPage } from "./inspection-pages";
import { DEMO, signIn } from "./support";

const PHONE = { width: 390, height: 844 };
const DESKTOP = { width: 1440, height: 900 };
const PROJECT = "Larkspur Commons";
const LARKSPUR = "6f1c3e20-8d44-4b7e-b1a2-00000000000a";

test("a field test with cylinders creates the set seen on the lab page", async ({ browser }) => {
  test.setTimeout(240_000);
  const stamp = Date.now().toString(36).toUpperCase();
  const context = await browser.newContext({ viewport: PHONE, timezoneId: "America/Chicago" });
  const page = await context.newPage();
  await signIn(page, DEMO.sam);
  const today = new TodayPage(page);
  await today.open();
  await today.waitAllSaved();
  const id = await today.planPlacement({ project: PROJECT, element: `Cyl deck ${stamp}`, least: "8", volume: "20", mixCode: "LC-4000-A" });
  const sam = new InspectionPage(page);
  await sam.addTruck({ ticket: `C-${stamp}`, volume: "9" });
  await sam.waitAllSaved();

  const ines = new InspectionPage(await (await browser.newContext({ viewport: PHONE, timezoneId: "America/Chicago" })).newPage());
  await signIn(ines.page, DEMO.ines);
  await expect(async () => {
    await ines.page.goto(`/field/placement?id=${id}`);
    await expect(ines.page.getByTestId("delivery-row")).toHaveCount(1, { timeout: 8_000 });
  }).toPass({ timeout: 60_000 });
  const p = ines.page;
  await p.getByTestId("add-field-test").click();
  await p.getByTestId("field-test-tested-by").fill("Ines Inspect");
  await p.getByTestId("field-test-slump").fill("4");
  await p.getByTestId("field-test-air").fill("6");
  await p.getByTestId("field-test-concrete-temp").fill("70");
  await p.getByTestId("field-test-cylinder-count").fill("4");
  await expect(p.getByTestId("field-test-cylinder-size").locator("option")).toHaveText(["4 × 8 in", "6 × 12 in"]);
  await p.getByTestId("field-test-cylinder-size").selectOption("100");
  await p.getByTestId("field-test-set-code").fill(`S-${stamp}`);
  await expect(p.getByTestId("field-test-ages")).toHaveValue("7, 28");
  await p.screenshot({ path: ".data/screenshots/field-test-cylinders-phone.png", fullPage: true });
  await p.getByTestId("field-test-save").click();
  await expect(p.getByTestId("field-test-form")).toHaveCount(0);
  await expect(p.getByTestId("field-test-tester")).toHaveText("Tested by Ines Inspect");
  await ines.waitAllSaved();

  // The office's lab page lists the set: 4 cylinders of 4 × 8 in, breaks due at 7 and 28 days.
  const office = await (await browser.newContext({ viewport: DESKTOP, timezoneId: "America/Chicago" })).newPage();
  await signIn(office, DEMO.olu);
  await office.goto(`/projects/${LARKSPUR}/lab?placement=${id}`);
  const card = office.locator(`[data-testid="set-card"][data-set="S-${stamp}"]`);
  await expect(card).toBeVisible({ timeout: 30_000 });
  await expect(card).toContainText("Test ages: 7 d");
  await expect(card).toContainText("28 d");
  await office.screenshot({ path: ".data/screenshots/field-test-cylinders-lab.png", fullPage: true });
});
