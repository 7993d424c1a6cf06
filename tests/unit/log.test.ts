// Log lines are JSON with the request id of the request they were written for, and never carry a
// password, a token or a cookie (lib/log.ts).
import { Writable } from "node:stream";
import { describe, expect, it } from "vitest";
import { createLogger, requestContext, routeConsoleToLogger } from "@/lib/log";

function capture() {
  const lines: Record<string, unknown>[] = [];
  const stream = new Writable({
    write(chunk, _enc, done) {
      for (const l of String(chunk).split("\n").filter(Boolean)) lines.push(JSON.parse(l));
      done();
    },
  });
  return { logger: createLogger(stream), lines };
}

describe("structured logs", () => {
  it("adds the request id of the surrounding request to every line", async () => {
    const { logger, lines } = capture();
    await requestContext().run({ requestId: "req-123" }, async () => {
      logger.info("first");
      await new Promise((r) => setTimeout(r, 5));
      logger.warn({ projectId: "p1" }, "after an await");
    });
    logger.info("outside");
    expect(lines.map((l) => [l.msg, l.requestId])).toEqual([
      ["first", "req-123"],
      ["after an await", "req-123"],
      ["outside", undefined],
    ]);
    expect(typeof lines[0].time).toBe("string");
  });

  it("redacts passwords, tokens, cookies and connection strings", () => {
    const { logger, lines } = capture();
    logger.info({ password: "hunter2", body: { password: "hunter3", token: "abc" }, req: { headers: { cookie: "next-auth.session-token=xyz" } }, pool: { connectionString: "postgres://u:pw@h/db" } }, "x");
    const text = JSON.stringify(lines[0]);
    for (const secret of ["hunter2", "hunter3", "abc", "xyz", "pw@h"]) expect(text).not.toContain(secret);
    expect(text).toContain("[redacted]");
  });

  it("routes console output through the logger, errors with their stack", () => {
    const { logger, lines } = capture();
    const saved = { error: console.error, warn: console.warn, info: console.info, log: console.log, debug: console.debug };
    try {
      routeConsoleToLogger(logger);
      requestContext().run({ requestId: "req-9" }, () => console.error("render failed:", new Error("boom")));
      console.warn("plain", { a: 1 });
    } finally {
      Object.assign(console, saved);
    }
    expect(lines[0]).toMatchObject({ level: 50, msg: "render failed:", requestId: "req-9", err: { message: "boom" } });
    expect(lines[1]).toMatchObject({ level: 40, msg: "plain { a: 1 }" });
  });
});
