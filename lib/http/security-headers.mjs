// Response headers every page and API answer carries (applied by next.config.mjs). Plain JS so the
// Next config can import it. The storage origin comes from S3_ENDPOINT at build time: photos are
// uploaded to it (presigned PUT) and shown from it (presigned GET).
// [OWASP Secure Headers Project; MDN "Content-Security-Policy", "Permissions-Policy"]

/** @param {{ storageOrigin?: string | null, dev?: boolean }} options */
export function contentSecurityPolicy({ storageOrigin = null, dev = false } = {}) {
  const storage = storageOrigin ? ` ${storageOrigin}` : "";
  return [
    "default-src 'self'",
    // Next's App Router streams its payload in inline scripts and the contrast script runs before
    // paint; the static offline shells are served from the service worker's cache, so a per-request
    // nonce cannot reach them. 'unsafe-eval' only for the dev server's refresh.
    `script-src 'self' 'unsafe-inline'${dev ? " 'unsafe-eval'" : ""}`,
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

/** @param {{ storageOrigin?: string | null, dev?: boolean }} options */
export function securityHeaders(options = {}) {
  const common = [
    { key: "X-Content-Type-Options", value: "nosniff" },
    { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
    // Photos are taken through the file input's capture, which needs no camera permission.
    { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=(), payment=(), usb=(), interest-cohort=()" },
  ];
  return [
    // Pages: the full policy. API answers keep their own (the digest preview sets a sandbox policy).
    { source: "/((?!api/).*)", headers: [...common, { key: "Content-Security-Policy", value: contentSecurityPolicy(options) }] },
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
