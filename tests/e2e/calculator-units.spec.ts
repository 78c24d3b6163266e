import { expect, test } from "@playwright/test";
import { openSite, signIn } from "./helpers";
import { WHARF } from "../support/demo";

// Conversions: NIST SP 811 (2008) Appendix B, 1 in = 25.4 mm exactly, 1 ksi = 6.894 757 MPa.
test.describe("the calculator speaks the units chosen", () => {
  test.beforeEach(async ({ page }) => {
    await signIn(page, "engineer@demo.example");
    await openSite(page, WHARF);
    await page.goto(`${new URL(page.url()).pathname}/calculator`);
    await page.evaluate(() => window.localStorage.clear());
    await page.reload();
    await expect(page.getByRole("note", { name: "Caution" })).toBeVisible();
  });

  test("4000 mm becomes 157.48 in when the units change, and back", async ({ page }) => {
    await page.getByLabel("Method").selectOption("en1993");
    await page.getByLabel(/^SI/).check();
    await page.getByLabel(/^Length between restraints/).fill("4000");
    await page.getByLabel(/^Yield strength fy/).fill("355");
    await page.getByLabel(/^US/).check();
    await expect(page.getByLabel(/^Length between restraints \(ft-in\)/)).toHaveValue("157.48");
    // 355 MPa / 6.894757 = 51.488 ksi, under a ksi label
    await expect(page.getByLabel(/^Yield strength fy \(ksi\)/)).toHaveValue("51.488");
    await page.getByLabel(/^SI/).check();
    await expect(page.getByLabel(/^Length between restraints \(mm\)/)).toHaveValue("4000");
  });

  test("a reload keeps what was typed", async ({ page }) => {
    await page.getByLabel("Method").selectOption("en1993");
    await page.getByLabel(/^Length between restraints/).fill("3250");
    await page.getByLabel(/^Outside diameter/).fill("48.3");
    await page.reload();
    await expect(page.getByLabel("Method")).toHaveValue("en1993");
    await expect(page.getByLabel(/^Length between restraints/)).toHaveValue("3250");
    await expect(page.getByLabel(/^Outside diameter/)).toHaveValue("48.3");
  });

  test("an implausible value warns in the chosen units but is not refused", async ({ page }) => {
    await page.getByLabel("Method").selectOption("en1993");
    await page.getByLabel(/^US/).check();
    await page.getByLabel(/^Modulus E/).fill("470");
    // 470 ksi = 3241 MPa, far below steel's 190–215 GPa (EN 1993-1-1 §3.2.6: 210 GPa)
    await expect(page.locator("#e-warning")).toContainText("470 ksi is unusual");
  });

  test("a load refused in kN is explained in kN", async ({ page }) => {
    await page.getByLabel("Method").selectOption("en1065");
    await page.getByLabel(/^SI/).check();
    await page.getByLabel("EN 1065 class").selectOption("D");
    await page.getByLabel(/^Extension/).fill("2850");
    await page.getByLabel(/^Maximum extension/).fill("3350");
    await page.getByLabel(/^Load to compare/).fill("-5");
    await page.getByRole("button", { name: "Calculate" }).click();
    await expect(page.locator("#load-error")).toContainText("-5 kN");
    await expect(page.locator("#load-error")).not.toContainText("5000");
  });
});

test("a calculation starts from a library type and says which", async ({ page }) => {
  await signIn(page, "engineer@demo.example");
  await openSite(page, WHARF);
  await page.goto(`${new URL(page.url()).pathname}/calculator`);
  await page.evaluate(() => window.localStorage.clear());
  await page.reload();
  await page.getByLabel(/^SI/).check();
  await page.getByLabel("Method").selectOption("euler");
  const picker = page.getByLabel(/^Start from a library type/);
  await picker.selectOption({ label: "EN 1065 class D prop, 1.98–3.35 m" });
  await expect(page.getByLabel("Method")).toHaveValue("en1065");
  await expect(page.getByLabel("EN 1065 class")).toHaveValue("D");
  await expect(page.getByLabel(/^Maximum extension/)).toHaveValue("3350");
  await expect(page.getByText("Inputs filled from the library type “EN 1065 class D prop, 1.98–3.35 m”")).toBeVisible();
});
