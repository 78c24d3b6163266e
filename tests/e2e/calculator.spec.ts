import { expect, test } from "@playwright/test";
import { openSite, signIn } from "./helpers";
import { ORCHARD, WHARF } from "../support/demo";

test("an engineer checks a prop at its extension and reads the working", async ({ page }) => {
  await signIn(page, "engineer@demo.example");
  await openSite(page, WHARF);
  await page.goto(`${new URL(page.url()).pathname}/calculator`);
  await expect(page.getByRole("note", { name: "Caution" })).toBeVisible();
  await page.getByLabel("Method").selectOption("en1065");
  await page.getByLabel("EN 1065 class").selectOption("D");
  await page.getByLabel(/^Extension/).fill("2850");
  await page.getByLabel(/^Maximum extension/).fill("3350");
  await page.getByLabel(/^Load to compare/).fill("12");
  await page.getByRole("button", { name: "Calculate" }).click();
  await expect(page.getByTestId("capacity")).toContainText("kN");
  await expect(page.getByTestId("verdict")).toContainText(/PASS|FAIL/);
  await expect(page.getByRole("table")).toContainText("EN 1065");
  await expect(page.getByText("Capacity against length")).toBeVisible();
  // Issue #16: the working's source column names the standard and clause only; a value awaiting
  // confirmation is flagged beside it in words a checker reads, not folded into the citation.
  const working = page.getByRole("table", { name: "Working" });
  const strength = working.getByRole("row").filter({ hasText: "Nominal characteristic strength" });
  await expect(strength).toHaveCount(1);
  await expect(strength.locator('[data-part="source"]')).toHaveText("EN 1065:1998 Table 2");
  const flag = strength.locator('[data-part="to-confirm"]');
  await expect(flag).toBeVisible();
  await expect(flag).toHaveText("Value to be confirmed against EN 1065 Table 2");
  // No citation in the working carries words in brackets or after a semicolon.
  const sources = await working.locator('[data-part="source"]').allTextContents();
  expect(sources.length).toBeGreaterThan(4);
  for (const s of sources) expect(s).not.toMatch(/;|\s\(/);
});

test("a steel tube with an impossible wall shows the reason on the field", async ({ page }) => {
  await signIn(page, "designer@demo.example");
  await openSite(page, ORCHARD);
  await page.goto(`${new URL(page.url()).pathname}/calculator`);
  await page.getByLabel("Method").selectOption("en1993");
  await page.getByLabel(/^Length between restraints/).fill("3000");
  await page.getByLabel(/^Outside diameter/).fill("100");
  await page.getByLabel(/^Wall thickness/).fill("60");
  await page.getByLabel("Steel grade").selectOption("S355");
  await page.getByRole("button", { name: "Calculate" }).click();
  await expect(page.locator("#t-error")).toContainText(/thickness/i);
  await expect(page.getByTestId("capacity")).toHaveCount(0);
});
