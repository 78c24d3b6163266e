// Route-handler plumbing: one error shape ({ error: { code, message, fields? } }) and status.
import "server-only";
import { NextResponse } from "next/server";
import { AppError, errorBody, NETWORK_ERROR_CODES } from "@/lib/errors";

type Ctx<P> = { params: Promise<P> };

export function apiHandler<P = Record<string, string>>(
  fn: (req: Request, ctx: { params: P }) => Promise<Response | unknown>,
) {
  return async (req: Request, ctx: Ctx<P>): Promise<Response> => {
    try {
      const params = ctx?.params ? await ctx.params : ({} as P);
      const out = await fn(req, { params });
      return out instanceof Response ? out : NextResponse.json(out);
    } catch (e) {
      if (e instanceof AppError) return NextResponse.json(errorBody(e), { status: e.status });
      if (isDatabaseUnavailable(e)) {
        console.error("[api] database unavailable", req.method, new URL(req.url).pathname, describe(e));
        return NextResponse.json(
          { error: { code: "unavailable", message: "The register's database cannot be reached just now; nothing was changed. Try again in a minute." } },
          { status: 503, headers: { "Retry-After": "10" } },
        );
      }
      console.error("[api] unexpected error", req.method, new URL(req.url).pathname, e);
      return NextResponse.json(
        { error: { code: "internal", message: "Something went wrong on our side; nothing was changed. Try again." } },
        { status: 500 },
      );
    }
  };
}

const UNAVAILABLE_CODES = new Set([
  ...NETWORK_ERROR_CODES,
  "CONNECTION_CLOSED", "CONNECTION_ENDED", "CONNECTION_DESTROYED", "CONNECT_TIMEOUT",
  // PostgreSQL: admin shutdown, crash shutdown, cannot connect now, too many connections.
  "57P01", "57P02", "57P03", "53300",
]);

/** True when the error (or anything in its cause chain) says the database is down or restarting. */
export function isDatabaseUnavailable(e: unknown): boolean {
  for (let cur = e, depth = 0; cur && typeof cur === "object" && depth < 5; cur = (cur as { cause?: unknown }).cause, depth++) {
    const code = (cur as { code?: unknown }).code;
    if (typeof code === "string" && UNAVAILABLE_CODES.has(code)) return true;
    const errors = (cur as { errors?: unknown }).errors; // AggregateError from a refused dual-stack connect
    if (Array.isArray(errors) && errors.some((x) => isDatabaseUnavailable(x))) return true;
  }
  return false;
}

function describe(e: unknown) {
  return e instanceof Error ? `${e.name}: ${e.message}` : String(e);
}

export function created(body: unknown) {
  return NextResponse.json(body, { status: 201 });
}
