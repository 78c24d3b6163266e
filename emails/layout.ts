// The shared frame of every e-mail: plain text and simple, high-contrast HTML with one link.
import { CAUTION_TEXT } from "@/lib/caution";

export type EmailContent = {
  title: string;
  /** Short paragraphs, in order. */
  paragraphs: string[];
  /** Label/value pairs shown as a small table (permit number, site, valid until…). */
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
  const html = `<!doctype html><html><body style="margin:0;background:#f7f6f2;font-family:Arial,Helvetica,sans-serif;color:#14161a">
<div style="max-width:600px;margin:0 auto;padding:24px">
<h1 style="font-size:20px;margin:0 0 16px">${esc(c.title)}</h1>
${c.paragraphs.map((p) => `<p style="font-size:16px;line-height:1.5;margin:0 0 12px">${esc(p)}</p>`).join("\n")}
${
  facts.length
    ? `<table style="border-collapse:collapse;margin:8px 0 16px;font-size:15px">${facts
        .map(([k, v]) => `<tr><th style="text-align:left;padding:4px 12px 4px 0;vertical-align:top">${esc(k)}</th><td style="padding:4px 0">${esc(v)}</td></tr>`)
        .join("")}</table>`
    : ""
}
<p style="margin:16px 0"><a href="${esc(c.link.href)}" style="display:inline-block;background:#1d4f91;color:#ffffff;padding:12px 18px;border-radius:8px;font-weight:bold;text-decoration:none">${esc(c.link.label)}</a></p>
${c.caution ? `<p style="border:2px solid #8a5a00;background:#fbefd0;padding:10px;font-size:14px"><strong>Caution.</strong> ${esc(CAUTION_TEXT)}</p>` : ""}
<p style="font-size:12px;color:#3b4048;margin-top:24px">Strutwise temporary works register</p>
</div></body></html>`;
  return { subject: c.title, text, html };
}
