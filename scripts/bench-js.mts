// npm run bench:js [-- --app=http://localhost:3000] [--email=sam.super@example.test] [--bare-port=3199]
// Script weight of the app's pages beside the floor, measured in one run:
// 1. the floor: a bare App Router page (one layout, one page, no imports) built with the project's
//    own `next` in a temporary folder (under .data/, deleted afterwards), served with `next start`;
// 2. the app: a running, built Placewright with the demo data (`bash scripts/start.sh`, or any
//    server given by --app), signed in as a demo user for the field screens.
// Each page is loaded in Debian's Chromium (Playwright, 390×844, service workers blocked so every
// script comes from the network) until the network is idle; the scripts it loaded are gzipped
// (level 9 as a server would) and summed. Prints gzipped KB and count per page and the ratio to
// the bare page; the acceptance limits (issue 20) are 1.5× for a field screen, 1.3× for the
// sign-in page and the calculator.
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { mkdtempSync, mkdirSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import { gzipSync } from "node:zlib";
import { chromium, type Browser, type Page } from "@playwright/test";

const argv = process.argv.slice(2);
const option = (name: string, fallback: string) => argv.find((a) => a.startsWith(`--${name}=`))?.slice(name.length + 3) ?? fallback;
const appUrl = option("app", "http://localhost:3000").replace(/\/$/, "");
const email = option("email", "sam.super@example.test");
const password = option("password", "placewright-demo");
const barePort = Number(option("bare-port", "3199"));
const root = path.resolve(import.meta.dirname, "..");
const nextBin = path.join(root, "node_modules/next/dist/bin/next");

async function waitFor(url: string, seconds: number) {
  for (let i = 0; i < seconds * 2; i++) {
    try {
      if ((await fetch(url)).status < 500) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`${url} did not answer within ${seconds} s`);
}

/** Builds and serves the bare page; returns its server process and folder. */
async function bareApp(): Promise<{ server: ChildProcess; dir: string }> {
  // A temporary folder inside the project (Turbopack resolves `next` only under its root), with the
  // project folder as that root so the same node_modules serve both builds.
  mkdirSync(path.join(root, ".data"), { recursive: true });
  const dir = mkdtempSync(path.join(root, ".data", "bench-js-bare-"));
  mkdirSync(path.join(dir, "app"));
  writeFileSync(path.join(dir, "next.config.mjs"), `export default { turbopack: { root: ${JSON.stringify(root)} } };\n`);
  writeFileSync(path.join(dir, "package.json"), JSON.stringify({ private: true, name: "bare" }));
  writeFileSync(path.join(dir, "app/layout.tsx"), `export default function Layout({ children }: { children: React.ReactNode }) {\n  return (<html lang="en"><body>{children}</body></html>);\n}\n`);
  writeFileSync(path.join(dir, "app/page.tsx"), `export default function Page() {\n  return <main><h1>Bare page</h1></main>;\n}\n`);
  console.log(`building the bare page in ${dir} (next ${JSON.parse((await import("node:fs")).readFileSync(path.join(root, "node_modules/next/package.json"), "utf8")).version})…`);
  const build = spawnSync(process.execPath, [nextBin, "build"], { cwd: dir, stdio: ["ignore", "ignore", "inherit"], env: { ...process.env, NEXT_TELEMETRY_DISABLED: "1" } });
  if (build.status !== 0) throw new Error("the bare page did not build");
  const server = spawn(process.execPath, [nextBin, "start", "-H", "127.0.0.1", "-p", String(barePort)], { cwd: dir, stdio: "ignore" });
  await waitFor(`http://127.0.0.1:${barePort}/`, 60);
  return { server, dir };
}

/** Gzipped bytes and count of the scripts `page` loads at `url` until the network is idle. */
async function measure(page: Page, url: string): Promise<{ kb: number; scripts: number; url: string }> {
  const bodies: Promise<number>[] = [];
  const onResponse = (response: import("@playwright/test").Response) => {
    if (response.request().resourceType() !== "script") return;
    bodies.push(response.body().then((b) => gzipSync(b, { level: 9 }).length, () => 0));
  };
  page.on("response", onResponse);
  await page.goto(url, { waitUntil: "networkidle" });
  await page.waitForTimeout(1500); // lazy chunks a screen asks for after its first paint
  page.off("response", onResponse);
  const sizes = await Promise.all(bodies);
  return { kb: sizes.reduce((a, b) => a + b, 0) / 1024, scripts: sizes.length, url: page.url() };
}

/** A fresh context per page: nothing cached between pages, service workers blocked. */
async function load(browser: Browser, url: string, storageState?: Awaited<ReturnType<import("@playwright/test").BrowserContext["storageState"]>>) {
  const context = await browser.newContext({ viewport: { width: 390, height: 844 }, serviceWorkers: "block", storageState });
  const page = await context.newPage();
  try {
    return await measure(page, url);
  } finally {
    await context.close();
  }
}

const { server, dir } = await bareApp();
const browser = await chromium.launch({ executablePath: "/usr/bin/chromium", args: ["--no-sandbox", "--disable-gpu", "--disable-dev-shm-usage"] });
try {
  const bare = await load(browser, `http://127.0.0.1:${barePort}/`);

  // Sign in once; find a placement and a visit report the demo user can open.
  const context = await browser.newContext({ viewport: { width: 390, height: 844 }, serviceWorkers: "block" });
  const page = await context.newPage();
  await page.goto(`${appUrl}/signin`);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(/\/today/, { timeout: 60_000 });
  await page.goto(`${appUrl}/field/today`, { waitUntil: "networkidle" });
  const placement = await page.locator('a[href*="/field/placement?id="]').first().getAttribute("href", { timeout: 30_000 }).catch(() => null);
  await page.goto(`${appUrl}/field/visits`, { waitUntil: "networkidle" });
  const visit = await page.locator('a[href*="/field/visit?id="]').first().getAttribute("href", { timeout: 15_000 }).catch(() => null);
  const state = await context.storageState();
  await context.close();

  const pages: [string, string, number, boolean][] = [
    ["sign-in", "/signin", 1.3, false],
    ["calculator", "/tools/evaporation", 1.3, false],
    ["field: today", "/field/today", 1.5, true],
    ...(placement ? [["field: placement", placement, 1.5, true] as [string, string, number, boolean]] : []),
    ["field: diary", "/field/diary", 1.5, true],
    ["field: visits", "/field/visits", 1.5, true],
    ...(visit ? [["field: visit report", visit, 1.5, true] as [string, string, number, boolean]] : []),
    ["field: conflicts", "/field/conflicts", 1.5, true],
  ];
  console.log(`\nscripts per page, gzipped (level 9), service workers blocked, 390×844`);
  console.log(`${"page".padEnd(22)} ${"KB".padStart(7)} ${"files".padStart(6)} ${"ratio".padStart(6)}  limit`);
  console.log(`${"bare App Router page".padEnd(22)} ${bare.kb.toFixed(1).padStart(7)} ${String(bare.scripts).padStart(6)} ${"1.00".padStart(6)}`);
  for (const [name, url, limit, signedIn] of pages) {
    const m = await load(browser, `${appUrl}${url}`, signedIn ? state : undefined);
    const ratio = m.kb / bare.kb;
    console.log(`${name.padEnd(22)} ${m.kb.toFixed(1).padStart(7)} ${String(m.scripts).padStart(6)} ${ratio.toFixed(2).padStart(6)}  ≤ ${limit} ${ratio <= limit ? "ok" : "OVER"}`);
  }
} finally {
  await browser.close();
  server.kill();
  rmSync(dir, { recursive: true, force: true });
}
