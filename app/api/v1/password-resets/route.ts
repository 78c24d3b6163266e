import { NextResponse } from "next/server";
import { publicRoute } from "@/lib/api/route";
import { requestPasswordReset } from "@/lib/auth/passwords";
import { resetRequestSchema } from "@/lib/validations/onboarding";

/** { email } → 202, the same answer whether or not the address has an account. */
export const POST = publicRoute({ body: resetRequestSchema }, async ({ input }) =>
  NextResponse.json(await requestPasswordReset({ email: input.email }), { status: 202 }),
);
