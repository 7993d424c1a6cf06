// The page policy's pieces: hash-sources of inline scripts as the CSP specification computes them,
// and no 'unsafe-inline' for scripts in either form of the policy.
import { describe, expect, it } from "vitest";
import { CONTRAST_SCRIPT, contentSecurityPolicy, inlineScriptHashes, scriptHash } from "@/lib/http/security-headers.mjs";

const scriptSrc = (policy: string) => policy.split("; ").find((d) => d.startsWith("script-src "))!;

describe("content security policy", () => {
  it("hashes an inline script like the CSP Level 2/3 specification's example", () => {
    // W3C CSP Level 3, "hash-source" example: alert('Hello, world.'); [memory]
    expect(scriptHash("alert('Hello, world.');")).toBe("'sha256-qznLcsROx4GACP2dm0UCKCzCG+HiZ1guq6ZZDob/Tng='");
  });

  it("takes every inline script of a built page, and no external one", () => {
    const html = `<html><head><script>alert('Hello, world.');</script><script src="/_next/static/a.js"></script></head>
      <body><script id="x">self.__next_f.push([1])</script><script async="" src="/b.js"></script></body></html>`;
    expect(inlineScriptHashes(html)).toEqual([scriptHash("alert('Hello, world.');"), scriptHash("self.__next_f.push([1])")]);
  });

  it("a per-request page gets its nonce with 'strict-dynamic'; a prerendered one its hashes; neither allows inline or eval", () => {
    const dynamic = scriptSrc(contentSecurityPolicy({ nonce: "abc123" }));
    expect(dynamic).toBe(`script-src 'self' 'nonce-abc123' 'strict-dynamic' ${scriptHash(CONTRAST_SCRIPT)}`);
    const prerendered = scriptSrc(contentSecurityPolicy({ scriptHashes: ["'sha256-AAAA'"] }));
    expect(prerendered).toBe(`script-src 'self' ${scriptHash(CONTRAST_SCRIPT)} 'sha256-AAAA'`);
    for (const p of [dynamic, prerendered]) expect(p).not.toMatch(/unsafe-(inline|eval)/);
    expect(scriptSrc(contentSecurityPolicy({ nonce: "n", dev: true }))).toContain("'unsafe-eval'");
  });
});
