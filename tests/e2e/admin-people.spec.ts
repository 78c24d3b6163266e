// An organisation admin manages a site's people and settings, on a phone and on a desk:
// invite, see it waiting, resend, revoke; change a policy and see a bad value refused in words.
import { expect, test } from "@playwright/test";
import { openSite, signIn } from "./helpers";
import { ORCHARD } from "../support/demo";

test("an admin invites, resends and revokes, and edits the site's settings", async ({ page }, info) => {
  page.on("dialog", (d) => void d.accept());
  await signIn(page, "admin@demo.example");
  await openSite(page, ORCHARD);
  const siteId = new URL(page.url()).pathname.split("/")[2]!;

  await page.goto(`/sites/${siteId}/people`);
  await expect(page.getByRole("heading", { name: "People on Orchard Row Basement" })).toBeVisible();
  await expect(page.getByTestId("person").filter({ hasText: "engineer@demo.example" })).toContainText("Active");

  const email = `visitor-${info.project.name}-${Date.now().toString(36)}@demo.example`;
  const form = page.getByTestId("invite");
  // Without a role the form says what is missing and keeps what was typed.
  await form.getByLabel("E-mail").fill(email);
  await form.getByRole("button", { name: "Send the invitation" }).click();
  await expect(form.getByText("Choose at least one role.")).toBeVisible();
  await expect(form.getByLabel("E-mail")).toHaveValue(email);
  await form.getByLabel("Site manager").check();
  await form.getByRole("button", { name: "Send the invitation" }).click();
  await expect(form.getByRole("status")).toContainText("Invitation sent");

  const card = page.getByTestId("invitation").filter({ hasText: email });
  await expect(card).toContainText("Waiting");
  await expect(card).toContainText("Site manager");
  await card.getByRole("button", { name: "Resend" }).click();
  await expect(card).toContainText("sent 2 times");
  const box = await card.getByRole("button", { name: "Revoke" }).boundingBox();
  expect(box!.height).toBeGreaterThanOrEqual(44);
  await card.getByRole("button", { name: "Revoke" }).click();
  await expect(page.getByTestId("invitation").filter({ hasText: email })).toHaveCount(0);

  await page.goto(`/sites/${siteId}/settings`);
  const settings = page.getByTestId("site-settings");
  await settings.getByLabel("Inspection interval (days)").fill("0");
  await settings.getByRole("button", { name: "Save settings" }).click();
  await expect(settings.getByText("At least 1 day.")).toBeVisible();
  await expect(settings.getByLabel("Inspection interval (days)")).toHaveValue("0");
  await settings.getByLabel("Inspection interval (days)").fill("7");
  await settings.getByRole("button", { name: "Save settings" }).click();
  await expect(settings.getByRole("status")).toContainText("Settings saved.");
});
