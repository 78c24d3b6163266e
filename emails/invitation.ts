// E-mail inviting someone to a site, with their single-use link.
import { renderEmail } from "./layout";

export function invitationEmail(p: { siteName: string; organisationName: string; invitedBy: string; roles: string[]; url: string; expiresOn: string }) {
  return renderEmail({
    title: `You are invited to ${p.siteName} on Strutwise`,
    paragraphs: [
      `${p.invitedBy} of ${p.organisationName} has invited you to the temporary works register for ${p.siteName}.`,
      "Open the link to choose your password and join. The link works once.",
    ],
    facts: [
      ["Site", p.siteName],
      ["Your roles", p.roles.join(", ")],
      ["Link valid until", p.expiresOn],
    ],
    link: { href: p.url, label: "Accept the invitation" },
  });
}
