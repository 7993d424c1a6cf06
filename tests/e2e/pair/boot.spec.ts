// A bad setting stops an instance's boot with one line naming it.
import { spawn } from "node:child_process";
import { expect, test } from "@playwright/test";
import { DOOMED_PORT } from "./support";

test.describe.configure({ mode: "serial" });

test("a missing DATABASE_URL or a malformed S3 endpoint stops the boot with one line naming it", async () => {
  test.setTimeout(120_000);
  const boot = (env: Record<string, string | undefined>) =>
    new Promise<{ code: number | null; stderr: string }>((resolve) => {
      const child = spawn(process.execPath, ["scripts/serve.mjs", "-H", "127.0.0.1", "-p", String(DOOMED_PORT + 1)], { env: { ...process.env, ...env } as NodeJS.ProcessEnv, stdio: ["ignore", "ignore", "pipe"] });
      let stderr = "";
      child.stderr!.on("data", (d) => (stderr += d));
      child.on("exit", (code) => resolve({ code, stderr }));
    });
  const [noDb, badS3] = await Promise.all([boot({ DATABASE_URL: "" }), boot({ S3_ENDPOINT: "localhost:4569 bucket" })]);
  for (const [result, name] of [
    [noDb, "DATABASE_URL is missing"],
    [badS3, "S3_ENDPOINT must be a URL starting with http:// or https://"],
  ] as const) {
    expect(result.code, result.stderr).toBe(78); // EX_CONFIG (sysexits.h)
    const lines = result.stderr.trim().split("\n");
    expect(lines, result.stderr).toHaveLength(1);
    expect(lines[0]).toContain(name);
    expect(lines[0]).not.toContain(process.env.NEXTAUTH_SECRET!);
  }
});
