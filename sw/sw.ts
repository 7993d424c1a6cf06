/// <reference lib="webworker" />
// Placewright's service worker. Built by scripts/build-sw.mjs after `next build` into public/sw.js.
import { cleanupOutdatedCaches, matchPrecache, precacheAndRoute } from "workbox-precaching";
import { NavigationRoute, registerRoute, setCatchHandler } from "workbox-routing";
import { NetworkOnly } from "workbox-strategies";

declare const self: ServiceWorkerGlobalScope & { __WB_MANIFEST: Array<{ url: string; revision: string | null }> };

cleanupOutdatedCaches();

// App code, fonts and prerendered pages; query strings are ignored so `?id=` gets the same shell.
precacheAndRoute(self.__WB_MANIFEST, {
  ignoreURLParametersMatching: [/.*/],
  cleanURLs: false,
  directoryIndex: null,
});

// Other pages need the network; API calls are never cached (the sync outbox owns offline writes).
registerRoute(new NavigationRoute(new NetworkOnly(), { denylist: [/^\/api\//] }));

// A page that cannot be reached offline gets the offline page, which says what still works.
setCatchHandler(async ({ request }) => {
  if (request.mode === "navigate") return (await matchPrecache("/offline")) ?? Response.error();
  return Response.error();
});

self.addEventListener("message", (event) => {
  if (event.data?.type === "SKIP_WAITING") void self.skipWaiting();
});
