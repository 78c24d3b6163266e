// The label scanner, phone and desktop. A headless browser has no camera, so the page must say so
// and offer the fallbacks; the photo fallback reads a real QR image (the label's own code) with the
// same decoder as the camera, then follows it — only to this app's own addresses.
import { expect, test, type Page } from "@playwright/test";
import { mainNav, openSite, signIn } from "./helpers";
import { WHARF } from "../support/demo";
import { qrPath } from "../../lib/pdf/qr";

/** The page's alerts, leaving out the framework's route announcer (also role="alert"). */
const alert = (page: Page) => page.getByRole("alert").and(page.locator(":not(#__next-route-announcer__)"));

async function memberOnWharf(page: Page, tag: string) {
  const sites = (await (await page.request.get("/api/v1/sites")).json()) as { items: { id: string; name: string }[] };
  const site = sites.items.find((s) => s.name === WHARF)!;
  const rows = (await (await page.request.get(`/api/v1/sites/${site.id}/members?q=${tag}`)).json()) as { items: { id: string; tag: string }[] };
  return { siteId: site.id, memberId: rows.items.find((r) => r.tag === tag)!.id };
}

/** Opens the scanner the way a person would: the bottom bar's Scan button on a phone, the side bar's link on a desk. */
async function openScanner(page: Page, isPhone: boolean) {
  const nav = mainNav(page);
  // On a phone the bar's Scan button (its accessible name is the item's); on a desk the side bar's link.
  await nav.getByRole("link", { name: "Scan a label" }).click();
  if (isPhone) await expect(page.getByRole("navigation", { name: "Main" }).locator("visible=true").getByRole("link", { name: "Scan a label" })).toHaveText("Scan");
  await expect(page.getByRole("heading", { level: 1, name: "Scan a label" })).toBeVisible();
}

/**
 * A PNG "photo" of the QR code the label sheet prints for `text` (the label's own vector path,
 * drawn at 8 px a module in the browser's canvas); with no text, a plain white picture.
 */
async function labelPhoto(page: Page, text: string | null) {
  const { d, size } = text ? qrPath(text) : { d: "", size: 25 };
  const dataUrl = await page.evaluate(
    ({ d, size, px }) => {
      const c = document.createElement("canvas");
      c.width = c.height = size * px;
      const ctx = c.getContext("2d")!;
      ctx.fillStyle = "#fff";
      ctx.fillRect(0, 0, c.width, c.height);
      ctx.scale(px, px);
      ctx.fillStyle = "#000";
      if (d) ctx.fill(new Path2D(d));
      return c.toDataURL("image/png");
    },
    { d, size, px: 8 },
  );
  return { name: "label.png", mimeType: "image/png", buffer: Buffer.from(dataUrl.split(",")[1]!, "base64") };
}

test("without a camera the scanner says so, and a typed tag opens the member (any case) or the log form with the tag filled in", async ({ page }, testInfo) => {
  const isPhone = testInfo.project.name === "phone";
  await signIn(page, "engineer@demo.example");
  await openSite(page, WHARF);
  await openScanner(page, isPhone);
  // No camera in a headless browser: a clear message and the fallbacks, never a blank box.
  await expect(page.getByTestId("camera-off")).toContainText(/Type the tag printed on the label/);
  await expect(page.getByLabel("Or choose a photo of the label")).toBeVisible();

  // An empty box is refused with the reason.
  await page.getByRole("button", { name: "Open" }).click();
  await expect(alert(page)).toContainText("Type the tag printed on the label");

  await page.getByLabel("Or type the tag on the label").fill("wxw-l2-p05");
  await page.getByRole("button", { name: "Open" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "WXW-L2-P05" })).toBeVisible();
  expect(new URL(page.url()).pathname).toMatch(/^\/sites\/[0-9a-f-]{36}\/members\/[0-9a-f-]{36}$/);

  // A tag not on the site yet: the log form, with the tag filled in.
  await openScanner(page, isPhone);
  const tag = `SCAN-${testInfo.project.name}-${Date.now().toString(36)}`.toUpperCase();
  await page.getByLabel("Or type the tag on the label").fill(tag);
  await page.getByRole("button", { name: "Open" }).click();
  await expect(page.getByRole("heading", { name: "Log a member" })).toBeVisible();
  await expect(page.getByLabel("Tag (the code on its label)")).toHaveValue(tag);
  expect(new URL(page.url()).search).toBe(`?tag=${tag}`);
});

