// From an EMPTY installation (STRUTWISE_DEMO=0, its own database and app — see scripts/test.mjs):
// first-run setup → a site → invite an engineer and a coordinator → each accepts from the link
// in the e-mail read out of the SMTP catcher → the engineer logs a member on a phone → the
// coordinator sees it on a desk, and a signed-out deep link to the member survives sign-in.
// Runs once, in the "empty" project; each person uses a phone or a desktop browser.
import { devices, expect, test, type Browser, type Page } from "@playwright/test";
import { INBOX_URL } from "../support/http";

const PHONE = { ...devices["Pixel 7"], defaultBrowserType: undefined };
const DESK = { viewport: { width: 1366, height: 850 } };
const stamp = Date.now().toString(36);
const admin = { name: "Marta Kowalczyk", email: `admin-${stamp}@brightwell.example`, password: "copper kettle signal 82" };
const engineer = { name: "Idris Bello", email: `engineer-${stamp}@brightwell.example`, password: "maple tunnel orbit 39" };
const coordinator = { name: "Sunniva Holt", email: `twc-${stamp}@brightwell.example`, password: "quartz meadow ferry 64" };

async function inviteLink(email: string) {
  const until = Date.now() + 30_000;
  while (Date.now() < until) {
    const mails = (await (await fetch(`${INBOX_URL}/api/email`)).json()) as { to: string[]; text: string }[];
    const mail = mails.find((m) => m.to.some((t) => t.toLowerCase().includes(email)));
    const link = mail?.text.match(/https?:\/\/\S+\/invite\/[A-Za-z0-9_-]{43}/)?.[0];
    if (link) return new URL(link).pathname;
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`no invitation e-mail reached ${email}`);
}

async function newPage(browser: Browser, kind: "phone" | "desk"): Promise<Page> {
  const baseURL = test.info().project.use.baseURL;
  const ctx = await browser.newContext({ ...(kind === "phone" ? PHONE : DESK), baseURL });
  return ctx.newPage();
}

async function invite(page: Page, who: { name: string; email: string }, role: string) {
  const form = page.getByTestId("invite");
  await form.getByLabel("E-mail").fill(who.email);
  await form.getByLabel("Name (optional)").fill(who.name);
  await form.getByLabel(role).check();
  await form.getByRole("button", { name: "Send the invitation" }).click();
  await expect(form.getByRole("status")).toContainText("Invitation sent");
  await expect(page.getByTestId("invitation").filter({ hasText: who.email })).toContainText("Waiting");
}

async function accept(page: Page, path: string, who: { name: string; password: string }, siteName: string) {
  await page.goto(path);
  await expect(page.getByRole("heading", { name: `Join ${siteName}` })).toBeVisible();
  await expect(page.getByLabel("Your name")).toHaveValue(who.name);
  await page.getByLabel("Choose a password").fill(who.password);
  await page.getByRole("button", { name: "Create my account" }).click();
  await expect(page.getByRole("heading", { level: 1, name: siteName })).toBeVisible();
}

