// The service worker (/sw.js): the app shell precached from the build, pages a site engineer opens
// kept for a round with no signal (network first, the last copy when offline), and the site data
// the phone reads (member types, zones, schemes) kept the same way. Writes are never cached: the
// outbox on the phone (lib/client/outbox) keeps them until the server has them.
// Bundled by scripts/build-sw.mjs (esbuild, then @serwist/build injects the precache list).
/// <reference lib="webworker" />
import { CacheableResponsePlugin, ExpirationPlugin, NetworkFirst, Serwist, type PrecacheEntry } from "serwist";
import { DATA_CACHE, PAGES_CACHE } from "./cache-names";

declare const self: ServiceWorkerGlobalScope & { __SW_MANIFEST: (PrecacheEntry | string)[] | undefined };

const okOnly = () => new CacheableResponsePlugin({ statuses: [200] });

/** Pages that must not be kept: signing in and out, first run, links from e-mails. */
const NOT_KEPT = /^\/(sign-in|sign-out|setup|invite|reset-password|forgot-password)(\/|$)/;

const pages = new NetworkFirst({
  cacheName: PAGES_CACHE,
  networkTimeoutSeconds: 10,
  plugins: [okOnly(), new ExpirationPlugin({ maxEntries: 400, maxAgeSeconds: 14 * 24 * 3600 })],
});

const serwist = new Serwist({
  precacheEntries: self.__SW_MANIFEST,
  skipWaiting: true,
  clientsClaim: true,
  runtimeCaching: [
    {
      matcher: ({ request, url, sameOrigin }) => sameOrigin && request.mode === "navigate" && !url.pathname.startsWith("/api/") && !NOT_KEPT.test(url.pathname),
      handler: pages,
    },
    {
      // The app's own icons and manifest (public/), so the header looks the same offline.
      matcher: ({ url, sameOrigin }) => sameOrigin && (/^\/icons?[./]/.test(url.pathname) || url.pathname === "/manifest.webmanifest"),
      handler: new NetworkFirst({ cacheName: "strutwise-shell", networkTimeoutSeconds: 5, plugins: [okOnly()] }),
    },
    {
      // Reads only; never the sign-in endpoints or files.
      matcher: ({ request, url, sameOrigin }) => sameOrigin && request.method === "GET" && url.pathname.startsWith("/api/v1/") && url.pathname !== "/api/v1/ping" && !url.pathname.endsWith(".csv"),
      handler: new NetworkFirst({ cacheName: DATA_CACHE, networkTimeoutSeconds: 10, plugins: [okOnly(), new ExpirationPlugin({ maxEntries: 300 })] }),
    },
  ],
});

/**
 * The app asks for the pages of a round to be kept while it has signal (the site overview, Log
 * member, the inspection round and the checklists it lists, the library, zones and schemes), and
 * the API reads of every site the person belongs to (library, zones, schemes): those go with the
 * other API reads, so a request for them with no signal is answered from here.
 * "forget" empties the kept pages and data (sign-out), so the next person on the phone sees none of it.
 */
self.addEventListener("message", (event: ExtendableMessageEvent) => {
  const data = event.data as { type?: string; urls?: unknown } | null;
  if (data?.type === "keep" && Array.isArray(data.urls)) {
    const urls = data.urls.filter((u): u is string => typeof u === "string" && u.startsWith("/") && !NOT_KEPT.test(u) && !/^\/api\/v1\/ping/.test(u) && !u.endsWith(".csv")).slice(0, 120);
    event.waitUntil(
      (async () => {
        const [pagesCache, dataCache] = await Promise.all([caches.open(PAGES_CACHE), caches.open(DATA_CACHE)]);
        for (const url of urls) {
          try {
            const res = await fetch(url, { credentials: "same-origin", redirect: "manual" });
            if (res.status === 200) await (url.startsWith("/api/") ? dataCache : pagesCache).put(url, res);
          } catch {
            return; // signal lost: keep what was kept so far
          }
        }
        event.source?.postMessage({ type: "kept", count: urls.length });
      })(),
    );
  }
  if (data?.type === "forget") {
    event.waitUntil(Promise.all([caches.delete(PAGES_CACHE), caches.delete(DATA_CACHE)]).then(() => undefined));
  }
});

serwist.addEventListeners();
