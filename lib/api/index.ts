// Route-handler plumbing: one error shape ({ error: { code, message, fields? } }) and status.
import "server-only";
import { NextResponse } from "next/server";
import { AppError, errorBody, ValidationError } from "@/lib/errors";

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
      console.error("[api] unexpected error", req.method, new URL(req.url).pathname, e);
      return NextResponse.json(
        { error: { code: "internal", message: "Something went wrong on our side; nothing was changed. Try again." } },
        { status: 500 },
      );
    }
  };
}

/** Reads a JSON body; anything that is not a JSON object is a 422 with a clear reason. */
export async function readJson(req: Request): Promise<Record<string, unknown>> {
  let body: unknown;
  try {
    body = await req.json();
  } catch {
    throw new ValidationError({ _: "The request body must be JSON." }, "The request body must be JSON.");
  }
  if (!body || typeof body !== "object" || Array.isArray(body))
    throw new ValidationError({ _: "The request body must be a JSON object." }, "The request body must be a JSON object.");
  return body as Record<string, unknown>;
}

export function created(body: unknown) {
  return NextResponse.json(body, { status: 201 });
}
