import { securityHeaders } from "./lib/http/security-headers.mjs";

/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  // Server-only packages with native or dynamic requires stay outside the bundle.
  serverExternalPackages: ["@node-rs/argon2", "pg", "pg-boss", "nodemailer", "sharp"],
  async headers() {
    return [
      ...securityHeaders(),
      {
        source: "/sw.js",
        headers: [
          { key: "Cache-Control", value: "no-cache, no-store, must-revalidate" },
          { key: "Service-Worker-Allowed", value: "/" },
        ],
      },
    ];
  },
};

export default nextConfig;
