import { siteRoute } from "@/lib/api/route";
import { invitationView, resendInvitation } from "@/lib/auth/invitations";

/** Sends a new link (the previous one stops working) valid for another 7 days → { invitation }. */
export const POST = siteRoute(
  { resource: "invitation", permission: "managePeople", forbidden: "Re-sending invitations is for organisation admins." },
  async ({ user, site, resource }) => ({ invitation: invitationView(await resendInvitation({ user, site, invitation: resource })) }),
);
