import { listPendingInvitations } from "@/db/queries/invitations";
import { created } from "@/lib/api";
import { siteRoute } from "@/lib/api/route";
import { invitationView, inviteToSite } from "@/lib/auth/invitations";
import { invitationSchema } from "@/lib/validations/onboarding";

const forbidden = "Inviting people is for organisation admins.";

/** Pending invitations to the site (not accepted, revoked or expired). */
export const GET = siteRoute({ resource: "site", permission: "managePeople", forbidden }, async ({ site }) => ({
  items: (await listPendingInvitations({ siteId: site.id })).map((i) => ({ ...invitationView(i), invitedBy: i.invitedByName })),
}));

/** { email, name?, roles } → 201 { invitation }; the invitee is e-mailed a single-use link. */
export const POST = siteRoute({ resource: "site", permission: "managePeople", forbidden, body: invitationSchema }, async ({ user, site, input }) =>
  created({ invitation: invitationView(await inviteToSite({ user, site, input })) }),
);
