import { defineConfig } from "@playwright/test";

const port = Number(process.env.APP_PORT ?? 3100);
const baseURL = process.env.PLAYWRIGHT_BASE_URL ?? `http://localhost:${port}`;
process.env.PLAYWRIGHT_JSON_OUTPUT_NAME ??= ".data/test-run/playwright.json";
// PLAYWRIGHT_PAIR=1: the same build as two instances behind the round-robin proxy on the app port
// (scripts/serve-pair.mjs); the offline and sign-in suites and tests/e2e/pair/ run against it.
const pair = process.env.PLAYWRIGHT_PAIR === "1";
process.env.PAIR_PORTS ??= `${port + 200},${port + 201}`;
const serve = pair
  ? `node scripts/serve-pair.mjs -H 127.0.0.1 -p ${port} --ports ${process.env.PAIR_PORTS}`
  : `node scripts/serve.mjs -H 127.0.0.1 -p ${port}`;

export default defineConfig({
  testDir: "tests",
  ...(pair
    ? { testMatch: ["e2e/field-offline.spec.ts", "e2e/sign-in.spec.ts", "e2e/pair/**/*.spec.ts"] }
    : { testMatch: ["e2e/**/*.spec.ts", "security/**/*.spec.ts"], testIgnore: ["e2e/pair/**/*.spec.ts"] }),
  outputDir: ".data/test-run/playwright-artifacts",
  workers: 1,
  fullyParallel: false,
  retries: process.env.CI ? 1 : 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: [["list"], ["json"]],
  use: {
    baseURL,
    serviceWorkers: "allow",
    trace: "retain-on-failure",
    screenshot: "only-on-failure",
    launchOptions: {
      executablePath: "/usr/bin/chromium",
      args: [
        "--no-sandbox",
        "--disable-gpu",
        "--disable-dev-shm-usage",
        "--disable-background-networking",
        "--disable-component-update",
        "--disable-sync",
        "--no-first-run",
        "--disable-quic",
      ],
    },
  },
  webServer: {
    command: serve,
    url: `http://127.0.0.1:${port}/api/health`,
    reuseExistingServer: false,
    timeout: 180_000,
    // The digest worker stays off while tests drive the app (integration tests cover it).
    // The served app connects as the role that owns nothing (scripts/app-role.mts) when one is set.
    env: { ...(process.env as Record<string, string>), DATABASE_URL: process.env.APP_DATABASE_URL ?? process.env.DATABASE_URL ?? "", DIGEST_WORKER: "off" },
    stdout: "ignore",
    stderr: "pipe",
  },
});
