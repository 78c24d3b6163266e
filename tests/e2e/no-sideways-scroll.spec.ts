// Nothing scrolls sideways: every main page, for every role, fits the phone's 412 px (Pixel 7,
// 412×915; phone project only — the desk's 1366 px is register-desk.spec.ts); wide tables scroll
// inside their own box. Also the HTML e-mails,
// which are laid out for a phone first (one column, readable text, a full-width button).
import { expect, test, type Page } from "@playwright/test";
import { renderEmail } from "@/emails/layout";
import { siteNav } from "@/lib/navigation";
import type { SiteRole } from "@/db/schema";
import { openSite, signIn } from "./helpers";
import { WHARF } from "../support/demo";

const PEOPLE: [string, SiteRole][] = [
  ["engineer@demo.example", "engineer"],
  ["coordinator@demo.example", "coordinator"],
  ["supervisor@demo.example", "supervisor"],
  ["designer@demo.example", "designer"],
  ["manager@demo.example", "manager"],
  ["admin@demo.example", "admin"],
];

/** How far the page reaches beyond the window, in CSS px (0 when nothing scrolls sideways). */
async function overflow(page: Page) {
  return page.evaluate(() => {
    const width = window.innerWidth;
    const root = document.documentElement.scrollWidth;
    // Name the widest offender so a failure says where to look.
    let worst = "";
    let most = width;
    for (const el of Array.from(document.body.querySelectorAll<HTMLElement>("*"))) {
      const r = el.getBoundingClientRect();
      if (r.right > most + 0.5 && !el.closest("[class*='overflow-x-auto'],[class*='overflow-auto']")) {
        most = r.right;
        worst = `${el.tagName.toLowerCase()}${el.id ? `#${el.id}` : ""}.${String(el.className).slice(0, 60)}`;
      }
    }
    return { width, root, worst };
  });
}

async function expectFits(page: Page, path: string) {
  await page.goto(path);
  await page.waitForLoadState("networkidle");
  const o = await overflow(page);
  expect(o.root, `${path} is ${o.root} px wide in a ${o.width} px window (widest: ${o.worst})`).toBeLessThanOrEqual(o.width);
}

for (const [email, role] of PEOPLE) {
  test(`every main page fits the window without sideways scrolling — ${role}`, async ({ page }) => {
    test.setTimeout(180_000);
    await signIn(page, email);
    await expectFits(page, "/sites");
    await openSite(page, WHARF);
    const siteId = /\/sites\/([0-9a-f-]{36})/.exec(page.url())![1]!;
    const paths = siteNav(siteId, [role]).map((n) => n.href);
    expect(paths.length).toBeGreaterThan(3);
    for (const p of paths) await expectFits(page, p);

    // A member's record, its inspection page and a permit: the pages with the widest tables.
    await page.goto(`/sites/${siteId}/members`);
    const member = page.locator(`a[href^="/sites/${siteId}/members/"]:visible`).filter({ hasText: /WXW-/ }).first();
    const memberHref = await member.getAttribute("href");
    expect(memberHref).toMatch(/\/members\/[0-9a-f-]{36}/);
    await expectFits(page, memberHref!);
    await page.goto(`/sites/${siteId}/permits`);
    const permit = page.locator(`a[href^="/sites/${siteId}/permits/"]:visible`).filter({ hasText: /PTL-\d|PTS-\d|Request \d+ by / }).first();
    const permitHref = await permit.getAttribute("href");
    expect(permitHref).toMatch(/\/permits\/[0-9a-f-]{36}/);
    await expectFits(page, permitHref!);
  });
}

test("an HTML e-mail reads on a phone: one column, no sideways scroll, 14 px text or larger, a full-width button", async ({ page }) => {
  const mail = renderEmail({
    title: "PTL-0042 issued: permit to load — Wexcombe Wharf — Block B",
    paragraphs: [
      "Priya Natarajan has issued permit to load PTL-0042 for 12 members in Level 2 slab, bays 1–4. The permit is attached as a PDF.",
      "Conditions: https://example.invalid/a-very-long-unbroken-address-that-must-wrap-rather-than-widen-the-page/and/more/and/more",
    ],
    facts: [["Permit", "PTL-0042"], ["Valid until", "9 Dec 2026, 09:30 GMT (7 days)"], ["Zone", "Level 2 slab, bays 1–4"]],
    link: { href: "https://example.invalid/sites/x/permits/y", label: "Open the permit" },
    caution: true,
  });
  for (const width of [320, 412]) {
    await page.setViewportSize({ width, height: 900 });
    await page.setContent(mail.html);
    const m = await page.evaluate(() => {
      const texts = Array.from(document.body.querySelectorAll<HTMLElement>("h1,p,td,th,div,a,strong")).filter((el) => el.textContent?.trim());
      const link = document.querySelector<HTMLElement>("a")!.getBoundingClientRect();
      const column = document.querySelector<HTMLElement>("h1")!.getBoundingClientRect();
      return {
        scroll: document.documentElement.scrollWidth,
        smallest: Math.min(...texts.map((el) => parseFloat(getComputedStyle(el).fontSize))),
        linkWidth: link.width,
        columnWidth: column.width,
        linkHeight: link.height,
      };
    });
    expect(m.scroll, `e-mail at ${width} px`).toBeLessThanOrEqual(width);
    expect(m.smallest).toBeGreaterThanOrEqual(14);
    // The button spans the column on a phone and is a comfortable tap target (44 px, WCAG 2.5.5).
    expect(Math.abs(m.linkWidth - m.columnWidth)).toBeLessThan(2);
    expect(m.linkHeight).toBeGreaterThanOrEqual(44);
  }
  // On a desk the column stops at 600 px, centred.
  await page.setViewportSize({ width: 1366, height: 900 });
  await page.setContent(mail.html);
  const desk = await page.evaluate(() => document.querySelector("h1")!.parentElement!.getBoundingClientRect().width);
  expect(desk).toBeLessThanOrEqual(600);
});
