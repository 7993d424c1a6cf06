// Sets each page's Content-Security-Policy (lib/http/security-headers.mjs). A page rendered per
// request gets a fresh nonce, passed to Next on the request so it stamps its own scripts; a
// prerendered page (an offline shell, also served by the service worker from its precache with
// this same header) gets the hashes of its inline scripts, recorded at build time.
// [Next.js docs "Content Security Policy": nonces through the proxy, dynamic rendering]
import { readFileSync } from "node:fs";
import path from "node:path";
import { NextResponse, type NextRequest } from "next/server";
import { config as appConfig } from "@/lib/config";
import { STATIC_SCRIPT_HASHES_FILE, contentSecurityPolicy, storageOrigin } from "@/lib/http/security-headers.mjs";

let staticPages: Record<string, string[]> | undefined;

function staticScriptHashes(route: string): string[] | undefined {
  if (!staticPages) {
    try {
      staticPages = JSON.parse(readFileSync(path.join(process.cwd(), ".next", STATIC_SCRIPT_HASHES_FILE), "utf8")) as Record<string, string[]>;
    } catch {
      staticPages = {}; // the dev server prerenders nothing: every page takes a nonce
    }
  }
  return staticPages[route];
}

export function proxy(req: NextRequest) {
  const route = req.nextUrl.pathname.replace(/\/+$/, "") || "/";
  const options = { storageOrigin: storageOrigin(appConfig().s3.endpoint), dev: process.env.NODE_ENV !== "production" };
  const scriptHashes = staticScriptHashes(route);
  if (scriptHashes) {
    const res = NextResponse.next();
    res.headers.set("Content-Security-Policy", contentSecurityPolicy({ ...options, scriptHashes }));
    return res;
  }
  const nonce = Buffer.from(crypto.getRandomValues(new Uint8Array(18))).toString("base64");
  const policy = contentSecurityPolicy({ ...options, nonce });
  const headers = new Headers(req.headers);
  headers.set("Content-Security-Policy", policy);
  const res = NextResponse.next({ request: { headers } });
  res.headers.set("Content-Security-Policy", policy);
  return res;
}

export const config = {
  // Pages only: API answers, built assets, the service worker and the shells' RSC copies need no page policy.
  matcher: ["/((?!api/|_next/static|_next/image|__offline/|sw\\.js|icons/|favicon|manifest).*)"],
};
