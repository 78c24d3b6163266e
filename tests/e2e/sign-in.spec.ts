import { expect, test } from "@playwright/test";
import { mainNav, openSite, signIn, signInWithForm } from "./helpers";
import { WHARF } from "../support/demo";

const SITE = WHARF;

// What each demo role should find in a site's navigation.
const ROLE_NAV: Record<string, { has: string[]; lacks: string[] }> = {
  "admin@demo.example": { has: ["Overview", "Register", "Calculator", "Permits", "People", "Alerts", "Library"], lacks: ["Inspections", "Log member", "Schemes"] },
  "coordinator@demo.example": { has: ["Overview", "Register", "Calculator", "Permits", "Alerts", "Inspections", "Log member", "Schemes"], lacks: ["People", "Library"] },
  "engineer@demo.example": { has: ["Overview", "Register", "Calculator", "Permits", "Alerts", "Inspections", "Log member"], lacks: ["People", "Library", "Schemes"] },
  "supervisor@demo.example": { has: ["Overview", "Register", "Calculator", "Permits", "Alerts", "Inspections", "Log member"], lacks: ["People", "Library", "Schemes"] },
  "designer@demo.example": { has: ["Overview", "Register", "Calculator", "Permits", "Alerts", "Library", "Schemes"], lacks: ["People", "Inspections", "Log member"] },
  "manager@demo.example": { has: ["Overview", "Register", "Calculator", "Permits", "Alerts"], lacks: ["People", "Inspections", "Log member", "Library", "Schemes"] },
};

for (const [email, nav] of Object.entries(ROLE_NAV)) {
  test(`${email} signs in and sees the navigation for the role`, async ({ page }) => {
    await signInWithForm(page, email);
    await openSite(page, SITE);
    const navigation = mainNav(page);
    const more = navigation.getByRole("button", { name: "More" });
    if (await more.isVisible()) await more.click();
    for (const label of nav.has) await expect(navigation.getByRole("link", { name: label })).toBeVisible();
    for (const label of nav.lacks) await expect(navigation.getByRole("link", { name: label })).toHaveCount(0);
    // Live counts from the database and the caution are on the overview.
    await expect(page.getByTestId("member-count-loaded")).toContainText(/\d+/);
    await expect(page.getByRole("note", { name: "Caution" })).toContainText("competent temporary works designer");
  });
}

test("a wrong password shows a clear error and stays on the sign-in page", async ({ page }) => {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill("engineer@demo.example");
  await page.getByLabel("Password").fill("not-the-password");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByRole("alert").filter({ hasText: "do not match an account" })).toBeVisible();
  await expect(page).toHaveURL(/\/sign-in/);
});

test("a signed-out visitor is sent to sign in, and comes back after", async ({ page }) => {
  await page.goto("/sites");
  await expect(page).toHaveURL(/\/sign-in\?callbackUrl=%2Fsites/);
});

test("the API refuses a request without a session with 401", async ({ request }) => {
  const r = await request.get("/api/v1/sites");
  expect(r.status()).toBe(401);
  expect(await r.json()).toMatchObject({ error: { code: "unauthorized" } });
});

test("another organisation's admin gets 404 for a demo site", async ({ page, browser }) => {
  await signIn(page, "manager@demo.example");
  await openSite(page, SITE);
  const siteUrl = new URL(page.url()).pathname;
  const other = await browser.newContext();
  const otherPage = await other.newPage();
  await signIn(otherPage, "admin@other.example");
  await expect(otherPage.getByRole("link", { name: /Tanner's Yard/ })).toBeVisible();
  await expect(otherPage.getByRole("link", { name: new RegExp(SITE) })).toHaveCount(0);
  const res = await otherPage.goto(siteUrl);
  expect(res?.status()).toBe(404);
  const api = await otherPage.request.get(`/api/v1${siteUrl}`);
  expect(api.status()).toBe(404);
  await other.close();
});

test("signing out ends the session", async ({ page }) => {
  await signIn(page, "supervisor@demo.example");
  await page.goto("/sign-out");
  await page.getByRole("button", { name: "Sign out now" }).click();
  await expect(page).toHaveURL(/\/sign-in/);
  const r = await page.request.get("/api/v1/me");
  expect(r.status()).toBe(401);
});
