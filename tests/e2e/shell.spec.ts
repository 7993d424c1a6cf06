import { mkdirSync } from "node:fs";
import { expect, test, type Page } from "@playwright/test";
import { DEMO, signIn } from "./support";

const SHOTS = ".data/screenshots";
mkdirSync(SHOTS, { recursive: true });

async function noHorizontalScroll(page: Page) {
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  expect(overflow).toBeLessThanOrEqual(0);
}

test.describe("app shell at phone and desktop sizes", () => {
  test("phone: sign-in, today and projects fit one column with the nav under the thumb", async ({ browser }) => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    await page.goto("/signin");
    await noHorizontalScroll(page);
    await page.screenshot({ path: `${SHOTS}/signin-phone.png`, fullPage: true });

    await signIn(page, DEMO.sam);
    await noHorizontalScroll(page);
    const bottomNav = page.getByRole("navigation", { name: "Main" }).last();
    await expect(bottomNav).toBeVisible();
    // Touch targets: every bottom-nav link is at least 48 px tall.
    for (const box of await bottomNav.getByRole("link").evaluateAll((els) => els.map((e) => e.getBoundingClientRect().height))) {
      expect(box).toBeGreaterThanOrEqual(48);
    }
    await page.screenshot({ path: `${SHOTS}/today-phone.png`, fullPage: true });
    await page.goto("/projects");
    await noHorizontalScroll(page);
    await page.screenshot({ path: `${SHOTS}/projects-phone.png`, fullPage: true });
    await context.close();
  });

  test("desktop: top navigation, project switcher, daylight mode", async ({ browser }) => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    await signIn(page, DEMO.olu);
    await expect(page.getByRole("navigation", { name: "Main" }).first().getByRole("link", { name: "Today" })).toBeVisible();
    await page.getByTestId("project-switcher").selectOption({ label: "Millrace Pump House" });
    await expect(page.getByRole("heading", { name: "Millrace Pump House" })).toBeVisible();
    await page.screenshot({ path: `${SHOTS}/project-desktop.png`, fullPage: true });

    await page.getByRole("button", { name: "Daylight mode" }).click();
    await expect(page.locator("html")).toHaveAttribute("data-contrast", "daylight");
    await page.reload();
    await expect(page.locator("html")).toHaveAttribute("data-contrast", "daylight");
    await page.screenshot({ path: `${SHOTS}/project-desktop-daylight.png`, fullPage: true });
    await context.close();
  });

  test("admin screens at desktop size", async ({ browser }) => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    await signIn(page, DEMO.ada);
    await page.goto("/admin");
    await expect(page.getByTestId("people-table")).toContainText("sam.super@example.test");
    await page.screenshot({ path: `${SHOTS}/admin-people-desktop.png`, fullPage: true });
    await page.goto("/admin/projects");
    await page.getByRole("link", { name: "Larkspur Commons" }).click();
    await expect(page.getByTestId("members-table")).toContainText("Oona Lindqvist");
    await page.screenshot({ path: `${SHOTS}/admin-members-desktop.png`, fullPage: true });
    await context.close();
  });

  test("the web app manifest makes the app installable", async ({ request }) => {
    const res = await request.get("/manifest.webmanifest");
    expect(res.ok()).toBe(true);
    const manifest = await res.json();
    expect(manifest).toMatchObject({ name: "Placewright", display: "standalone", start_url: "/today" });
    const sizes = manifest.icons.map((i: { sizes: string }) => i.sizes);
    expect(sizes).toEqual(expect.arrayContaining(["192x192", "512x512"]));
    for (const icon of manifest.icons) expect((await request.get(icon.src)).ok()).toBe(true);
  });

  test("health route reports the app and database ready", async ({ request }) => {
    const res = await request.get("/api/health");
    expect(res.status()).toBe(200);
    expect(await res.json()).toEqual({ app: "ready", database: "ready" });
  });
});

test("the digest's day link shows only that day's placements", async ({ page }) => {
  await signIn(page, DEMO.oona);
  // Larkspur Commons, 17 November 2026: the level 2 deck (demo scenario).
  await page.goto("/projects/6f1c3e20-8d44-4b7e-b1a2-00000000000a?date=2026-11-17");
  await expect(page.getByRole("heading", { name: "Placements on 2026-11-17" })).toBeVisible();
  await expect(page.getByText("Level 2 deck")).toBeVisible();
  await expect(page.getByText("Podium slab, east half")).toHaveCount(0);
  await page.getByRole("link", { name: "Show every placement" }).click();
  await expect(page.getByText("Podium slab, east half")).toBeVisible();
});

test("office screens show the sync state, not only online or offline", async ({ page }) => {
  await signIn(page, DEMO.olu);
  await page.goto("/review");
  // The shell mounts the sync provider: after the first pull the control says the device is up to date.
  await expect(page.getByTestId("sync-status")).toContainText("All saved", { timeout: 30_000 });
  await page.goto("/lab");
  await expect(page.getByTestId("sync-status")).toContainText("All saved", { timeout: 30_000 });
});
