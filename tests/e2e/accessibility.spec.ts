import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Page } from "@playwright/test";
import { DEMO, signIn } from "./support";

// Automated accessibility checks with axe-core (the engine Lighthouse's accessibility score runs),
// against WCAG 2.1 A and AA rules. It finds what a machine can find (names, roles, contrast, list
// structure); it does not replace trying the screens with a screen reader.
const WCAG = ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"];

async function violations(page: Page) {
  const { violations } = await new AxeBuilder({ page }).withTags(WCAG).analyze();
  // One line per rule and element, so a failure says what to fix.
  return violations.flatMap((v) => v.nodes.map((n) => `${v.id}: ${v.help} — ${n.target.join(" ")}`));
}

test.describe("accessibility on a phone", () => {
  test.use({ viewport: { width: 390, height: 844 } });

  test("sign-in page and calculator", async ({ page }) => {
    await page.goto("/signin");
    await expect(page.getByRole("heading", { name: "Sign in" })).toBeVisible();
    expect(await violations(page)).toEqual([]);
    await page.goto("/tools/evaporation");
    await expect(page.getByRole("heading", { level: 1 })).toBeVisible();
    expect(await violations(page)).toEqual([]);
  });

  test("the superintendent's field screens, with the header's account menu", async ({ page }) => {
    await signIn(page, DEMO.sam);
    await page.goto("/field/today");
    const placementLink = page.locator('a[href*="/field/placement?id="]').first();
    await expect(placementLink).toBeVisible();
    expect(await violations(page)).toEqual([]);
    const placement = await placementLink.getAttribute("href");
    await page.goto(placement!);
    await expect(page.getByTestId("placement-title")).toBeVisible();
    // The demo's first placement of the day has a temperature record: its maturity summary is checked too.
    await expect(page.getByTestId("maturity-summary")).toBeVisible();
    expect(await violations(page)).toEqual([]);
    for (const path of ["/field/diary", "/field/visits"]) {
      await page.goto(path);
      await expect(page.getByRole("heading", { level: 1 })).toBeVisible();
      expect(await violations(page), path).toEqual([]);
    }
  });
});

test.describe("accessibility at a desk", () => {
  test.use({ viewport: { width: 1440, height: 900 } });

  test("the office's review, project, lab and placement review pages", async ({ page }) => {
    await signIn(page, DEMO.olu);
    await page.goto("/review");
    await expect(page.getByRole("heading", { level: 1 })).toBeVisible();
    expect(await violations(page), "/review").toEqual([]);
    const placementReview = await page.getByTestId("placement-link").first().getAttribute("href");
    await page.goto(placementReview!);
    await expect(page.getByRole("heading", { level: 1 })).toBeVisible();
    expect(await violations(page), "placement review").toEqual([]);
    await page.goto("/projects");
    await page.getByRole("link", { name: /Larkspur Commons/ }).click();
    await expect(page.getByRole("heading", { name: "Larkspur Commons" })).toBeVisible();
    expect(await violations(page), "project page").toEqual([]);
    await page.getByRole("link", { name: "Lab results" }).click();
    await expect(page.getByRole("heading", { level: 1 })).toBeVisible();
    expect(await violations(page), "lab").toEqual([]);
  });
});
