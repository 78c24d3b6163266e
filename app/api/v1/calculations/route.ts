import { NextResponse } from "next/server";
import { userRoute } from "@/lib/api/route";
import { calculate } from "@/lib/engineering";

/**
 * Runs one engine calculation (lengths mm, forces N, stresses MPa). 200 with the result and its
 * working; 422 with `error.fields` (request path → sentence) and the engine's `errors` list.
 * The calculator has no site, so `calculate` must be allowed by the person's role on at least one
 * of their sites (userRoute's rule); the engine itself validates the request.
 */
export const POST = userRoute(
  {
    permission: "calculate",
    forbidden: "Your roles do not allow running calculations; ask your organisation admin for a role on a site.",
    body: (raw: unknown) => raw as Record<string, unknown>,
  },
  async ({ input }) => {
    const result = calculate(input);
    if (result.ok) return result;
    const fields = Object.fromEntries(result.errors.map((e) => [e.field || "_", e.message]));
    return NextResponse.json(
      {
        error: { code: "invalid", message: result.errors[0]?.message ?? "The calculation request is not valid.", fields },
        errors: result.errors,
      },
      { status: 422 },
    );
  },
);
