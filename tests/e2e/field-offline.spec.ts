import { mkdirSync } from "node:fs";
import { expect, test, type APIRequestContext, type Page } from "@playwright/test";
import { FieldShellPage, PlacementPage, TodayPage } from "./field-pages";
import { DEMO, signIn } from "./support";

// The field screens offline (issue 5): a static shell opened from the service worker, records saved
// on the device, soft navigation with <Link>, nothing lost or doubled when the network returns, and
// a conflict between two people editing the same delivery.

const PHONE = { width: 390, height: 844 };
const PROJECT = "Millrace Pump House";

type Page_<T> = { items: T[]; nextCursor: string | null };
type Row = { id: string; version: number; [field: string]: unknown };

async function list(request: APIRequestContext, projectId: string, type: string, query: string): Promise<Row[]> {
  const res = await request.get(`/api/projects/${projectId}/records/${type}?${query}&limit=200`);
  expect(res.status(), `GET ${type}`).toBe(200);
  return ((await res.json()) as Page_<Row>).items;
}

async function waitForServiceWorker(page: Page) {
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await page.reload();
  await expect.poll(() => page.evaluate(() => !!navigator.serviceWorker.controller), { timeout: 15_000 }).toBe(true);
}

test("field screens work offline, sync every record once, and resolve a conflict", async ({ browser }) => {
  test.setTimeout(300_000);
  mkdirSync(".data/screenshots", { recursive: true });
  const stamp = Date.now().toString(36).toUpperCase();
  const element = `E2E roof slab ${stamp}`;
  const ticket1 = `T1-${stamp}`;
  const ticket2 = `T2-${stamp}`;

  // Online: sign in, open the field screens once, wait for the first sync and the service worker.
  const context = await browser.newContext({ viewport: PHONE });
  const first = await context.newPage();
  await signIn(first, DEMO.sam);
  const projects = (await (await first.request.get("/api/projects")).json()) as { id: string; name: string }[];
  const projectId = projects.find((p) => p.name === PROJECT)!.id;
  const today = new TodayPage(first);
  await today.open();
  await expect(first.getByTestId("field-project-switcher")).toBeVisible({ timeout: 30_000 });
  await today.waitAllSaved();
  await waitForServiceWorker(first);
  await today.expectUser(/Sam/);
  await today.screenshot("today-online");

  // Offline: a new tab on a field URL, reloaded, still opens with Sam's name.
  await context.setOffline(true);
  const page = await context.newPage();
  await page.goto("/field/today");
  await page.reload();
  const shell = new TodayPage(page);
  await expect(page.getByRole("heading", { name: "Today", level: 1 })).toBeVisible();
  await shell.expectUser(/Sam/);
  await expect(shell.syncStatus()).toHaveAttribute("data-state", "Offline");
  await first.close();

  // Soft navigation between screens: the in-memory marker survives.
  await shell.mark();
  await shell.nav("Diary");
  await expect(page.getByRole("heading", { name: "Daily diary" })).toBeVisible();
  await shell.expectMarked();
  await shell.nav("To reconcile");
  await expect(page.getByRole("heading", { name: "To reconcile" })).toBeVisible();
  await shell.expectMarked();
  await shell.nav("Today");
  await expect(page.getByRole("heading", { name: "Today", level: 1 })).toBeVisible();
  await shell.expectMarked();

  // A placement with two trucks, an out-of-tolerance test, a hot windy observation and its checklist.
  const placementId = await shell.planPlacement({ project: PROJECT, element, least: "250", volume: "12", mixCode: "MPH-30" });
  await shell.expectMarked();
  const placement = new PlacementPage(page);
  await placement.addTruck({ ticket: ticket1, volume: "6" });
  await placement.addTruck({ ticket: ticket2, volume: "6", waterL: "20" });
  await expect(placement.deliveries()).toHaveCount(2);
  await placement.addHotWindyObservation({ air: "35", rh: "15", wind: "40", concrete: "35" });
  await placement.startHotChecklist();
  // Its day chart draws offline: recharts loads when the chart nears the screen, from the precache.
  await page.getByTestId("weather-chart").scrollIntoViewIfNeeded();
  await expect(page.getByTestId("weather-chart").locator("svg").first()).toBeVisible();
  await page.getByTestId("weather-watch").scrollIntoViewIfNeeded();
  await page.screenshot({ path: ".data/screenshots/field-placement-weather-offline-screen.png" });
  await page.getByTestId("deliveries").scrollIntoViewIfNeeded();
  await page.screenshot({ path: ".data/screenshots/field-placement-deliveries-offline-screen.png" });
  await page.evaluate(() => window.scrollTo(0, 0));
  await placement.screenshot("placement-offline");

  // Back to Today (soft): the new placement is listed.
  await shell.mark();
  await page.getByTestId("back-to-today").click();
  await expect(page.getByTestId("field-placement-link").filter({ hasText: element })).toBeVisible();
  await shell.expectMarked();
  await shell.screenshot("today-offline");

  // Diary offline.
  await shell.nav("Diary");
  await page.getByTestId("diary-work").fill("Roof slab placed, east half.");
  await page.getByTestId("diary-save").click();
  await page.getByTestId("diary-crew-trade").fill(`Finishers ${stamp}`);
  await page.getByTestId("diary-crew-count").fill("4");
  await page.getByTestId("diary-crew-add").click();
  await expect(page.getByTestId("diary-crew-row").filter({ hasText: `Finishers ${stamp}` })).toBeVisible();
  await shell.expectMarked();
  await shell.screenshot("diary-offline");
  await shell.nav("To reconcile");
  await expect(page.getByTestId("no-conflicts")).toBeVisible();
  await shell.screenshot("conflicts-offline");

  // Close the page and reopen offline: everything is still there.
  await page.close();
  const again = await context.newPage();
  const reopened = new PlacementPage(again);
  await reopened.open(placementId);
  await reopened.expectUser(/Sam/);
  await expect(reopened.deliveries()).toHaveCount(2);
  await expect(again.getByTestId("weather-high-risk")).toBeVisible();
  await expect(again.getByTestId("checklist-hot-weather").getByTestId("checklist-item")).toHaveCount(8);

  // Network back: everything reaches the server exactly once.
  await context.setOffline(false);
  await reopened.waitAllSaved(60_000);
  const request = again.request;
  const placementRes = await request.get(`/api/projects/${projectId}/records/placements/${placementId}`);
  expect(placementRes.status()).toBe(200);
  expect(((await placementRes.json()) as Row).element).toBe(element);
  const deliveries = await list(request, projectId, "deliveries", `placementId=${placementId}`);
  expect(deliveries.map((d) => d.ticketNumber).sort()).toEqual([ticket1, ticket2]);
  expect(await list(request, projectId, "weather-observations", `placementId=${placementId}`)).toHaveLength(1);
  const checklists = await list(request, projectId, "checklists", `placementId=${placementId}`);
  expect(checklists).toHaveLength(1);
  const items = await list(request, projectId, "checklist-items", `checklistId=${checklists[0].id}`);
  expect(items).toHaveLength(8);
  expect(items.filter((i) => i.answer === "yes")).toHaveLength(1);
  await reopened.screenshot("placement-online");

  // The inspector samples truck 2 on her own phone, also offline: the test is out of tolerance.
  const inspector = await browser.newContext({ viewport: PHONE });
  const inesFirst = await inspector.newPage();
  await signIn(inesFirst, DEMO.ines);
  const inesToday = new TodayPage(inesFirst);
  await inesToday.open();
  await inesToday.waitAllSaved();
  await waitForServiceWorker(inesFirst);
  await expect(inesFirst.getByTestId("field-placement-link").filter({ hasText: element })).toBeVisible({ timeout: 30_000 });
  await inspector.setOffline(true);
  await inesToday.mark();
  await inesFirst.getByTestId("field-placement-link").filter({ hasText: element }).click();
  const inesPlacement = new PlacementPage(inesFirst);
  await expect(inesFirst.getByTestId("placement-title")).toHaveText(element);
  await inesPlacement.expectMarked();
  await expect(inesFirst.getByTestId("add-delivery")).toHaveCount(0);
  await inesPlacement.addFieldTestOutOfTolerance("180");
  await inesFirst.close();
  const inesAgain = await inspector.newPage();
  const inesReopened = new PlacementPage(inesAgain);
  await inesReopened.open(placementId);
  await inesReopened.expectUser(/Ines/);
  await expect(inesAgain.getByTestId("field-test-warning")).toBeVisible();
  await inesReopened.screenshot("placement-inspector-offline");
  await inspector.setOffline(false);
  await inesReopened.waitAllSaved(60_000);
  const tests = await list(inesAgain.request, projectId, "field-tests", `placementId=${placementId}`);
  expect(tests).toHaveLength(1);
  expect(tests[0].slumpMm).toBe(180);
  await inspector.close();

  // Online screenshots of the other screens.
  const shellOnline = new FieldShellPage(again);
  await shellOnline.nav("Diary");
  await expect(again.getByTestId("diary-crew-row").filter({ hasText: `Finishers ${stamp}` })).toBeVisible();
  await shellOnline.screenshot("diary-online");
  await shellOnline.nav("To reconcile");
  await shellOnline.screenshot("conflicts-online");
  await shellOnline.nav("Today");
  await reopened.open(placementId);

  // The conflict: Sam edits the ticket offline while the office edits the same field online.
  const delivery = deliveries.find((d) => d.ticketNumber === ticket1)!;
  await context.setOffline(true);
  await reopened.editTicket(ticket1, `${ticket1}-SAM`);
  const office = await browser.newContext();
  const officePage = await office.newPage();
  await signIn(officePage, DEMO.olu);
  const current = (await (await officePage.request.get(`/api/projects/${projectId}/records/deliveries/${delivery.id}`)).json()) as Row;
  const patched = await officePage.request.patch(`/api/projects/${projectId}/records/deliveries/${delivery.id}`, {
    data: { baseVersion: current.version, patch: { ticketNumber: `${ticket1}-OFFICE` } },
  });
  expect(patched.status()).toBe(200);
  await office.close();

  await context.setOffline(false);
  await expect(again.getByTestId("sync-conflicts")).toBeVisible({ timeout: 60_000 });
  await reopened.mark();
  await again.getByTestId("sync-conflicts").click();
  const card = again.getByTestId("conflict").filter({ has: again.getByTestId("conflict-field-ticketNumber") });
  await expect(card.getByTestId("conflict-theirs-ticketNumber")).toContainText(`${ticket1}-OFFICE`);
  await expect(card.getByTestId("conflict-mine-ticketNumber")).toContainText(`${ticket1}-SAM`);
  await reopened.expectMarked();
  await reopened.screenshot("conflicts-with-conflict");
  await card.getByTestId("keep-mine").click();
  await expect(again.getByTestId("no-conflicts")).toBeVisible();
  await reopened.waitAllSaved(60_000);
  await expect
    .poll(async () => ((await (await request.get(`/api/projects/${projectId}/records/deliveries/${delivery.id}`)).json()) as Row).ticketNumber, {
      timeout: 30_000,
    })
    .toBe(`${ticket1}-SAM`);
  await context.close();
});
