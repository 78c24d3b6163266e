// Where to go after signing in: only a path on this site. Pure, so the sign-in page, the proxy
// and unit tests share it.

/** Set by proxy.ts on page requests: the path and query string the browser asked for. */
export const REQUESTED_PATH_HEADER = "x-strutwise-requested-path";

/**
 * A same-origin path ("/sites/…?tag=…") or null. Refuses other hosts ("https://other",
 * "//evil", "/\\evil" which browsers read as "//evil"), schemes ("javascript:…"), control
 * characters, and the sign-in page itself (no loop).
 */
export function safeCallbackPath(value: string | null | undefined): string | null {
  if (typeof value !== "string" || value.length === 0 || value.length > 2000) return null;
  if (!value.startsWith("/") || value.startsWith("//") || value.startsWith("/\\")) return null;
  if (/[\u0000-\u001f\u007f\\]/.test(value)) return null;
  let url: URL;
  try {
    url = new URL(value, "http://strutwise.invalid");
  } catch {
    return null;
  }
  if (url.origin !== "http://strutwise.invalid") return null;
  if (url.pathname === "/sign-in" || url.pathname.startsWith("/api/")) return null;
  return `${url.pathname}${url.search}${url.hash}`;
}
