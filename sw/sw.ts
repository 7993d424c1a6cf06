/// <reference lib="webworker" />
// Placewright's service worker. Built by scripts/build-sw.mjs after `next build` into public/sw.js.
// Order matters: RSC payloads of static shells, then the precache, then network-only navigations.
import { cleanupOutdatedCaches, matchPrecache, precacheAndRoute } from "workbox-precaching";
import { NavigationRoute, registerRoute, setCatchHandler } from "workbox-routing";
import { NetworkOnly } from "workbox-strategies";
import { answerShellRsc, isShellRscRequest } from "./rsc";

declare const self: ServiceWorkerGlobalScope & { __WB_MANIFEST: Array<{ url: string; revision: string | null }> };

cleanupOutdatedCaches();

// 1. The router's RSC requests for static shells (soft navigations offline).
registerRoute(
  ({ request, url, sameOrigin }) => isShellRscRequest(request, url, sameOrigin),
  ({ request, url }) => answerShellRsc(request, url),
);

// 2. App code, fonts and prerendered shells; query strings are ignored so `?id=` gets the same shell.
precacheAndRoute(self.__WB_MANIFEST, {
  ignoreURLParametersMatching: [/.*/],
  cleanURLs: false,
  directoryIndex: null,
});

// 3. Other pages need the network; API calls are never cached (the outbox in IndexedDB owns offline writes).
registerRoute(new NavigationRoute(new NetworkOnly(), { denylist: [/^\/api\//] }));

// A page that cannot be reached offline gets the offline page, which says what still works.
setCatchHandler(async ({ request }) => {
  if (request.mode === "navigate") return (await matchPrecache("/offline")) ?? Response.error();
  return Response.error();
});

self.addEventListener("message", (event) => {
  if (event.data?.type === "SKIP_WAITING") void self.skipWaiting();
});
