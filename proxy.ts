// Runs before every page and API request: security headers in one place, a per-request CSP nonce,
// the Origin check for cookie-carrying writes, request body limits, and the requested address for
// deep links that survive sign-in. Never the authorisation
// boundary — that is lib/api/route.ts and lib/auth on the server.
import { NextResponse, type NextRequest } from "next/server";
import { REQUESTED_PATH_HEADER } from "@/lib/auth/callback";
import { baseSecurityHeaders, bodyLimitFor, contentSecurityPolicy, originAllowed, originOf } from "@/lib/security/headers";

const appUrl = process.env.APP_URL ?? process.env.NEXTAUTH_URL ?? "http://127.0.0.1:3000";
const appOrigin = originOf(appUrl);
const https = appUrl.startsWith("https:");
const storeOrigin = originOf(process.env.S3_PUBLIC_ENDPOINT ?? process.env.S3_ENDPOINT ?? "http://127.0.0.1:4569");
const dev = process.env.NODE_ENV === "development";

function jsonError(status: number, code: string, message: string) {
  return NextResponse.json({ error: { code, message } }, { status });
}

function withHeaders(res: NextResponse, extra: Record<string, string>) {
  for (const [k, v] of Object.entries({ ...baseSecurityHeaders({ https }), ...extra })) res.headers.set(k, v);
  return res;
}

export function proxy(req: NextRequest) {
  const { pathname } = req.nextUrl;
  const isApi = pathname.startsWith("/api/");
  if (isApi) {
    const apiHeaders = { "Cache-Control": "no-store", "Content-Security-Policy": "default-src 'none'; frame-ancestors 'none'" };
    const requestOrigin = `${req.nextUrl.protocol}//${req.headers.get("host") ?? req.nextUrl.host}`;
    if (!originAllowed({ method: req.method, hasCookie: req.cookies.size > 0, origin: req.headers.get("origin"), appOrigin, requestOrigin }))
      return withHeaders(jsonError(403, "cross_origin", "This request came from another site's page and was refused; nothing was changed."), apiHeaders);
    const declared = Number(req.headers.get("content-length") ?? 0);
    const limit = bodyLimitFor(pathname);
    if (Number.isFinite(declared) && declared > limit.bytes)
      return withHeaders(
        jsonError(413, "too_large", `The body of ${limit.what} may be at most ${Math.round(limit.bytes / 1024)} KB; this one is ${Math.ceil(declared / 1024)} KB. Nothing was stored.`),
        apiHeaders,
      );
    return withHeaders(NextResponse.next(), apiHeaders);
  }
  const nonce = Buffer.from(crypto.randomUUID()).toString("base64");
  const csp = contentSecurityPolicy({ nonce, storeOrigin, https, dev });
  // Next reads the nonce from the request's CSP header and puts it on its own scripts.
  const requestHeaders = new Headers(req.headers);
  requestHeaders.set("x-nonce", nonce);
  requestHeaders.set("Content-Security-Policy", csp);
  // The address a page asked for, so a signed-out person who opens a QR label's or an e-mail's
  // link comes back to exactly that page after signing in (lib/auth: requireUser).
  requestHeaders.set(REQUESTED_PATH_HEADER, `${pathname}${req.nextUrl.search}`);
  const res = NextResponse.next({ request: { headers: requestHeaders } });
  return withHeaders(res, { "Content-Security-Policy": csp });
}

export const config = {
  // Everything but the framework's hashed static files (they carry no HTML and are cached forever).
  matcher: [{ source: "/((?!_next/static|_next/image|favicon.ico).*)" }],
};
