import { expect, type Page } from "@playwright/test";
import { DEMO_PASSWORD } from "../support/http";

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByRole("heading", { name: "Your sites" })).toBeVisible();
}

export async function openSite(page: Page, name: string) {
  await page.getByRole("link", { name: new RegExp(name) }).first().click();
  await expect(page.getByRole("heading", { level: 1, name })).toBeVisible();
}

/** The main navigation that is visible at this viewport (bottom bar on a phone, side bar on desktop). */
export function mainNav(page: Page) {
  return page.getByRole("navigation", { name: "Main" }).locator("visible=true");
}
