// HTML e-mails are laid out for a phone first: the viewport is the device's, one fluid column no
// wider than 600 px, no text under 14 px, long words wrap, and the link becomes a full-width
// button on a small screen. Mail programs ignore most CSS layout, so this is checked on the HTML
// itself (the rendered look is checked in tests/e2e/no-sideways-scroll.spec.ts).
import { describe, expect, it } from "vitest";
import { renderEmail } from "@/emails/layout";

const mail = renderEmail({
  title: "PTL-0042 issued: permit to load — Wexcombe Wharf",
  paragraphs: ["Priya Natarajan has issued permit to load PTL-0042 for 12 members in Level 2 slab."],
  facts: [["Permit", "PTL-0042"], ["Valid until", "9 Dec 2026, 09:30 GMT (7 days)"]],
  link: { href: "https://example.invalid/sites/x/permits/y", label: "Open the permit" },
  caution: true,
});

describe("HTML e-mail layout", () => {
  it("uses the device's width and one column at most 600 px wide", () => {
    expect(mail.html).toContain('<meta name="viewport" content="width=device-width, initial-scale=1">');
    expect(mail.html).toMatch(/style="width:100%;max-width:600px"/);
    // No fixed widths that would push a 412 px phone sideways.
    expect(mail.html).not.toMatch(/width:\s*(?:[7-9]\d\d|[1-9]\d{3})px/);
    expect(mail.html).not.toMatch(/width="(?:[4-9]\d\d|[1-9]\d{3})"/);
  });

  it("writes no text smaller than 14 px", () => {
    const sizes = [...mail.html.matchAll(/font-size:(\d+)px/g)].map((m) => Number(m[1]));
    expect(sizes.length).toBeGreaterThan(3);
    expect(Math.min(...sizes)).toBeGreaterThanOrEqual(14);
  });

  it("stacks each fact label over its value instead of a second column", () => {
    expect(mail.html).not.toContain("<th");
    expect(mail.html).toMatch(/<div style="[^"]*font-weight:bold[^"]*">Valid until<\/div><div>9 Dec 2026, 09:30 GMT \(7 days\)<\/div>/);
  });

  it("makes the link a full-width button on a small screen and wraps long words", () => {
    expect(mail.html).toMatch(/@media only screen and \(max-width:620px\)\{[^}]*\}\.sw-button\{display:block !important;width:100% !important/);
    expect(mail.html).toMatch(/<a class="sw-button" href="https:\/\/example\.invalid\/sites\/x\/permits\/y"/);
    expect(mail.html).toContain("overflow-wrap:anywhere");
  });

  it("keeps the plain-text part with the same facts and the caution", () => {
    expect(mail.text).toContain("Valid until: 9 Dec 2026, 09:30 GMT (7 days)");
    expect(mail.html).toContain("Caution.");
  });
});
