import { NextResponse } from "next/server";
import { apiHandler, readJson } from "@/lib/api";
import { requireApiUser } from "@/lib/auth";
import { calculate } from "@/lib/engineering";

/**
 * Runs one engine calculation (lengths mm, forces N, stresses MPa). 200 with the result and its
 * working; 422 with `error.fields` (request path → sentence) and the engine's `errors` list.
 */
export const POST = apiHandler(async (req) => {
  await requireApiUser();
  const body = await readJson(req);
  const result = calculate(body);
  if (result.ok) return result;
  const fields = Object.fromEntries(result.errors.map((e) => [e.field || "_", e.message]));
  return NextResponse.json(
    {
      error: { code: "invalid", message: result.errors[0]?.message ?? "The calculation request is not valid.", fields },
      errors: result.errors,
    },
    { status: 422 },
  );
});
