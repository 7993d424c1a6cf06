// The administrator sets a project specification's own limits in the project's units: a Celsius
// figure typed into an inch-pound project is refused with the range in °F, and a saved value comes
// back in the same units. A new project is created for it, so the demo's projects keep their values.
import { expect, test } from "@playwright/test";
import { DEMO, signIn } from "./support";

const SHOTS = ".data/screenshots";

test("an inch-pound project's specification: a °C figure refused in °F, a shorter discharge limit saved", async ({ browser }) => {
  for (const viewport of [{ width: 1440, height: 900 }, { width: 390, height: 844 }]) {
    const context = await browser.newContext({ viewport });
    const page = await context.newPage();
    await signIn(page, DEMO.ada);
    await page.goto("/admin/projects");
    const code = `SP-${viewport.width}-${Date.now() % 100000}`;
    const name = `Specification yard ${code}`; // unique: a re-run on the same database adds another
    await page.getByLabel("Name").fill(name);
    await page.getByLabel("Code").fill(code);
    await page.getByLabel("Time zone").fill("America/Chicago");
    await page.getByLabel("Units").selectOption("IP");
    await page.getByRole("button", { name: "Create project" }).click();
    await expect(page.getByTestId("project-result")).toContainText("created");
    await page.getByRole("link", { name }).click();

    const form = page.getByTestId("project-spec-form");
    // ACI 305R's published inch-pound limit is the hint of a blank evaporation limit.
    await expect(form).toContainText("Blank: 0.2 lb/ft²/h (ACI 305R)");
    await expect(form.getByLabel("Maximum concrete temperature")).toHaveValue("95"); // 35 °C
    await form.getByLabel("Maximum concrete temperature").fill("35");
    await form.getByRole("button", { name: "Save specification" }).click();
    await expect(form.getByText("The maximum concrete temperature must be between 59 °F and 113 °F.")).toBeVisible();
    await page.screenshot({ path: `${SHOTS}/project-spec-refused-${viewport.width}.png`, fullPage: true });

    await form.getByLabel("Maximum concrete temperature").fill("95");
    await form.getByLabel("Discharge time limit").fill("60");
    await form.getByRole("button", { name: "Save specification" }).click();
    await expect(page.getByTestId("project-spec-result")).toContainText("Saved");
    await page.reload();
    await expect(page.getByTestId("project-spec-form").getByLabel("Discharge time limit")).toHaveValue("60");
    await page.screenshot({ path: `${SHOTS}/project-spec-${viewport.width}.png`, fullPage: true });
    await context.close();
  }
});
