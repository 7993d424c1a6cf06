// The configuration is checked once at boot (lib/config.ts): every missing or malformed variable
// is named on one line, values (some are secrets) are never echoed, defaults fill the rest.
import { describe, expect, it } from "vitest";
import { ConfigError, parseConfig } from "@/lib/config";

const GOOD = {
  DATABASE_URL: "postgres://placewright@db.internal:5432/placewright",
  NEXTAUTH_SECRET: "a-long-random-secret-value-0123456789",
};

function problems(env: Record<string, string | undefined>): string {
  try {
    parseConfig(env);
  } catch (error) {
    expect(error).toBeInstanceOf(ConfigError);
    return (error as ConfigError).message;
  }
  throw new Error("expected a configuration error");
}

describe("configuration", () => {
  it("accepts the minimum and fills the documented defaults", () => {
    const c = parseConfig(GOOD);
    expect(c.database).toEqual({ url: GOOD.DATABASE_URL, poolMax: 10, readPoolMax: 4, statementTimeoutMs: 30_000 });
    expect(c.digest).toEqual({ worker: true, pollSeconds: 10 });
    expect(c.s3.endpoint).toBeUndefined(); // AWS S3 itself
    expect(c.origin).toBe("http://localhost:3000");
  });

  it("names a missing DATABASE_URL on one line", () => {
    const message = problems({ NEXTAUTH_SECRET: GOOD.NEXTAUTH_SECRET });
    expect(message).toContain("DATABASE_URL is missing");
    expect(message.split("\n")).toHaveLength(1);
  });

  it("treats an empty variable as missing", () => {
    expect(problems({ ...GOOD, DATABASE_URL: "" })).toContain("DATABASE_URL is missing");
  });

  // URL syntax per the WHATWG URL Standard (Node's URL parser); "host:port bucket" is not a URL.
  it("names a malformed S3 endpoint without echoing its value", () => {
    const message = problems({ ...GOOD, S3_ENDPOINT: "minio.internal:9000 photos" });
    expect(message).toContain("S3_ENDPOINT must be a URL starting with http:// or https://");
    expect(message).not.toContain("minio.internal");
  });

  it("names every problem at once and never prints a secret", () => {
    const message = problems({ DATABASE_URL: "mysql://root:hunter2-secret@db/app", NEXTAUTH_SECRET: "short", DATABASE_POOL_MAX: "ten", SMTP_URL: "mail.internal" });
    expect(message).toContain("DATABASE_URL must be a URL starting with postgres:// or postgresql://");
    expect(message).toContain("NEXTAUTH_SECRET must be at least 16 characters");
    expect(message).toContain("DATABASE_POOL_MAX must be a whole number");
    expect(message).toContain("SMTP_URL must be a URL starting with smtp:// or smtps://");
    expect(message).not.toContain("hunter2");
    expect(message.split("\n")).toHaveLength(1);
  });

  it("reads pool size and statement timeout, with bounds", () => {
    const c = parseConfig({ ...GOOD, DATABASE_POOL_MAX: "25", DATABASE_STATEMENT_TIMEOUT_MS: "0" });
    expect(c.database.poolMax).toBe(25);
    expect(c.database.statementTimeoutMs).toBe(0); // 0: no limit (PostgreSQL's statement_timeout semantics)
    expect(problems({ ...GOOD, DATABASE_POOL_MAX: "0" })).toContain("DATABASE_POOL_MAX must be at least 1");
    expect(parseConfig({ ...GOOD, DATABASE_READ_POOL_MAX: "6" }).database.readPoolMax).toBe(6);
    expect(problems({ ...GOOD, DATABASE_READ_POOL_MAX: "0" })).toContain("DATABASE_READ_POOL_MAX must be at least 1");
  });

  it("reads switches as true/false and on/off only", () => {
    expect(problems({ ...GOOD, S3_FORCE_PATH_STYLE: "yes" })).toContain("S3_FORCE_PATH_STYLE must be true or false");
    expect(problems({ ...GOOD, DIGEST_WORKER: "disabled" })).toContain("DIGEST_WORKER must be on or off");
    expect(parseConfig({ ...GOOD, DIGEST_WORKER: "off", S3_FORCE_PATH_STYLE: "true" })).toMatchObject({ digest: { worker: false }, s3: { forcePathStyle: true } });
  });
});
