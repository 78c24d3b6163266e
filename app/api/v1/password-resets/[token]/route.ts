import { publicRoute } from "@/lib/api/route";
import { resetPassword } from "@/lib/auth/passwords";
import { resetPasswordSchema } from "@/lib/validations/onboarding";

/** { password } → 200; the link works once, within 1 hour, and every session of the account ends. */
export const POST = publicRoute({ body: resetPasswordSchema }, async ({ params, input }) => {
  const { email } = await resetPassword({ token: params.token ?? "", password: input.password });
  return { ok: true, email };
});
