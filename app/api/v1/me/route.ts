import { userRoute } from "@/lib/api/route";

/** The signed-in person. */
export const GET = userRoute({}, async ({ user }) => ({ user }));
