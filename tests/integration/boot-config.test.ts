// A process entry point (the standalone digest worker) refuses to start on a bad configuration with
// one line naming the variable and exit status 78 (EX_CONFIG, sysexits.h). The app server does the
// same from instrumentation.ts (tests/e2e/pair.spec.ts boots it).
import { spawnSync } from "node:child_process";
import { describe, expect, it } from "vitest";

function boot(env: Record<string, string>) {
  const result = spawnSync(process.execPath, ["--import", "tsx", "scripts/worker.mts"], { env: { ...process.env, ...env }, encoding: "utf8", timeout: 60_000 });
  return { status: result.status, stderr: result.stderr.trim(), stdout: result.stdout.trim() };
}

describe("boot with a bad configuration", () => {
  it("a missing DATABASE_URL stops with one line naming it", () => {
    const r = boot({ DATABASE_URL: "" });
    expect(r.status).toBe(78);
    expect(r.stderr.split("\n")).toEqual([expect.stringContaining("DATABASE_URL is missing")]);
    expect(r.stdout).toBe("");
  }, 60_000);

  it("a malformed S3 endpoint stops with one line naming it, without its value", () => {
    const r = boot({ S3_ENDPOINT: "s3.internal:9000/photos" });
    expect(r.status).toBe(78);
    expect(r.stderr.split("\n")).toEqual([expect.stringContaining("S3_ENDPOINT must be a URL starting with http:// or https://")]);
    expect(r.stderr).not.toContain("s3.internal");
  }, 60_000);
});
