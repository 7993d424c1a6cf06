// Response headers every page and API answer carries. Plain JS so the Next config and the proxy
// (proxy.ts, which sets each page's Content-Security-Policy) can import it. Photos are uploaded to
// the storage origin (presigned PUT) and shown from it (presigned GET).
// [OWASP Secure Headers Project; MDN "Content-Security-Policy", "Permissions-Policy"; CSP Level 3
//  "nonce-source", "hash-source", 'strict-dynamic']
import { createHash } from "node:crypto";

/** Applies the saved daylight (high-contrast) mode before first paint, so the page never flashes. */
export const CONTRAST_SCRIPT = `try{if(localStorage.getItem("pw-contrast")==="daylight")document.documentElement.dataset.contrast="daylight"}catch(e){}`;

/** The CSP hash-source of an inline script's exact text. */
export const scriptHash = (text) => `'sha256-${createHash("sha256").update(text, "utf8").digest("base64")}'`;

/**
 * A page's policy. Pages rendered per request get a fresh nonce (Next puts it on its own scripts)
 * with 'strict-dynamic'; prerendered pages (the offline shells the service worker keeps) cannot
 * carry a nonce, so they list the hashes of their inline scripts, taken from the built HTML.
 * No 'unsafe-inline' for scripts either way; 'unsafe-eval' only for the dev server's refresh.
 * @param {{ storageOrigin?: string | null, dev?: boolean, nonce?: string, scriptHashes?: string[] }} options
 */
export function contentSecurityPolicy({ storageOrigin = null, dev = false, nonce, scriptHashes = [] } = {}) {
  const storage = storageOrigin ? ` ${storageOrigin}` : "";
  const hashes = [...new Set([scriptHash(CONTRAST_SCRIPT), ...scriptHashes])].join(" ");
  const scripts = nonce ? `'self' 'nonce-${nonce}' 'strict-dynamic' ${hashes}` : `'self' ${hashes}`;
  return [
    "default-src 'self'",
    `script-src ${scripts}${dev ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    `img-src 'self' data: blob:${storage}`,
    "font-src 'self'",
    `connect-src 'self'${storage}`,
    "worker-src 'self' blob:",
    "manifest-src 'self'",
    "frame-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");
}

/** The hash-sources of every inline <script> of a built HTML page. */
export function inlineScriptHashes(html) {
  const out = [];
  for (const m of html.matchAll(/<script(?![^>]*\ssrc=)[^>]*>([\s\S]*?)<\/script>/g)) if (m[1]) out.push(scriptHash(m[1]));
  return [...new Set(out)];
}

/** Headers of every answer; the pages' Content-Security-Policy is set by proxy.ts. */
export function securityHeaders() {
  const common = [
    { key: "X-Content-Type-Options", value: "nosniff" },
    { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
    // Photos are taken through the file input's capture, which needs no camera permission.
    { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=(), payment=(), usb=(), interest-cohort=()" },
  ];
  return [
    // Pages: proxy.ts adds the policy. API answers keep their own (the digest preview sets a sandbox policy).
    { source: "/((?!api/).*)", headers: common },
    { source: "/api/:path*", headers: [...common, { key: "Content-Security-Policy", value: "frame-ancestors 'self'" }] },
    {
      // HSTS only when the request reached the proxy over HTTPS (a plain-HTTP local run must not pin it).
      source: "/:path*",
      has: [{ type: "header", key: "x-forwarded-proto", value: "https" }],
      headers: [{ key: "Strict-Transport-Security", value: "max-age=31536000; includeSubDomains" }],
    },
  ];
}

/** The origin of the photo store, or null when it is not configured. */
export function storageOrigin(endpoint = process.env.S3_ENDPOINT) {
  if (!endpoint) return null;
  try {
    return new URL(endpoint).origin;
  } catch {
    return null;
  }
}

/** Written into .next/ by scripts/build-sw.mjs: { route: [hash-source, …] } of the prerendered pages. */
export const STATIC_SCRIPT_HASHES_FILE = "csp-static-scripts.json";
