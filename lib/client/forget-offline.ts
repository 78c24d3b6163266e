// Sign-out on a shared phone: the pages and API reads kept for offline use go, so the next person
// sees none of them. The worker is asked to forget ("forget" message) and the page empties the same
// caches itself, so nothing is left even when no worker is running. The outbox is not touched:
// entries are kept per person and are sent only when their author signs in again.
import { DATA_CACHE, KEPT_KEY_PREFIX, PAGES_CACHE } from "@/lib/client/sw/cache-names";

export async function forgetOfflineCopies(): Promise<void> {
  try {
    const reg = "serviceWorker" in navigator ? await navigator.serviceWorker.getRegistration() : undefined;
    (navigator.serviceWorker?.controller ?? reg?.active)?.postMessage({ type: "forget" });
  } catch {
    /* no worker: the caches below are all there is */
  }
  if (typeof caches !== "undefined") await Promise.all([caches.delete(PAGES_CACHE), caches.delete(DATA_CACHE)]).catch(() => undefined);
  for (const key of Object.keys(sessionStorage)) if (key.startsWith(KEPT_KEY_PREFIX)) sessionStorage.removeItem(key);
}
