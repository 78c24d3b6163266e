// What the offline journeys share: going offline for the page and its service worker, waiting for
// the worker to keep a page, and counting members through the API.
//
// Playwright's setOffline does not reach a service worker's own requests (microsoft/playwright
// issue 2311), so while "offline" the worker's requests are aborted too (route + service worker
// network events), and the pages shown really come from its cache.
import { expect, type BrowserContext, type Page, type Route } from "@playwright/test";

// Read when the browser starts, after the spec file importing this is loaded.
process.env.PW_EXPERIMENTAL_SERVICE_WORKER_NETWORK_EVENTS = "1";

const swOffline = (route: Route) => (route.request().serviceWorker() ? route.abort("internetdisconnected") : route.continue());
export async function goOffline(context: BrowserContext) {
  await context.setOffline(true);
  await context.route("**", swOffline);
}
export async function goOnline(context: BrowserContext) {
  await context.unroute("**", swOffline);
  await context.setOffline(false);
}

/** The service worker controls the page (it registers on the first page with signal). */
export async function workerControls(page: Page) {
  await expect
    .poll(() => page.evaluate(() => navigator.serviceWorker?.controller != null), { timeout: 30_000, message: "the service worker controls the page" })
    .toBe(true);
}

/** Whether the phone holds a copy of this address (a page or an API read) for offline use. */
export function kept(page: Page, url: string) {
  return page.evaluate(async (u) => (await caches.match(u)) != null, url);
}

/** The worker keeps a round's pages some seconds after a page settles, one page at a time (slow on a busy machine). */
export async function waitUntilKept(page: Page, url: string, what: string) {
  await expect.poll(() => kept(page, url), { timeout: 60_000, message: `${what} is kept for offline use` }).toBe(true);
}

export function siteIdOf(page: Page) {
  return new URL(page.url()).pathname.split("/")[2]!;
}

/** Members with exactly this tag on the site's register, as the API lists them. */
export async function membersTagged(page: Page, siteId: string, tag: string) {
  const r = await page.request.get(`/api/v1/sites/${siteId}/members?q=${encodeURIComponent(tag)}`);
  expect(r.status()).toBe(200);
  return ((await r.json()) as { items: { id: string; tag: string; photoCount?: number }[] }).items.filter((m) => m.tag === tag);
}
