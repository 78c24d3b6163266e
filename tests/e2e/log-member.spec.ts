// On a phone: an engineer logs a prop with a photo, survives a reload mid-entry, sees the check
// at once and opens the member page. Runs in the phone project only (see playwright.config.ts).
import { expect, test } from "@playwright/test";
import sharp from "sharp";
import { mainNav, openSite, signIn } from "./helpers";
import { WHARF } from "../support/demo";

test("an engineer logs a member with a photo and sees its check", async ({ page }) => {
  const tag = `E2E-${Date.now().toString(36).toUpperCase()}`;
  const photo = await sharp({ create: { width: 640, height: 480, channels: 3, background: "#7a6a5a" } }).jpeg().toBuffer();

  await signIn(page, "engineer@demo.example");
  await openSite(page, WHARF);
  await mainNav(page).getByRole("link", { name: "Log member" }).click();
  await expect(page.getByRole("heading", { name: "Log a member" })).toBeVisible();

  await page.getByLabel("Tag (the code on its label)").fill(tag);
  await page.getByLabel("Zone").selectOption({ label: "Level 2 slab, bays 1–4" });
  await page.getByLabel("Scheme").selectOption({ label: "TW-WXW-014 — Back-propping L1 under L2 pour" });
  await page.getByLabel("Member type").selectOption({ label: "EN 1065 class D prop, 1.98–3.35 m" });
  await expect(page.getByText(/Extends 1980 mm to 3350 mm/)).toBeVisible();
  await page.getByLabel("Measured extension (mm)").fill("2650");

  // Load from the slab: the derived load and its breakdown show before saving.
  await page.getByLabel("From the slab").check();
  await page.getByLabel("As-built spacing X (mm)").fill("1200");
  await page.getByLabel("As-built spacing Y (mm)").fill("1200");
  await expect(page.getByTestId("slab-load-preview")).toContainText("11.16 kN");

  await page.getByLabel("Take or add photos").setInputFiles({ name: "prop.jpg", mimeType: "image/jpeg", buffer: photo });
  await expect(page.getByTestId("photo-item")).toHaveAttribute("data-status", "ready", { timeout: 20_000 });

  // A reload (a dropped connection, a locked phone) loses nothing.
  await page.reload();
  await expect(page.getByText("Your unsaved entry was restored.")).toBeVisible();
  await expect(page.getByLabel("Tag (the code on its label)")).toHaveValue(tag);
  await expect(page.getByLabel("As-built spacing X (mm)")).toHaveValue("1200");
  await expect(page.getByTestId("photo-item")).toHaveAttribute("data-status", "ready");

  await page.getByRole("button", { name: "Save and check" }).click();
  const result = page.getByTestId("check-result");
  await expect(result).toBeVisible();
  await expect(page.getByTestId("check-verdict")).toContainText("PASS");
  await expect(page.getByTestId("check-capacity")).toContainText(/\d+(\.\d+)? kN/);
  await expect(page.getByTestId("check-utilisation")).toContainText(/\d+ %/);
  await expect(result).toContainText("11.16 kN");

  await page.getByRole("link", { name: "Open the member page" }).click();
  await expect(page.getByRole("heading", { level: 1, name: tag })).toBeVisible();
  await expect(page.getByRole("note", { name: "Caution" })).toBeVisible();
  await expect(page.getByRole("list", { name: "Photos of this member" }).getByRole("img")).toHaveCount(1);
  await expect(page.getByRole("heading", { name: "Check history (1)" })).toBeVisible();
  await expect(page.getByRole("img", { name: /Capacity against extension/ })).toBeVisible();
  await expect(page.getByRole("list", { name: "Audit history" })).toContainText("Logged by Tomasz Wilk");

  // The draft is gone once saved.
  await page.goto(page.url().replace(/\/members\/[^/]+$/, "/members/new"));
  await expect(page.getByText("Your unsaved entry was restored.")).toHaveCount(0);
  await expect(page.getByLabel("Tag (the code on its label)")).toHaveValue("");
});