test("a photo of a label opens its member; a code pointing to another site is refused and nothing opens", async ({ page }) => {
  await signIn(page, "supervisor@demo.example");
  const { siteId, memberId } = await memberOnWharf(page, "WXW-L2-P01");
  await page.goto(`/sites/${siteId}/scan`);
  await expect(page.getByRole("heading", { level: 1, name: "Scan a label" })).toBeVisible();
  const origin = new URL(page.url()).origin;

  await page.getByLabel("Or choose a photo of the label").setInputFiles(await labelPhoto(page, `https://evil.example/sites/${siteId}/members/${memberId}`));
  await expect(alert(page)).toContainText("This code points to evil.example, not to Strutwise here, so it was not opened.");
  expect(new URL(page.url()).pathname).toBe(`/sites/${siteId}/scan`);

  // A picture with no code in it says so.
  await page.getByLabel("Or choose a photo of the label").setInputFiles(await labelPhoto(page, null));
  await expect(alert(page)).toContainText("No QR code could be read in that photo");

  await page.getByLabel("Or choose a photo of the label").setInputFiles(await labelPhoto(page, `${origin}/sites/${siteId}/members/${memberId}`));
  await expect(page.getByRole("heading", { level: 1, name: "WXW-L2-P01" })).toBeVisible();
  expect(new URL(page.url()).pathname).toBe(`/sites/${siteId}/members/${memberId}`);
});

test("someone who may not log members is told a typed tag is not on the site", async ({ page }) => {
  await signIn(page, "manager@demo.example");
  const { siteId } = await memberOnWharf(page, "WXW-L2-P01");
  await page.goto(`/sites/${siteId}/scan`);
  await page.getByLabel("Or type the tag on the label").fill("NOPE-404");
  await page.getByRole("button", { name: "Open" }).click();
  await expect(alert(page)).toContainText(`No member tagged NOPE-404 is on ${WHARF}`);
});

test("Inspections and the scanner are in the navigation of those who inspect: the phone's bottom bar, fitting 412 px, or the desk's side bar", async ({ page }, testInfo) => {
  const isPhone = testInfo.project.name === "phone";
  await signIn(page, "engineer@demo.example");
  await openSite(page, WHARF);
  const nav = mainNav(page);
  for (const label of ["Overview", "Log member", "Inspections", "Register", "Scan a label"]) await expect(nav.getByRole("link", { name: label })).toBeVisible();
  if (isPhone) {
    // Four items, the scan button and More, in one row that fits the phone.
    await expect(nav.getByRole("button", { name: "More" })).toBeVisible();
    await expect(nav.getByRole("link", { name: "Calculator" })).toHaveCount(0);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(412);
  }
  await nav.getByRole("link", { name: "Inspections" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Inspection round" })).toBeVisible();
  await expect(nav.getByRole("link", { name: "Inspections" })).toHaveAttribute("aria-current", "page");
});

test("a site manager, who does not inspect, has no Inspections link but can scan", async ({ page }) => {
  await signIn(page, "manager@demo.example");
  await openSite(page, WHARF);
  const nav = mainNav(page);
  const more = nav.getByRole("button", { name: "More" });
  if (await more.isVisible()) await more.click();
  await expect(nav.getByRole("link", { name: "Alerts" })).toBeVisible();
  await expect(nav.getByRole("link", { name: "Inspections" })).toHaveCount(0);
  await expect(nav.getByRole("link", { name: "Scan a label" })).toBeVisible();
});
