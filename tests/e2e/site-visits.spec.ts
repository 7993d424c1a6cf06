import { mkdirSync } from "node:fs";
import { expect, test, type Browser, type Page } from "@playwright/test";
import { TodayPage } from "./field-pages";
import { InspectionPage } from "./inspection-pages";
import { DEMO, DEMO_PASSWORD, signIn } from "./support";

// Issue 7 item 7, the inspection log with two people on two devices: the inspector records a visit
// with a finding; the superintendent sees it open on Today and answers it; the inspector closes it,
// submits and signs the report; the report then shows as signed and read-only.

const PROJECT = "Millrace Pump House";

async function person(browser: Browser, email: string, viewport: { width: number; height: number }): Promise<Page> {
  const context = await browser.newContext({ viewport });
  const page = await context.newPage();
  await signIn(page, email);
  const today = new TodayPage(page);
  await today.open();
  await expect(page.getByTestId("field-project-switcher")).toBeVisible({ timeout: 30_000 });
  await page.getByTestId("field-project-switcher").selectOption({ label: PROJECT });
  await today.waitAllSaved();
  return page;
}

test("visit with a finding: open → answered → closed, then the report is submitted and signed", async ({ browser }) => {
  test.setTimeout(300_000);
  mkdirSync(".data/screenshots", { recursive: true });
  const stamp = Date.now().toString(36).toUpperCase();
  const description = `Sump wall ties not cut back (${stamp})`;

  const ines = new InspectionPage(await person(browser, DEMO.ines, { width: 1280, height: 800 }));
  const sam = new InspectionPage(await person(browser, DEMO.sam, { width: 390, height: 844 }));

  // Ines starts a visit, fills the report and records a finding.
  await ines.page.goto("/field/visits");
  await ines.page.getByTestId("new-visit").click();
  // The project shown in the switcher is preselected.
  await expect(ines.page.getByTestId("new-visit-project").locator("option:checked")).toHaveText(PROJECT);
  await ines.page.getByTestId("start-visit").click();
  await expect(ines.page.getByTestId("visit-title")).toContainText("Draft");
  await ines.page.getByTestId("visit-areasInspected").fill("Pump pit, north wall");
  await ines.page.getByTestId("visit-save").click();
  await ines.page.getByTestId("add-finding").click();
  await ines.page.getByTestId("finding-description").fill(description);
  await ines.page.getByTestId("finding-location").fill("North wall, grid 2");
  await ines.page.getByTestId("finding-requirement").fill("Spec 03 11 00 §3.4 [invented demo text]");
  await ines.page.getByTestId("finding-action").fill("Cut back and patch the ties; show me before backfill");
  await ines.page.getByTestId("finding-save").click();
  const finding = ines.page.getByTestId("finding").filter({ hasText: description });
  await expect(finding.getByTestId("finding-state")).toHaveText("Open");
  // The inspector may not answer her own finding.
  await expect(finding.getByTestId("finding-answer")).toHaveCount(0);
  await ines.waitAllSaved();
  const visitUrl = ines.page.url();

  // Sam sees it open on Today and answers it.
  await expect(async () => {
    await sam.page.goto("/field/today");
    await expect(sam.page.getByTestId("open-finding").filter({ hasText: description })).toBeVisible({ timeout: 8_000 });
  }).toPass({ timeout: 60_000 });
  await sam.page.screenshot({ path: ".data/screenshots/visits-today-open-finding.png", fullPage: true });
  await sam.page.getByTestId("open-finding").filter({ hasText: description }).click();
  const samFinding = sam.page.getByTestId("finding").filter({ hasText: description });
  await expect(samFinding.getByTestId("finding-close")).toHaveCount(0);
  await samFinding.getByTestId("finding-answer").click();
  await samFinding.getByTestId("finding-move-text").fill("Ties cut back 25 mm and patched; photo in the diary");
  await samFinding.getByTestId("finding-move-save").click();
  await expect(samFinding.getByTestId("finding-state")).toHaveText("Correction reported");
  await sam.waitAllSaved();

  // Ines sees the answer, closes the finding, submits and signs the report.
  await expect(async () => {
    await ines.page.goto(visitUrl);
    await expect(finding.getByTestId("finding-state")).toHaveText("Correction reported", { timeout: 8_000 });
  }).toPass({ timeout: 60_000 });
  await expect(finding.getByTestId("finding-response")).toContainText("Ties cut back");
  await finding.getByTestId("finding-close").click();
  await finding.getByTestId("finding-move-save").click();
  await expect(finding.getByTestId("finding-state")).toHaveText("Closed");
  await ines.page.getByTestId("visit-submitted").click();
  await expect(ines.page.getByTestId("visit-title")).toContainText("Submitted");
  await ines.waitAllSaved();
  await ines.page.getByTestId("visit-sign").click();
  const dialog = ines.page.getByTestId("sign-off-dialog");
  await dialog.getByTestId("sign-off-password").fill(DEMO_PASSWORD);
  await dialog.getByTestId("sign-off-name").fill("Ines Marchetti");
  await ines.drawSignature();
  await ines.page.screenshot({ path: ".data/screenshots/visits-sign-dialog.png" });
  await dialog.getByTestId("sign-off-submit").click();
  await expect(ines.page.getByTestId("visit-signed")).toBeVisible({ timeout: 60_000 });
  await expect(ines.page.getByTestId("add-finding")).toHaveCount(0);
  await ines.page.screenshot({ path: ".data/screenshots/visits-signed.png", fullPage: true });
});
