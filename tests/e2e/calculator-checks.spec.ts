import { expect, test } from "@playwright/test";
import { openSite, signIn } from "./helpers";
import { ORCHARD, WHARF } from "../support/demo";

test("a designer follows the back-propping sequence and re-checks a leaning prop in the calculator", async ({ page }) => {
  await signIn(page, "designer@demo.example");
  await openSite(page, WHARF);
  await page.goto(`${new URL(page.url()).pathname}/calculator`);
  await expect(page.getByRole("note", { name: "Caution" })).toBeVisible();

  // Grundy & Kabaila (1963): two levels of props, largest slab load 2.25 × its own weight.
  await page.getByLabel("Method").selectOption("backprop-sequence");
  await expect(page.getByLabel(/^Length between restraints/)).toHaveCount(0);
  await page.getByLabel(/^Levels of props/).fill("2");
  await page.getByLabel(/^Slab self-weight/).fill("6");
  await page.getByRole("button", { name: "Calculate" }).click();
  await expect(page.getByTestId("max-slab-ratio")).toContainText("2.25");
  await expect(page.getByTestId("stages")).toContainText("slab 4 cast");
  await expect(page.getByRole("table", { name: "Working" })).toContainText("Grundy & Kabaila 1963");

  // An EN 1065 class D prop found 3° out of plumb fails (beyond the 1.5° its class rating assumes).
  await page.getByLabel("Method").selectOption("out-of-plumb");
  await page.getByLabel("Member", { exact: true }).selectOption("prop");
  await page.getByLabel(/^Extension/).fill("3000");
  await page.getByLabel("EN 1065 class").selectOption("D");
  await page.getByLabel(/^Maximum extension/).fill("3350");
  await page.getByLabel(/^Minimum extension/).fill("1980");
  await page.getByLabel(/^Out of plumb, angle/).fill("3");
  await page.getByLabel(/^Load to compare/).fill("10");
  await page.getByRole("button", { name: "Calculate" }).click();
  await expect(page.getByTestId("verdict")).toContainText("FAIL");
  await expect(page.getByText(/3° out of plumb/)).toBeVisible();
});

test("bearing under a base plate in US units names a missing field", async ({ page }) => {
  await signIn(page, "engineer@demo.example");
  await openSite(page, ORCHARD);
  await page.goto(`${new URL(page.url()).pathname}/calculator`);
  await page.getByLabel("Method").selectOption("base-bearing");
  await page.getByText("US (in, kip, ksi)").click();
  await page.getByLabel(/^Base plate width/).fill("6");
  await page.getByLabel(/^Load to compare/).fill("5");
  await page.getByRole("button", { name: "Calculate" }).click();
  await expect(page.locator("#basePlateL-error")).toContainText(/length of the base plate/i);
  await page.getByLabel(/^Base plate length/).fill("6");
  await page.getByLabel(/^Allowable bearing pressure/).fill("2000");
  await page.getByRole("button", { name: "Calculate" }).click();
  // 5 kip on 36 in² = 20 000 psf against 2 000 psf: FAIL.
  await expect(page.getByTestId("checks")).toContainText("Bearing pressure on the ground");
  await expect(page.getByTestId("verdict")).toContainText("FAIL");
});

test("the base of a leaning prop: the horizontal force in the working, and sliding with a friction coefficient typed", async ({ page }) => {
  await signIn(page, "designer@demo.example");
  await openSite(page, WHARF);
  await page.goto(`${new URL(page.url()).pathname}/calculator`);
  await page.getByLabel("Method").selectOption("base-bearing");
  await expect(page.getByRole("note", { name: "Caution" })).toBeVisible();
  await page.getByLabel(/^Base plate width/).fill("150");
  await page.getByLabel(/^Base plate length/).fill("150");
  await page.getByLabel(/^Allowable bearing pressure/).fill("100");
  await page.getByLabel(/^Load to compare/).fill("1");
  // An offset with no length is refused on the length, in words.
  await page.getByLabel(/^Prop out of plumb, offset/).fill("105");
  await page.getByRole("button", { name: "Calculate" }).click();
  await expect(page.locator("#length-error")).toContainText(/prop's length/);
  // 20° out with μ = 0.3: tan 20° = 0.364 > 0.3, so the base slides on friction alone whatever the load (statics).
  await page.getByLabel(/^Prop out of plumb, offset/).fill("");
  await page.getByLabel(/^Prop out of plumb, angle/).fill("20");
  await page.getByLabel(/^Friction coefficient/).fill("0.3");
  await page.getByRole("button", { name: "Calculate" }).click();
  await expect(page.getByTestId("checks")).toContainText("Sliding of the base on friction");
  await expect(page.getByTestId("verdict")).toContainText("FAIL");
  await expect(page.getByRole("table", { name: "Working" })).toContainText("H = N·sin θ");
  await expect(page.getByText(/would slide on friction alone/)).toBeVisible();
});
