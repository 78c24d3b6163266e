// E-mail to the requester when the coordinator refuses a permit request.
import { renderEmail } from "./layout";

export function permitRefusedEmail(p: { reference: string; kindLabel: string; siteName: string; scope: string; refusedBy: string; reason: string; url: string }) {
  return renderEmail({
    title: `Your ${p.kindLabel.toLowerCase()} request was refused — ${p.siteName}`,
    paragraphs: [`${p.refusedBy} refused your request for ${p.scope}.`, `Reason: ${p.reason}`, "Nothing may be loaded or struck under this request."],
    facts: [["Request", p.reference], ["Site", p.siteName]],
    link: { href: p.url, label: "Open the request" },
    caution: true,
  });
}
