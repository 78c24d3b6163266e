// At a desk: the scheme page shows the load on each level of props, and changing the scheme's
// back-propping re-checks the member logged at level 2 — its utilisation changes and its history
// says why. Desktop project only (playwright.config.ts).
import { expect, test } from "@playwright/test";
import { signIn } from "./helpers";
import { backproppedScheme } from "./backprop-support";

test("changing a scheme's back-propping re-checks its members", async ({ page }) => {
  const stamp = Date.now().toString(36).toUpperCase();
  const reference = `TW-BPD-${stamp}`;
  const tag = `E2E-BPD-${stamp}`;
  await signIn(page, "coordinator@demo.example");
  const { siteId, schemeId, propDId } = await backproppedScheme(page, reference);
  const created = await page.request.post(`/api/v1/sites/${siteId}/members`, {
    data: { tag, schemeId, memberTypeId: propDId, extensionMm: 2000, loadSource: "backprop", level: 2, spacingXMm: 1000, spacingYMm: 1000 },
  });
  expect(created.status()).toBe(201);
  const { member } = (await created.json()) as { member: { id: string; utilisation: number } };

  await page.goto(`/sites/${siteId}/schemes/${schemeId}`);
  await expect(page.getByRole("heading", { level: 1, name: new RegExp(reference) })).toBeVisible();
  const levels = page.getByTestId("backprop-levels");
  // Level 1: w + f + q = 8.25 kN/m² (1.32 w); level 2: 2w + 2f + q = 15 kN/m² (2.40 w), by hand from the method's assumptions.
  await expect(levels.getByRole("row", { name: /^1 / })).toContainText("8.25 kN/m²");
  await expect(levels.getByRole("row", { name: /^1 / })).toContainText("1.32");
  await expect(levels.getByRole("row", { name: /^2 / })).toContainText("15.00 kN/m²");
  await expect(levels.getByRole("row", { name: /^2 / })).toContainText("2.40");
  await expect(page.getByRole("note", { name: "Caution" }).first()).toBeVisible();

  // Heavier formwork: level 2 = 12.5 + 2 × 1.0 + 1.5 = 16 kN/m² → 16 kN on the member.
  await page.getByLabel(/Formwork at casting/).fill("1.0");
  await page.getByRole("button", { name: "Save changes" }).click();
  await expect(page.getByRole("status").filter({ hasText: "1 member whose load comes from this scheme was re-checked" })).toBeVisible();
  await expect(levels.getByRole("row", { name: /^2 / })).toContainText("16.00 kN/m²");

  await page.goto(`/sites/${siteId}/members/${member.id}`);
  await expect(page.getByRole("heading", { level: 1, name: tag })).toBeVisible();
  await expect(page.getByText(/16\.00 kN \(from the scheme's back-propping, level 2/)).toBeVisible();
  const history = page.getByRole("list", { name: "Audit history" });
  await expect(history).toContainText(`Re-checked because scheme ${reference} was changed (back-propping).`);
  await expect(history).toContainText("Working load changed from 15.00 kN to 16.00 kN");
  await expect(page.getByRole("heading", { name: "Check history (2)" })).toBeVisible();
  await expect(page.getByText("After its scheme changed")).toBeVisible();
  // The utilisation went up with the load (15 → 16 kN against the same capacity).
  const latest = (await (await page.request.get(`/api/v1/members/${member.id}`)).json()) as { member: { utilisation: number } };
  expect(latest.member.utilisation).toBeCloseTo((member.utilisation * 16) / 15, 6);
});