test("a contractor goes from an empty installation to a working team", async ({ browser }) => {
  const siteName = "Brightwell Yard — Phase 1";
  const tag = `BWY-P-${stamp.slice(-4).toUpperCase()}`;

  // The organisation admin, on a desk: the empty installation opens the one-time setup.
  const a = await newPage(browser, "desk");
  await a.goto("/");
  await expect(a).toHaveURL(/\/setup$/);
  await a.getByLabel("Organisation name").fill("Brightwell Groundworks Ltd");
  await a.getByLabel("Your name").fill(admin.name);
  await a.getByLabel("Your e-mail").fill(admin.email);
  await a.getByLabel("Choose a password").fill("password1234");
  await a.getByRole("button", { name: "Create the organisation" }).click();
  await expect(a.getByRole("alert").first()).toBeVisible();
  await a.getByLabel("Choose a password").fill(admin.password);
  await a.getByRole("button", { name: "Create the organisation" }).click();
  await expect(a.getByRole("heading", { name: "Your sites" })).toBeVisible();
  await expect(a.getByText("Your organisation has no sites yet.")).toBeVisible();
  // Once an organisation exists the setup page is gone.
  expect((await a.request.get("/setup")).status()).toBe(404);

  await a.getByRole("link", { name: "Add a site" }).click();
  await a.getByLabel("Site name").fill(siteName);
  await a.getByLabel("Site code").fill("BWY");
  await a.getByLabel("Inspection interval (days)").fill("5");
  await a.getByRole("button", { name: "Add the site" }).click();
  await expect(a.getByRole("heading", { name: `People on ${siteName}` })).toBeVisible();
  const siteId = a.url().match(/\/sites\/([0-9a-f-]{36})\//)![1]!;

  // The library needs one type before anyone can log a member (the library screen is covered elsewhere).
  const type = await a.request.post(`/api/v1/sites/${siteId}/member-types`, {
    data: { name: "EN 1065 class D prop, 1.98–3.35 m", kind: "en1065-prop", params: { propClass: "D" }, minExtensionMm: 1980, maxExtensionMm: 3350 },
  });
  expect(type.status()).toBe(201);

  await invite(a, engineer, "Site engineer");
  await invite(a, coordinator, "Temporary works coordinator");

  // The engineer, on a phone, accepts from the e-mailed link and logs a member.
  const e = await newPage(browser, "phone");
  await accept(e, await inviteLink(engineer.email), engineer, siteName);
  await e.getByRole("navigation", { name: "Main" }).locator("visible=true").getByRole("link", { name: "Log member" }).click();
  await e.getByLabel("Tag (the code on its label)").fill(tag);
  await e.getByLabel("Member type").selectOption({ label: "EN 1065 class D prop, 1.98–3.35 m" });
  await e.getByLabel("Measured extension (mm)").fill("2400");
  await e.getByLabel("Working load (kN, unfactored)").fill("8");
  await e.getByRole("button", { name: "Save and check" }).click();
  await expect(e.getByTestId("check-verdict")).toBeVisible();

  // The coordinator, on a desk, accepts and finds the member in the register.
  const c = await newPage(browser, "desk");
  await accept(c, await inviteLink(coordinator.email), coordinator, siteName);
  await c.getByRole("navigation", { name: "Main" }).locator("visible=true").getByRole("link", { name: "Register" }).click();
  await expect(c.getByRole("link", { name: tag }).locator("visible=true").first()).toBeVisible();

  // The admin sees both people with their roles; no invitation is left waiting.
  await a.reload();
  await expect(a.getByTestId("person").filter({ hasText: engineer.email })).toContainText("Site engineer");
  await expect(a.getByTestId("person").filter({ hasText: coordinator.email })).toContainText("Temporary works coordinator");
  await expect(a.getByText("No invitation is waiting to be accepted.")).toBeVisible();

  // A member's link (as on its QR label) opened signed out comes back to that member after sign-in.
  await c.goto(`/sites/${siteId}/members?q=${encodeURIComponent(tag)}`);
  const memberHref = await c.getByRole("link", { name: tag }).first().getAttribute("href");
  expect(memberHref).toMatch(/\/members\/[0-9a-f-]{36}$/);
  const phone = await newPage(browser, "phone");
  await phone.goto(memberHref!);
  await expect(phone).toHaveURL(/\/sign-in\?callbackUrl=/);
  await phone.getByLabel("E-mail").fill(coordinator.email);
  await phone.getByLabel("Password").fill(coordinator.password);
  await phone.getByRole("button", { name: "Sign in" }).click();
  await expect(phone).toHaveURL(new RegExp(`${memberHref}$`));
  await expect(phone.getByRole("heading", { level: 1, name: tag })).toBeVisible();
});
