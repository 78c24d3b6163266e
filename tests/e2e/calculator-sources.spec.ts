// Issue #16: the working's source column names the standard and clause only; a value awaiting
// confirmation is flagged beside it in words a checker reads ("Value to be confirmed against EN 1065
// Table 2"), not folded into the citation. Runs at phone (412 × 915) and desk sizes.
import { expect, test } from "@playwright/test";
import { openSite, signIn } from "./helpers";
import { WHARF } from "../support/demo";

test("the EN 1065 class strength shows its clause, and the to-be-confirmed flag as its own words", async ({ page }) => {
  await signIn(page, "engineer@demo.example");
  await openSite(page, WHARF);
  await page.goto(`${new URL(page.url()).pathname}/calculator`);
  await page.getByLabel("Method").selectOption("en1065");
  await page.getByLabel("EN 1065 class").selectOption("D");
  await page.getByLabel(/^Extension/).fill("2850");
  await page.getByLabel(/^Maximum extension/).fill("3350");
  await page.getByLabel(/^Load to compare/).fill("12");
  await page.getByRole("button", { name: "Calculate" }).click();
  const working = page.getByRole("table", { name: "Working" });
  const strength = working.getByRole("row").filter({ hasText: "Nominal characteristic strength" });
  await expect(strength).toHaveCount(1);
  // The citation alone …
  await expect(strength.locator('[data-part="source"]')).toHaveText("EN 1065:1998 Table 2");
  // … and the flag beside it, in its own words, visible to the person reading the working.
  const flag = strength.locator('[data-part="to-confirm"]');
  await expect(flag).toBeVisible();
  await expect(flag).toHaveText("Value to be confirmed against EN 1065 Table 2");
  // No citation in the working carries words in brackets or after a semicolon.
  const sources = await working.locator('[data-part="source"]').allTextContents();
  expect(sources.length).toBeGreaterThan(4);
  for (const s of sources) expect(s).not.toMatch(/;|\s\(/);
  await expect(page.getByRole("note", { name: "Caution" })).toBeVisible();
});
