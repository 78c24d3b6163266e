// E-mail to the site's coordinators the moment a supervisor issues a permit under the issuing
// scope the coordinator gave them, so the coordinator always knows what was released.
import { renderEmail } from "./layout";

export function permitIssuedUnderScopeEmail(p: {
  numberLabel: string;
  /** The request it was issued from (requestReference). */
  request: string;
  kindLabel: string;
  siteName: string;
  scope: string;
  zones: string;
  validUntil: string;
  issuedBy: string;
  requestedBy: string;
  conditions: string | null;
  url: string;
}) {
  return renderEmail({
    title: `${p.numberLabel} issued by ${p.issuedBy} under delegated scope — ${p.siteName}`,
    paragraphs: [
      `${p.issuedBy} (temporary works supervisor) has issued ${p.kindLabel.toLowerCase()} ${p.numberLabel} for ${p.scope}, under the issuing scope you gave. It was requested by ${p.requestedBy}.`,
      p.conditions ? `Conditions: ${p.conditions}` : "No conditions beyond the design and the permit.",
      "Review it, and withdraw it if anything is wrong.",
    ],
    facts: [
      ["Permit", p.numberLabel],
      ["Request", p.request],
      ["Site", p.siteName],
      ["Zone", p.zones],
      ["Valid until", p.validUntil],
      ["Issued by", p.issuedBy],
    ],
    link: { href: p.url, label: "Open the permit" },
    caution: true,
  });
}
