import { userRoute } from "@/lib/api/route";
import { changeOwnPassword } from "@/lib/auth/passwords";
import { changePasswordSchema } from "@/lib/validations/onboarding";

/** { currentPassword, newPassword } → 200. Wrong current passwords are throttled like sign-in. */
export const POST = userRoute({ body: changePasswordSchema }, async ({ user, input }) =>
  changeOwnPassword({ user, currentPassword: input.currentPassword, newPassword: input.newPassword }),
);
