import { devices, expect, test } from "@playwright/test";
import { mainNav, openSite, signIn } from "./helpers";
import { ORCHARD } from "../support/demo";
import { INBOX_URL } from "../support/http";

const SITE = ORCHARD;

type Mail = { to: string[]; subject: string; text: string };

test("an engineer's failed inspection on a phone reaches the site manager by e-mail and on the alerts page", async ({ browser }, testInfo) => {
  // Two people, two sign-ins and a real worker delivering the e-mail: more than the default minute on a busy machine.
  test.setTimeout(180_000);
  // Each project inspects its own member so the two runs never meet.
  const tag = testInfo.project.name === "phone" ? "ORB-RS-05" : "ORB-RS-06";
  const baseURL = testInfo.project.use.baseURL;

  // The site engineer, on a phone.
  const phone = await browser.newContext({ ...devices["Pixel 7"], baseURL });
  const page = await phone.newPage();
  await signIn(page, "engineer@demo.example");
  await openSite(page, SITE);
  const nav = mainNav(page);
  // Inspections is in the phone's bottom bar for everyone who records inspections.
  await nav.getByRole("link", { name: "Inspections" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Inspection round" })).toBeVisible();
  // Recently inspected members are in date, so show them all, then one tap on the member.
  await page.getByRole("link", { name: /Show all/ }).click();
  await page.getByRole("link", { name: `Inspect ${tag}` }).click();
  await expect(page.getByRole("heading", { level: 1, name: `Inspect ${tag}` })).toBeVisible();
  await expect(page.getByText("Site tolerance: out of plumb by no more than 10 mm.")).toBeVisible();

  for (const label of ["Plumb, within the site's tolerance", "Bearing and base or sole plate sound", "Head secure", "Correct pins and fixings fitted", "Lacing and bracing in place", "Load as expected"])
    await page.getByRole("group", { name: label }).locator("label").filter({ hasText: "Pass" }).click();
  const damage = page.getByRole("group", { name: "No damage or corrosion" });
  await damage.locator("label").filter({ hasText: "Fail" }).click();
  // A failed item needs a note: refused until it has one.
  await page.getByRole("button", { name: "Record inspection" }).click();
  await expect(damage.getByRole("alert")).toContainText("Say what is wrong");
  await damage.getByLabel(/Note/).fill("Strut dented by an excavator bucket");
  await expect(page.getByText("An item failed, so the member fails")).toBeVisible();
  await page.screenshot({ path: testInfo.outputPath("inspect-phone.png"), fullPage: true });
  await page.getByRole("button", { name: "Record inspection" }).click();
  await expect(page.getByRole("status").filter({ hasText: `Inspection recorded: ${tag} failed` })).toBeVisible();
  await expect(page.getByTestId("inspection-history-item").first()).toContainText("Failed");
  await phone.close();

  // The manager's e-mail arrives (the worker delivers the outbox).
  await expect
    .poll(
      async () => {
        const mails = (await (await fetch(`${INBOX_URL}/api/email`)).json()) as Mail[];
        return mails.filter((m) => m.to.includes("manager@demo.example") && m.subject === `${tag} failed its inspection`).length;
      },
      { timeout: 20_000, message: "the manager's e-mail about the failed inspection" },
    )
    .toBe(1);

  // The site manager, at a desk, sees it on the alerts page and marks it read.
  const desk = await browser.newContext({ viewport: { width: 1366, height: 850 }, baseURL });
  const mgr = await desk.newPage();
  await signIn(mgr, "manager@demo.example");
  await openSite(mgr, SITE);
  await mainNav(mgr).getByRole("link", { name: "Alerts" }).click();
  await expect(mgr.getByRole("heading", { level: 1, name: "Alerts" })).toBeVisible();
  const item = mgr.getByTestId("alert-item").filter({ hasText: `${tag} failed its inspection` });
  await expect(item).toHaveCount(1);
  await expect(item).toContainText("Failed inspection");
  await expect(item).toContainText("Unread");
  await expect(item).toContainText("Strut dented by an excavator bucket");
  await mgr.screenshot({ path: testInfo.outputPath("alerts-desktop.png"), fullPage: true });
  await item.getByRole("button", { name: /Mark read/ }).click();
  await expect(item).toContainText("Read");
  await expect(item).not.toContainText("Unread");
  await desk.close();
});
