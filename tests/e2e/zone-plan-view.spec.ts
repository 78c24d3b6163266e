// The demo's zone plans at phone and desk sizes, for a role that only looks: pins with icon and
// word, the utilisation on tap, a filter, a legend, the members not placed, and the printout.
import { expect, test } from "@playwright/test";
import { signIn } from "./helpers";
import { L2, WHARF } from "../support/demo";

test("a site manager reads the Level 2 plan: failing member marked with its word, utilisation on tap, filter, legend, print links, nothing off the screen", async ({ page }) => {
  await signIn(page, "manager@demo.example");
  const sites = (await (await page.request.get("/api/v1/sites")).json()) as { items: { id: string; name: string }[] };
  const siteId = sites.items.find((s) => s.name === WHARF)!.id;
  await page.goto(`/sites/${siteId}/members`);
  await page.getByRole("navigation", { name: "See the members on a zone plan" }).getByRole("link", { name: L2 }).click();
  await expect(page.getByRole("heading", { level: 1, name: `${L2}: plan` })).toBeVisible();
  await expect(page.getByRole("img", { name: `${L2} plan`, exact: true })).toBeVisible();

  // WXW-L2-P08 is the demo's over-extended, overloaded prop on this slab.
  const failing = page.locator('[data-state="fail"]');
  const p08 = failing.and(page.locator('[aria-label^="WXW-L2-P08"]'));
  await expect(p08).toHaveCount(1);
  await expect(p08).toHaveAttribute("aria-label", /WXW-L2-P08 Fail/);
  await expect(page.locator('[data-state="pass"]').first()).toHaveAttribute("aria-label", /Pass/);
  await p08.click();
  await expect(page.getByTestId("pin-detail")).toContainText(/WXW-L2-P08 — Fail/);
  await expect(page.getByTestId("pin-detail")).toContainText(/Utilisation \d+ %/);

  await page.getByLabel("Check").selectOption("fail");
  await expect(page.locator("[data-pin]")).toHaveCount(await failing.count());
  await expect(page.locator('[data-state="pass"]')).toHaveCount(0);
  await page.getByLabel("Check").selectOption("");

  const legend = page.locator("section[aria-labelledby=legend-h]");
  for (const word of ["Fail", "Out of service", "Not checked", "Pass", "Loaded", "Struck"]) await expect(legend).toContainText(word);
  await expect(page.getByRole("link", { name: "Print (A3 PDF)" })).toHaveAttribute("href", /plan\/pdf\?paper=a3/);
  await expect(page.getByRole("note", { name: "Caution" })).toBeVisible();
  // A manager may look but not upload.
  await expect(page.getByRole("button", { name: "Upload plan" })).toHaveCount(0);
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  expect(overflow).toBeLessThanOrEqual(1);
});

test("a member left off its zone's plan is listed beside it, with a link to the member", async ({ page }) => {
  await signIn(page, "manager@demo.example");
  const sites = (await (await page.request.get("/api/v1/sites")).json()) as { items: { id: string; name: string }[] };
  const siteId = sites.items.find((s) => s.name === WHARF)!.id;
  const zones = (await (await page.request.get(`/api/v1/sites/${siteId}/zones`)).json()) as { items: { id: string; name: string }[] };
  const l1 = zones.items.find((z) => z.name === "Level 1 slab, bays 1–4")!;
  await page.goto(`/sites/${siteId}/zones/${l1.id}/plan`);
  const list = page.getByRole("list", { name: "Members not on the plan" });
  await expect(list.getByRole("link", { name: "WXW-L1-P12" })).toBeVisible();
  await list.getByRole("link", { name: "WXW-L1-P12" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "WXW-L1-P12" })).toBeVisible();
  await expect(page.getByRole("link", { name: /Plan of Level 1 slab, bays 1–4 \(WXW-L1-P12 is not placed on it yet\)/ })).toBeVisible();
});

test("pin labels never print over each other: a tight row shows its icons, and zooming in brings every label back", async ({ page }) => {
  await signIn(page, "manager@demo.example");
  const sites = (await (await page.request.get("/api/v1/sites")).json()) as { items: { id: string; name: string }[] };
  const siteId = sites.items.find((s) => s.name === WHARF)!.id;
  const zones = (await (await page.request.get(`/api/v1/sites/${siteId}/zones`)).json()) as { items: { id: string; name: string }[] };
  const l1 = zones.items.find((z) => z.name === "Level 1 slab, bays 1–4")!;
  await page.goto(`/sites/${siteId}/zones/${l1.id}/plan`);
  await expect(page.locator("[data-pin]").first()).toBeVisible();
  const boxes = () =>
    page.evaluate(() =>
      Array.from(document.querySelectorAll("[data-pin] text")).map((t) => {
        const r = t.getBoundingClientRect();
        return { l: r.left, r: r.right, t: r.top, b: r.bottom };
      }),
    );
  const overlaps = (bs: { l: number; r: number; t: number; b: number }[]) =>
    bs.some((a, i) => bs.some((b, j) => j > i && a.l < b.r && b.l < a.r && a.t < b.b && b.t < a.b));
  const pins = await page.locator("[data-pin]").count();
  expect(overlaps(await boxes())).toBe(false);
  // Zoomed in far enough, every pin has its label, still clear of the others.
  for (let i = 0; i < 6 && (await boxes()).length < pins; i++) await page.getByRole("button", { name: "Zoom in" }).click();
  expect((await boxes()).length).toBe(pins);
  expect(overlaps(await boxes())).toBe(false);
});
