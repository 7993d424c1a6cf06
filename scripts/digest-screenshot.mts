// Renders a project's digest e-mail for one day in Debian's Chromium at desktop and phone widths:
//   npx tsx scripts/digest-screenshot.mts [projectId] [YYYY-MM-DD]
// (defaults: Larkspur Commons, 2026-11-17). Writes .data/screenshots/digest-desktop.png and digest-phone.png.
import { mkdirSync } from "node:fs";
import { chromium } from "playwright-core";
import { closeDb } from "../db/index.ts";
import { DEMO_IDS } from "./seed/ids.ts";
import { buildDigest, digestLinks } from "../lib/digest/content.ts";
import { loadDigestDay } from "../lib/digest/load.ts";
import { appOrigin } from "../lib/mail/transport.ts";

const projectId = process.argv[2] ?? DEMO_IDS.projects.larkspur;
const date = process.argv[3] ?? "2026-11-17";
const day = await loadDigestDay(projectId, date);
const { html, subject } = buildDigest(day, digestLinks(appOrigin(), projectId, date, `${appOrigin()}/digest/unsubscribe?token=example`));
await closeDb();

mkdirSync(".data/screenshots", { recursive: true });
const browser = await chromium.launch({ executablePath: "/usr/bin/chromium", args: ["--no-sandbox", "--disable-gpu", "--headless", "--disable-dev-shm-usage"] });
try {
  for (const [name, width] of [["desktop", 1280], ["phone", 390]] as const) {
    const page = await browser.newPage({ viewport: { width, height: 900 }, deviceScaleFactor: width < 500 ? 2 : 1 });
    await page.setContent(html, { waitUntil: "load" });
    await page.screenshot({ path: `.data/screenshots/digest-${name}.png`, fullPage: true });
    await page.close();
  }
} finally {
  await browser.close();
}
console.log(`${subject}\n.data/screenshots/digest-desktop.png, .data/screenshots/digest-phone.png`);
