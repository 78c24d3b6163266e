import { userRoute } from "@/lib/api/route";
import { setPersonActive } from "@/lib/auth/people";

/** Organisation admins: the person may sign in again, with the site roles they held. */
export const POST = userRoute({ permission: "managePeople" }, async ({ user, params }) => ({
  person: await setPersonActive({ user, userId: params.userId ?? "", active: true }),
}));
