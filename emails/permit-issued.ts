// E-mail to each recipient of an issued permit; the PDF is attached once it is rendered.
import { renderEmail } from "./layout";

export function permitIssuedEmail(p: {
  numberLabel: string;
  /** The request it was issued from (requestReference). */
  request: string;
  kindLabel: string;
  siteName: string;
  scope: string;
  zones: string;
  validUntil: string;
  issuedBy: string;
  conditions: string | null;
  url: string;
}) {
  const r = renderEmail({
    title: `${p.numberLabel} issued: ${p.kindLabel.toLowerCase()} — ${p.siteName}`,
    paragraphs: [
      `${p.issuedBy} has issued ${p.kindLabel.toLowerCase()} ${p.numberLabel} for ${p.scope}. The permit is attached as a PDF.`,
      p.conditions ? `Conditions: ${p.conditions}` : "No conditions beyond the design and the permit.",
    ],
    facts: [
      ["Permit", p.numberLabel],
      ["Request", p.request],
      ["Site", p.siteName],
      ["Zone", p.zones],
      ["Valid until", p.validUntil],
    ],
    link: { href: p.url, label: "Open the permit" },
    caution: true,
  });
  return r;
}
