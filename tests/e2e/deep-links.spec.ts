// A QR label or e-mail link opened signed out comes back, after sign-in, to exactly that page
// (with the ?tag= prefill); a callback pointing at another site is ignored. Phone and desktop.
import { expect, test, type Page } from "@playwright/test";
import { openSite, signIn } from "./helpers";
import { DEMO_PASSWORD } from "../support/http";
import { WHARF } from "../support/demo";

async function signInHere(page: Page, email: string) {
  await expect(page).toHaveURL(/\/sign-in/);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
}

test("a scanned label's log link keeps its tag through sign-in", async ({ page, context }) => {
  await signIn(page, "engineer@demo.example");
  await openSite(page, WHARF);
  const siteId = new URL(page.url()).pathname.split("/")[2]!;
  await context.clearCookies();

  const tag = `WXB-QR-${Date.now().toString(36).slice(-4).toUpperCase()}`;
  await page.goto(`/sites/${siteId}/members/new?tag=${tag}`);
  await signInHere(page, "engineer@demo.example");
  await expect(page.getByRole("heading", { name: "Log a member" })).toBeVisible();
  expect(new URL(page.url()).pathname + new URL(page.url()).search).toBe(`/sites/${siteId}/members/new?tag=${tag}`);
  await expect(page.getByLabel("Tag (the code on its label)")).toHaveValue(tag);
});

test("a callback to another site is ignored: sign-in lands on the sites list", async ({ page }) => {
  await page.goto(`/sign-in?callbackUrl=${encodeURIComponent("https://evil.example/steal")}`);
  await signInHere(page, "manager@demo.example");
  await expect(page.getByRole("heading", { name: "Your sites" })).toBeVisible();
  expect(new URL(page.url()).origin).toBe(new URL(test.info().project.use.baseURL ?? "http://127.0.0.1:3100").origin);
});
