import { NextResponse } from "next/server";
import { publicRoute } from "@/lib/api/route";
import { acceptInvitation } from "@/lib/auth/invitations";
import { acceptInvitationSchema } from "@/lib/validations/onboarding";

/**
 * { name, password } → 201 for a new person. Someone with an account in the organisation signs
 * in first and sends {} → 200 with the roles added. Used, expired or revoked links → 410.
 */
export const POST = publicRoute({ body: acceptInvitationSchema, bodyMode: "optional-json" }, async ({ params, input }) => {
  const out = await acceptInvitation({ token: params.token ?? "", input });
  return NextResponse.json({ user: out.user, siteId: out.siteId, roles: out.roles }, { status: out.status });
});
