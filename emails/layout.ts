// The shared frame of every e-mail: plain text and simple, high-contrast HTML with one link.
import { CAUTION_TEXT } from "@/lib/caution";

export type EmailContent = {
  title: string;
  /** Short paragraphs, in order. */
  paragraphs: string[];
  /** Label/value pairs, each label stacked over its value (permit number, site, valid until…). */
  facts?: [string, string][];
  link: { href: string; label: string };
  /** Adds the temporary works caution (permits, capacity results). */
  caution?: boolean;
};

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

export function renderEmail(c: EmailContent): { subject: string; text: string; html: string } {
  const facts = c.facts ?? [];
  const text = [
    c.title,
    "",
    ...c.paragraphs.flatMap((p) => [p, ""]),
    ...facts.map(([k, v]) => `${k}: ${v}`),
    ...(facts.length ? [""] : []),
    `${c.link.label}: ${c.link.href}`,
    ...(c.caution ? ["", `Caution: ${CAUTION_TEXT}`] : []),
    "",
    "— Strutwise temporary works register",
  ].join("\n");
  // Laid out for a phone first: one fluid column no wider than 600 px, text at 16 px (14 px for
  // the small print), facts stacked label over value so nothing needs a second column, and the
  // link a full-width button — table-based, as mail programs ignore most CSS layout.
  const html = `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><meta name="x-apple-disable-message-reformatting"><title>${esc(c.title)}</title>
<style>@media only screen and (max-width:620px){.sw-frame{padding:16px !important}.sw-button{display:block !important;width:100% !important;box-sizing:border-box}}</style></head>
<body style="margin:0;padding:0;background:#f7f6f2;font-family:Arial,Helvetica,sans-serif;color:#14161a;-webkit-text-size-adjust:100%">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" border="0" style="width:100%;background:#f7f6f2"><tr><td align="center" style="padding:0">
<table role="presentation" class="sw-column" width="100%" cellpadding="0" cellspacing="0" border="0" style="width:100%;max-width:600px"><tr><td class="sw-frame" style="padding:24px;word-break:break-word;overflow-wrap:anywhere">
<h1 style="font-size:22px;line-height:1.3;margin:0 0 16px">${esc(c.title)}</h1>
${c.paragraphs.map((p) => `<p style="font-size:16px;line-height:1.5;margin:0 0 12px">${esc(p)}</p>`).join("\n")}
${
  facts.length
    ? `<table role="presentation" width="100%" cellpadding="0" cellspacing="0" border="0" style="width:100%;margin:8px 0 16px;font-size:16px;line-height:1.4">${facts
        .map(([k, v]) => `<tr><td style="padding:6px 0;border-top:1px solid #d9d6cc"><div style="font-size:14px;font-weight:bold;color:#3b4048">${esc(k)}</div><div>${esc(v)}</div></td></tr>`)
        .join("")}</table>`
    : ""
}
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" border="0" style="margin:16px 0"><tr><td><a class="sw-button" href="${esc(c.link.href)}" style="display:inline-block;background:#1d4f91;color:#ffffff;padding:14px 20px;border-radius:8px;font-size:16px;font-weight:bold;text-align:center;text-decoration:none">${esc(c.link.label)}</a></td></tr></table>
${c.caution ? `<p style="border:2px solid #8a5a00;background:#fbefd0;padding:10px;margin:0 0 12px;font-size:14px;line-height:1.5"><strong>Caution.</strong> ${esc(CAUTION_TEXT)}</p>` : ""}
<p style="font-size:14px;color:#3b4048;margin:24px 0 0">Strutwise temporary works register</p>
</td></tr></table>
</td></tr></table></body></html>`;
  return { subject: c.title, text, html };
}
