// Passes the address a page request asked for (path and query string) on to the server
// components, so that a signed-out person who opens a QR label's link or an e-mail link comes
// back to exactly that page after signing in. Comfort only: every page and route still checks
// the session itself.
import { NextResponse, type NextRequest } from "next/server";
import { REQUESTED_PATH_HEADER } from "@/lib/auth/callback";

export function proxy(request: NextRequest) {
  const headers = new Headers(request.headers);
  headers.set(REQUESTED_PATH_HEADER, `${request.nextUrl.pathname}${request.nextUrl.search}`);
  return NextResponse.next({ request: { headers } });
}

export const config = {
  matcher: ["/((?!api/|_next/|icon\\.svg|favicon\\.ico|manifest|.*\\.(?:png|svg|jpg|webp|woff2?)$).*)"],
};
