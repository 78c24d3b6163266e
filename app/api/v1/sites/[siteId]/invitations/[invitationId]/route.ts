import { siteRoute } from "@/lib/api/route";
import { invitationView, revokeInvitation } from "@/lib/auth/invitations";

/** Revoke: the link stops working at once → { invitation } with state "revoked". */
export const DELETE = siteRoute(
  { resource: "invitation", permission: "managePeople", forbidden: "Revoking invitations is for organisation admins." },
  async ({ user, site, resource }) => ({ invitation: invitationView(await revokeInvitation({ user, site, invitation: resource })) }),
);
