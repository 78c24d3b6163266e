// To a permit's recipients: a member failed its inspection and is no longer covered by the permit.
import { renderEmail } from "./layout";

export function renderPermitMemberRemoved(p: {
  siteName: string; permitLabel: string; tag: string; inspectedAt: string; inspectorName: string; failedItems: string[]; notes: string | null; link: string;
}) {
  return renderEmail({
    title: `${p.tag} removed from ${p.permitLabel} — failed inspection`,
    paragraphs: [
      `${p.tag} failed its inspection and has been taken out of service. It is no longer covered by ${p.permitLabel}: do not load it, and unload it if it carries load, as the temporary works coordinator directs.`,
      ...(p.failedItems.length ? [`Failed: ${p.failedItems.join("; ")}`] : []),
      ...(p.notes ? [`Inspector's notes: ${p.notes}`] : []),
      "A passing re-inspection returns it to service; it does not rejoin this permit.",
    ],
    facts: [
      ["Site", p.siteName],
      ["Permit", p.permitLabel],
      ["Member", p.tag],
      ["Inspected", p.inspectedAt],
      ["Inspector", p.inspectorName],
    ],
    link: { href: p.link, label: "Open the permit" },
    caution: true,
  });
}
