import { userRoute } from "@/lib/api/route";
import { setPersonActive } from "@/lib/auth/people";

/** Organisation admins: the person can no longer sign in, and every session of theirs ends now. */
export const POST = userRoute({ permission: "managePeople" }, async ({ user, params }) => ({
  person: await setPersonActive({ user, userId: params.userId ?? "", active: false }),
}));
