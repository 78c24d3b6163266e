// The service worker's caches, named once: the worker fills them, sign-out empties them from the page too.
export const PAGES_CACHE = "strutwise-pages";
export const DATA_CACHE = "strutwise-data";
/** sessionStorage keys saying when a site's round was last kept (offline-support.tsx). */
export const KEPT_KEY_PREFIX = "strutwise:kept:";
