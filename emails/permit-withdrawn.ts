// E-mail to everyone who received a permit when the coordinator withdraws it.
import { renderEmail } from "./layout";

export function permitWithdrawnEmail(p: { numberLabel: string; kindLabel: string; siteName: string; scope: string; withdrawnBy: string; reason: string; url: string }) {
  return renderEmail({
    title: `${p.numberLabel} WITHDRAWN — ${p.siteName}`,
    paragraphs: [
      `${p.withdrawnBy} has withdrawn ${p.kindLabel.toLowerCase()} ${p.numberLabel} (${p.scope}). It no longer authorises any work; destroy printed copies.`,
      `Reason: ${p.reason}`,
    ],
    facts: [
      ["Permit", p.numberLabel],
      ["Site", p.siteName],
    ],
    link: { href: p.url, label: "Open the permit" },
    caution: true,
  });
}
