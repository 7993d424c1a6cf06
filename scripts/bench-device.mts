// npm run bench:device [-- --saves=500]
// Local saves on the device: the field screens' write path (lib/sync/client/mutate.ts: the record
// and its outbox entry in one IndexedDB transaction through Dexie), bundled with esbuild into a
// page served by Playwright's request routing (an http://localhost origin: IndexedDB and crypto.randomUUID are available), run in
// Debian's Chromium. One in five saves edits the placement, the others add a delivery. Prints
// p50/p95/max in ms; the acceptance limit (issue 20) is p95 ≤ 16 ms (one frame at 60 Hz).
import path from "node:path";
import { build } from "esbuild";
import { chromium } from "@playwright/test";

const argv = process.argv.slice(2);
const saves = Number(argv.find((a) => a.startsWith("--saves="))?.slice(8) ?? 500);
const root = path.resolve(import.meta.dirname, "..");

const bundle = await build({
  entryPoints: [path.join(root, "scripts/bench/device-entry.ts")],
  bundle: true,
  write: false,
  format: "iife",
  target: "es2022",
  minify: true,
  tsconfig: path.join(root, "tsconfig.json"),
  define: { "process.env.NODE_ENV": '"production"' },
  logLevel: "warning",
});
const script = bundle.outputFiles[0].text;

const browser = await chromium.launch({ executablePath: "/usr/bin/chromium", args: ["--no-sandbox", "--disable-gpu", "--disable-dev-shm-usage"] });
try {
  const page = await browser.newPage();
  await page.route("http://localhost:9/**", (route) =>
    route.fulfill({ contentType: "text/html", body: `<!doctype html><html><body><script>${script.replace(/<\/script/g, "<\\/script")}</script></body></html>` }),
  );
  await page.goto("http://localhost:9/"); // localhost: a secure context (crypto.randomUUID), never contacted
  await page.evaluate(() => (window as unknown as { benchSaves: (n: number) => Promise<number[]> }).benchSaves(20)); // warm-up: open the database, JIT
  const times = (await page.evaluate((n) => (window as unknown as { benchSaves: (n: number) => Promise<number[]> }).benchSaves(n), saves)) as number[];
  const sorted = [...times].sort((a, b) => a - b);
  const pct = (p: number) => sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
  console.log(`${saves} local saves (record + outbox entry, one IndexedDB transaction each), Chromium ${browser.version()}`);
  console.log(`p50 ${pct(50).toFixed(2)} ms, p95 ${pct(95).toFixed(2)} ms, max ${sorted.at(-1)!.toFixed(2)} ms (limit p95 ≤ 16 ms: ${pct(95) <= 16 ? "ok" : "OVER"})`);
} finally {
  await browser.close();
}
