// The response headers every page and API answer carries, built in one place (proxy.ts uses it).
// Pure: the policy depends only on the app's own address, the store's address and a nonce.

/** Largest request body each kind of write accepts; anything larger is a 413 before it is read. */
export const BODY_LIMITS = {
  /** CSV import: the 2 MB file plus room for a multipart envelope. */
  import: 2 * 1024 * 1024 + 64 * 1024,
  /** A photo or file declaration is a content type and a size. */
  declaration: 16 * 1024,
  /** Any other JSON body (the largest is a member type with a long supplier table). */
  json: 256 * 1024,
} as const;

export function bodyLimitFor(pathname: string): { bytes: number; what: string } {
  if (/^\/api\/v1\/sites\/[^/]+\/members\/import\/?$/.test(pathname)) return { bytes: BODY_LIMITS.import, what: "a CSV import" };
  if (/\/photos\/?$/.test(pathname) || /\/files\/?$/.test(pathname) || /\/plan\/?$/.test(pathname))
    return { bytes: BODY_LIMITS.declaration, what: "an upload declaration" };
  return { bytes: BODY_LIMITS.json, what: "a request" };
}

export function originOf(url: string | undefined | null): string | null {
  if (!url) return null;
  try {
    return new URL(url).origin;
  } catch {
    return null;
  }
}

export function contentSecurityPolicy(args: { nonce: string; storeOrigin: string | null; https: boolean; dev: boolean }): string {
  const store = args.storeOrigin ? ` ${args.storeOrigin}` : "";
  const directives = [
    "default-src 'self'",
    // 'strict-dynamic' lets the framework's nonce'd scripts load their own chunks and nothing else.
    `script-src 'self' 'nonce-${args.nonce}' 'strict-dynamic'${args.dev ? " 'unsafe-eval'" : ""}`,
    // Inline style attributes come from the charting library and React; no script runs from them.
    "style-src 'self' 'unsafe-inline'",
    `img-src 'self' data: blob:${store}`,
    "font-src 'self'",
    // Photos and files go straight from the browser to the store by presigned PUT.
    `connect-src 'self'${store}`,
    "media-src 'self' blob:",
    "worker-src 'self'",
    "manifest-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
    ...(args.https ? ["upgrade-insecure-requests"] : []),
  ];
  return directives.join("; ");
}

/** Headers for every answer; the CSP is added separately because pages and API differ. */
export function baseSecurityHeaders(args: { https: boolean }): Record<string, string> {
  return {
    "X-Frame-Options": "DENY",
    "X-Content-Type-Options": "nosniff",
    "Referrer-Policy": "strict-origin-when-cross-origin",
    // The camera is for site photos and label scanning, from our own pages only.
    "Permissions-Policy": "camera=(self), microphone=(), geolocation=(), payment=(), usb=(), interest-cohort=()",
    "Cross-Origin-Opener-Policy": "same-origin",
    ...(args.https ? { "Strict-Transport-Security": "max-age=63072000; includeSubDomains" } : {}),
  };
}

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * A state-changing API call that carries a cookie must come from our own pages: its Origin is the
 * app's address (APP_URL) or the address the request was sent to. Requests without a cookie (an
 * integration's token-less calls are refused later anyway) and without an Origin (non-browser
 * clients; browsers always send Origin on a cross-site write) pass here.
 */
export function originAllowed(args: { method: string; hasCookie: boolean; origin: string | null; appOrigin: string | null; requestOrigin: string | null }): boolean {
  if (SAFE_METHODS.has(args.method.toUpperCase()) || !args.hasCookie || !args.origin) return true;
  if (args.origin === "null") return false;
  return args.origin === args.appOrigin || args.origin === args.requestOrigin;
}

/** The session cookie: never readable by scripts, not sent on cross-site subrequests, https-only under https. */
export function sessionCookie(https: boolean) {
  return {
    name: `${https ? "__Secure-" : ""}next-auth.session-token`,
    options: { httpOnly: true, sameSite: "lax" as const, path: "/", secure: https },
  };
}
