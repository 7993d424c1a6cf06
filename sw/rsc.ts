/// <reference lib="webworker" />
// Answers the App Router's RSC requests for static shells from the precache, so <Link> navigation
// between field screens stays a soft navigation offline. Depends on Next internals (the `rsc` and
// `next-router-segment-prefetch` headers, the .rsc/.segments build layout): tests/e2e covers it;
// re-run that test on every Next upgrade.
import { matchPrecache } from "workbox-precaching";

declare const OFFLINE_SHELLS: string[];

const shells = new Set(OFFLINE_SHELLS);

export function normalizePath(pathname: string): string {
  const trimmed = pathname.replace(/\/+$/, "");
  return trimmed === "" ? "/" : trimmed;
}

export function isShellRscRequest(request: Request, url: URL, sameOrigin: boolean): boolean {
  return (
    sameOrigin &&
    request.method === "GET" &&
    request.headers.get("rsc") === "1" &&
    shells.has(normalizePath(url.pathname))
  );
}

function withRscHeaders(body: Response, segment: boolean): Response {
  const headers = new Headers({
    "content-type": "text/x-component",
    "x-nextjs-prerender": "1",
    vary: "rsc, next-router-state-tree, next-router-prefetch, next-router-segment-prefetch",
  });
  // The router refuses segment responses without this marker.
  if (segment) headers.set("x-nextjs-postponed", "2");
  return new Response(body.body, { status: 200, headers });
}

export async function answerShellRsc(request: Request, url: URL): Promise<Response> {
  const route = normalizePath(url.pathname);
  const base = route === "/" ? "/__offline/index" : `/__offline${route}`;
  const segment = request.headers.get("next-router-segment-prefetch");
  if (segment) {
    const cached = await matchPrecache(`${base}.segments${segment}.segment.rsc`);
    return cached ? withRscHeaders(cached, true) : new Response(null, { status: 404 });
  }
  const cached = await matchPrecache(`${base}.rsc`);
  // No payload: the router falls back to a hard navigation, which the precache serves.
  return cached ? withRscHeaders(cached, false) : Response.error();
}
