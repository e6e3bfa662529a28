/// <reference lib="webworker" />
// The Tenthwise service worker (built by `serwist build`, configurator mode; see serwist.config.js).
// The bench is a client shell: its pages are precached HTML (serwist.config.js lists them), with
// every script and style they need, so after one visit the bench opens with no network, cold or after a restart.
// Data never lives here: readings are in IndexedDB (lib/offline) and /api/* is never cached, so
// a stale answer can never pass for the server's.
import type { PrecacheEntry, SerwistGlobalConfig } from "serwist";
import { CacheFirst, ExpirationPlugin, NetworkOnly, Serwist, StaleWhileRevalidate } from "serwist";

declare global {
  interface WorkerGlobalScope extends SerwistGlobalConfig {
    __SW_MANIFEST: (PrecacheEntry | string)[] | undefined;
  }
}

declare const self: ServiceWorkerGlobalScope;

const serwist = new Serwist({
  precacheEntries: self.__SW_MANIFEST,
  precacheOptions: {
    // /bench/job?id=12 is the one precached /bench/job shell; other query strings (Next's _rsc)
    // must still reach the network, so only our own parameter is ignored.
    ignoreURLParametersMatching: [/^id$/, /^utm_/],
    cleanupOutdatedCaches: true,
  },
  // A new version waits until the machinist applies it (components/bench/update-banner.tsx),
  // which is only offered once the outbox is empty; the first install takes control at once.
  skipWaiting: false,
  clientsClaim: true,
  navigationPreload: false,
  disableDevLogs: true,
  runtimeCaching: [
    { matcher: ({ sameOrigin, url }) => sameOrigin && url.pathname.startsWith("/api/"), handler: new NetworkOnly() },
    {
      matcher: ({ sameOrigin, url }) => sameOrigin && url.pathname.startsWith("/_next/static/"),
      handler: new CacheFirst({
        cacheName: "tw-static",
        plugins: [new ExpirationPlugin({ maxEntries: 200, maxAgeSeconds: 30 * 24 * 3600 })],
      }),
    },
    {
      matcher: ({ sameOrigin, url }) => sameOrigin && /\.(?:png|svg|ico|webp|woff2)$/i.test(url.pathname),
      handler: new StaleWhileRevalidate({
        cacheName: "tw-assets",
        plugins: [new ExpirationPlugin({ maxEntries: 64 })],
      }),
    },
    { matcher: ({ request }) => request.mode === "navigate", handler: new NetworkOnly() },
  ],
  // Offline, a page that is not precached (an office screen, the root redirect, sign-in) opens
  // the bench instead of a browser error, so the machinist is never bounced to a dead end.
  fallbacks: { entries: [{ url: "/bench", matcher: ({ request }) => request.mode === "navigate" }] },
});

// A page that loaded while this worker was still installing (the bench right after sign-in) is
// not controlled, so its lazily loaded code would not come from the cache offline. The bench asks
// to be claimed once the worker is active (components/bench/bench-shell.tsx).
self.addEventListener("message", (event) => {
  if (event.data?.type === "TW_CLAIM") event.waitUntil(self.clients.claim());
});

serwist.addEventListeners();
