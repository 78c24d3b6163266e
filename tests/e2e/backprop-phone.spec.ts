// On a phone: a member logged at level 2 of a back-propped scheme gets that level's load, and its
// page shows the load and the working (Grundy & Kabaila 1963). Phone project only (playwright.config.ts).
import { expect, test } from "@playwright/test";
import { signIn } from "./helpers";
import { backproppedScheme } from "./backprop-support";

test("a member logged at level 2 of a back-propped scheme shows its load and the working", async ({ page }) => {
  const stamp = Date.now().toString(36).toUpperCase();
  const reference = `TW-BPP-${stamp}`;
  const tag = `E2E-BPP-${stamp}`;
  await signIn(page, "coordinator@demo.example");
  const { siteId, schemeId, propDName } = await backproppedScheme(page, reference);

  await page.goto(`/sites/${siteId}/members/new`);
  await expect(page.getByRole("heading", { name: "Log a member" })).toBeVisible();
  await page.getByLabel("Tag (the code on its label)").fill(tag);
  await page.getByLabel("Scheme").selectOption({ label: `${reference} — Back-propping under the next pour` });
  await page.getByLabel("Member type").selectOption({ label: propDName });
  await page.getByLabel("Measured extension (mm)").fill("2000");
  await page.getByLabel("From back-propping").check();
  // Levels are named on the picker itself: 1 is right under the slab being cast.
  await expect(page.getByLabel("Level of props").locator("option", { hasText: "Level 1 — right under the slab being cast" })).toHaveCount(1);
  await page.getByLabel("Level of props").selectOption("2");
  await page.getByLabel("As-built spacing X (mm)").fill("1000");
  await page.getByLabel("As-built spacing Y (mm)").fill("1000");
  // Level 2 in the second cycle stands on the rigid ground under both slabs (Grundy & Kabaila's assumption):
  // 2 × 6.25 + 2 × 0.5 + 1.5 = 15 kN/m² over 1 m² = 15 kN.
  const preview = page.getByTestId("backprop-load-preview");
  await expect(preview).toContainText("15.00 kN");
  await expect(preview).toContainText("Cycle 2: slab 2 cast");
  const width = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(width).toBeLessThanOrEqual(0);

  await page.getByRole("button", { name: "Save and check" }).click();
  await expect(page.getByTestId("check-result")).toContainText("15.00 kN");
  await page.getByRole("link", { name: "Open the member page" }).click();
  await expect(page.getByRole("heading", { level: 1, name: tag })).toBeVisible();
  await expect(page.getByRole("note", { name: "Caution" })).toBeVisible();
  await expect(page.getByText(/15\.00 kN \(from the scheme's back-propping, level 2 of props/)).toBeVisible();
  const working = page.getByRole("table", { name: "Working of this check" });
  await expect(working).toContainText("Largest prop load ratio at level 2");
  await expect(working).toContainText("Grundy & Kabaila 1963");

  // The scheme's per-level table reads on the phone without sideways scrolling, with the caution.
  await page.goto(`/sites/${siteId}/schemes/${schemeId}`);
  const levels = page.getByTestId("backprop-levels");
  await expect(levels.getByRole("row", { name: /^2 / })).toContainText("15.00 kN/m²");
  await expect(page.getByRole("region", { name: "Back-propping: load on each level of props" }).getByRole("note", { name: "Caution" })).toBeVisible();
  const schemeOverflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  expect(schemeOverflow).toBeLessThanOrEqual(0);
});
