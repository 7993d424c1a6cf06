// npm run bench:lighthouse [-- --app=http://localhost:3000] [--email=sam.super@example.test]
// Lighthouse (npm, the version pinned in package.json) driving Debian's Chromium with its mobile
// preset (the default config: emulated mid-range phone, simulated slow 4G), against a running,
// built Placewright with the demo data (`bash scripts/start.sh`). Pages: the sign-in page, the
// calculator, and the field screens signed in as a demo user (the session cookie is passed to
// Lighthouse as a header). Prints performance, accessibility and best practices per page; the
// acceptance (issue 20) is performance ≥ 95 and accessibility = 100 on every page.
import lighthouse from "lighthouse";
import { chromium } from "@playwright/test";

const argv = process.argv.slice(2);
const option = (name: string, fallback: string) => argv.find((a) => a.startsWith(`--${name}=`))?.slice(name.length + 3) ?? fallback;
const appUrl = option("app", "http://localhost:3000").replace(/\/$/, "");
const email = option("email", "sam.super@example.test");
const password = option("password", "placewright-demo");
const port = Number(option("debug-port", "9333"));

// --why also prints the scripts that kept the main thread busiest on each page.
// One Chromium with a remote-debugging port: Playwright signs in, Lighthouse drives the same browser.
const browser = await chromium.launch({
  executablePath: "/usr/bin/chromium",
  args: ["--no-sandbox", "--disable-gpu", "--disable-dev-shm-usage", `--remote-debugging-port=${port}`],
});
try {
  const context = await browser.newContext();
  const page = await context.newPage();
  await page.goto(`${appUrl}/signin`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(/\/today/, { timeout: 60_000 });
  await page.goto(`${appUrl}/field/today`, { waitUntil: "networkidle" });
  const placement = await page.locator('a[href*="/field/placement?id="]').first().getAttribute("href", { timeout: 30_000 }).catch(() => null);
  const cookie = (await context.cookies()).map((c) => `${c.name}=${c.value}`).join("; ");
  await context.close();

  const pages: [string, string, boolean][] = [
    ["sign-in", "/signin", false],
    ["calculator", "/tools/evaporation", false],
    ["field: today", "/field/today", true],
    ...(placement ? [["field: placement", placement, true] as [string, string, boolean]] : []),
    ["field: diary", "/field/diary", true],
    ["field: visits", "/field/visits", true],
  ];
  console.log(`lighthouse, mobile preset, ${appUrl}`);
  console.log(`${"page".padEnd(20)} ${"perf".padStart(5)} ${"a11y".padStart(5)} ${"best".padStart(5)}  (perf ≥ 95, a11y = 100)`);
  for (const [name, path, signedIn] of pages) {
    const result = await lighthouse(`${appUrl}${path}`, {
      port,
      output: "json",
      logLevel: "error",
      onlyCategories: ["performance", "accessibility", "best-practices"],
      ...(signedIn ? { extraHeaders: { Cookie: cookie } } : {}),
    });
    const c = result?.lhr.categories;
    const score = (key: string) => Math.round((c?.[key]?.score ?? 0) * 100);
    const ok = score("performance") >= 95 && score("accessibility") === 100;
    console.log(`${name.padEnd(20)} ${String(score("performance")).padStart(5)} ${String(score("accessibility")).padStart(5)} ${String(score("best-practices")).padStart(5)}  ${ok ? "ok" : "below"}`);
    const audits = result?.lhr.audits ?? {};
    // What a performance score is made of: the metrics it weighs, as Lighthouse rounds them.
    const metric = (id: string) => audits[id]?.displayValue ?? "n/a";
    console.log(`    FCP ${metric("first-contentful-paint")}, LCP ${metric("largest-contentful-paint")}, TBT ${metric("total-blocking-time")}, CLS ${metric("cumulative-layout-shift")}, SI ${metric("speed-index")}`);
    if (process.argv.includes("--why")) explain(audits);
    // What an accessibility score below 100 is made of: each failed audit and the elements it names.
    for (const ref of c?.accessibility?.auditRefs ?? []) {
      const audit = audits[ref.id];
      if (!audit || ref.weight === 0 || audit.score === null || audit.score === 1) continue;
      const items = ((audit.details as { items?: { node?: { snippet?: string; nodeLabel?: string } }[] } | undefined)?.items ?? []).slice(0, 3);
      console.log(`    a11y: ${audit.id}: ${audit.title}`);
      for (const item of items) console.log(`      ${item.node?.nodeLabel ?? ""} ${item.node?.snippet?.slice(0, 140) ?? ""}`);
    }
  }
} finally {
  await browser.close();
}

/** --why: the scripts that kept the main thread busiest. */
function explain(audits: Record<string, { details?: unknown }>) {
  type Items = { items?: { url?: string; total?: number; scripting?: number }[] };
  const bootup = ((audits["bootup-time"]?.details as Items | undefined)?.items ?? []).slice(0, 6);
  for (const item of bootup) console.log(`    script ${Math.round(item.scripting ?? 0)} ms of ${Math.round(item.total ?? 0)} ms: ${item.url}`);
}
