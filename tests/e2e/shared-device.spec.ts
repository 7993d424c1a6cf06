import { mkdirSync } from "node:fs";
import { expect, test, type Page } from "@playwright/test";
import { TodayPage } from "./field-pages";
import { DEMO, signIn } from "./support";

// A shared phone (issue 19): person A works offline, signs out and erases; person B signs in on the
// same browser profile and sees none of A's data; once A's sign-in is older than the offline window
// the field screens show nothing of A's without a PIN; with a PIN set online, A opens offline.

const PHONE = { width: 390, height: 844 };
const PROJECT = "Millrace Pump House";

async function waitForServiceWorker(page: Page) {
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await page.reload();
  await expect.poll(() => page.evaluate(() => !!navigator.serviceWorker.controller), { timeout: 15_000 }).toBe(true);
}

const userDatabases = (page: Page) =>
  page.evaluate(async () => (await indexedDB.databases()).map((d) => d.name ?? "").filter((n) => n.startsWith("placewright-user-")));

/** Moves the device's "last good session" of a person back in time, as days passing would. */
async function ageLastSession(page: Page, userId: string, days: number) {
  await page.evaluate(
    async ({ userId, days }) => {
      const db = await new Promise<IDBDatabase>((resolve, reject) => {
        const req = indexedDB.open("placewright-device");
        req.onsuccess = () => resolve(req.result);
        req.onerror = () => reject(req.error);
      });
      await new Promise<void>((resolve, reject) => {
        const tx = db.transaction("identities", "readwrite");
        const store = tx.objectStore("identities");
        const get = store.get(userId);
        get.onsuccess = () => store.put({ ...get.result, sessionSeenAt: new Date(Date.now() - days * 86_400_000).toISOString() });
        tx.oncomplete = () => resolve();
        tx.onerror = () => reject(tx.error);
      });
      db.close();
    },
    { userId, days },
  );
}

async function sessionUserId(page: Page): Promise<string> {
  return ((await (await page.request.get("/api/auth/session")).json()) as { user: { id: string } }).user.id;
}

test("shared device: erase, another person, offline window and device PIN", async ({ browser }) => {
  test.setTimeout(300_000);
  mkdirSync(".data/screenshots", { recursive: true });
  const element = `E2E shared phone slab ${Date.now().toString(36).toUpperCase()}`;
  const context = await browser.newContext({ viewport: PHONE });
  const page = await context.newPage();

  // A (Sam) signs in, opens the field screens, then works offline: one placement waits in the outbox.
  await signIn(page, DEMO.sam);
  const samId = await sessionUserId(page);
  const today = new TodayPage(page);
  await today.open();
  await today.waitAllSaved();
  await waitForServiceWorker(page);
  await context.setOffline(true);
  await today.planPlacement({ project: PROJECT, element, least: "250", volume: "12", mixCode: "MPH-30" });
  expect(await userDatabases(page)).toContain(`placewright-user-${samId}`);

  // Sign out and erase: the unsent change is named and the erase refused until A accepts losing it.
  await page.getByTestId("user-menu").click();
  await page.getByTestId("erase-device").click();
  await expect(page.getByTestId("erase-unsent")).toContainText("1 change has not reached the server yet");
  await expect(page.getByTestId("erase-confirm")).toBeDisabled();
  await page.screenshot({ path: ".data/screenshots/erase-dialog-phone.png" });
  await page.getByTestId("erase-accept").check();
  await page.getByTestId("erase-confirm").click();
  // Erasing signs out and leaves for the sign-in screen: read the databases once that page is there.
  await page.waitForURL(/\/(signin|offline)/);
  await page.waitForLoadState();
  await expect.poll(() => userDatabases(page).catch(() => ["(page still loading)"])).not.toContain(`placewright-user-${samId}`);

  // B (Ines, on the same project) signs in on the same browser profile: nothing of A's is there.
  await context.setOffline(false);
  await page.waitForLoadState();
  await signIn(page, DEMO.ines);
  await today.open();
  await today.expectUser(/Ines/);
  await today.waitAllSaved();
  await expect(page.getByText(element)).toHaveCount(0);
  expect(await userDatabases(page)).not.toContain(`placewright-user-${samId}`);
  const projects = (await (await page.request.get("/api/projects")).json()) as { id: string; name: string }[];
  const millrace = projects.find((p) => p.name === PROJECT)!.id;
  const onServer = (await (await page.request.get(`/api/projects/${millrace}/records/placements?limit=200`)).json()) as { items: { element: string }[] };
  expect(onServer.items.map((p) => p.element)).not.toContain(element);

  // A signs in again later; the device remembers A. Offline past the window, with no PIN: nothing of A's.
  await page.getByTestId("user-menu").click();
  await page.getByRole("menuitem", { name: "Sign out", exact: true }).click();
  await signIn(page, DEMO.sam);
  await today.open();
  await today.waitAllSaved();
  await context.setOffline(true);
  await ageLastSession(page, samId, 10);
  await page.reload();
  await expect(page.getByTestId("field-locked")).toBeVisible();
  await expect(page.getByTestId("field-user-name")).toHaveCount(0);
  await expect(page.getByRole("heading", { name: "Today", level: 1 })).toHaveCount(0);
  await expect(page.getByText("Sam Okafor")).toHaveCount(0);
  await page.screenshot({ path: ".data/screenshots/field-locked-phone.png" });

  // Online again, A sets a device PIN; offline past the window, the PIN opens A's data.
  await context.setOffline(false);
  await page.goto("/account");
  await page.getByTestId("pin-new").fill("2468");
  await page.getByTestId("pin-repeat").fill("2468");
  await page.getByTestId("pin-save").click();
  await expect(page.getByTestId("pin-result")).toBeVisible();
  await page.screenshot({ path: ".data/screenshots/account-phone.png", fullPage: true });
  await today.open();
  await context.setOffline(true);
  await ageLastSession(page, samId, 10);
  await page.reload();
  await expect(page.getByTestId("field-pin")).toBeVisible();
  await page.screenshot({ path: ".data/screenshots/field-pin-phone.png" });
  await page.getByTestId("field-pin-input").fill("1111");
  await page.getByTestId("field-pin-submit").click();
  await expect(page.getByTestId("field-pin")).toContainText("That PIN is not right");
  await expect(page.getByRole("heading", { name: "Today", level: 1 })).toHaveCount(0);
  await page.getByTestId("field-pin-input").fill("2468");
  await page.getByTestId("field-pin-submit").click();
  await expect(page.getByRole("heading", { name: "Today", level: 1 })).toBeVisible();
  await today.expectUser(/Sam/);
  await context.close();
});
