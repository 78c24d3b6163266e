import { expect, type BrowserContext, type Page } from "@playwright/test";
import { DEMO_PASSWORD } from "../support/http";

type Cookies = Awaited<ReturnType<BrowserContext["cookies"]>>;

/**
 * Session cookies of each person signed in through the form by this worker: a later test starts
 * signed in as that person without the form's page load and password hash (the suite's commonest
 * step). A session that has ended since (signed out, password changed) sends /sites to the sign-in
 * page, and the form is used again. Tests of signing in itself use signInWithForm.
 */
const sessionsKept = new Map<string, Cookies>();

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  const kept = password === DEMO_PASSWORD ? sessionsKept.get(email) : undefined;
  if (kept) {
    await page.context().addCookies(kept);
    await page.goto("/sites");
    if (new URL(page.url()).pathname === "/sites") {
      await expect(page.getByRole("heading", { name: "Your sites" })).toBeVisible();
      return;
    }
    sessionsKept.delete(email);
    await page.context().clearCookies();
  }
  await signInWithForm(page, email, password);
  if (password === DEMO_PASSWORD) sessionsKept.set(email, await page.context().cookies());
}

/** Signs in through the sign-in form every time. */
export async function signInWithForm(page: Page, email: string, password = DEMO_PASSWORD) {
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
