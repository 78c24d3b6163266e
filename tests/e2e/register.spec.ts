import { expect, test, type Page } from "@playwright/test";
import { mainNav, openSite, signIn } from "./helpers";
import { WHARF } from "../support/demo";

const SITE = WHARF;

/** The element of that name in whichever layout this viewport shows (cards on a phone, a table on a desk). */
const visible = (page: Page, name: string) => page.getByRole("link", { name, exact: true }).locator("visible=true").first();

async function openRegister(page: Page) {
  await openSite(page, SITE);
  await mainNav(page).getByRole("link", { name: "Register" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Register" })).toBeVisible();
}

test("find a failing member in the register with filters that survive a reload, and open it", async ({ page }) => {
  // Four page loads and a reload in one journey: more than the default budget on a busy machine.
  test.slow();
  await signIn(page, "coordinator@demo.example");
  await openRegister(page);

  // Check: failing. On a phone the filters sit behind a button.
  const filtersButton = page.getByRole("button", { name: /^Filters/ });
  if (await filtersButton.isVisible()) await filtersButton.click();
  await page.getByLabel("Check").selectOption({ label: "Failing" });
  await page.getByLabel("Search by tag").fill("l2-p0");
  await expect(page).toHaveURL(/pass=false/);
  await expect(page).toHaveURL(/q=l2-p0/);

  const member = visible(page, "WXW-L2-P08");
  await expect(member).toBeVisible();
  // A passing member of the same bay is filtered out; the failing one says so in words.
  await expect(visible(page, "WXW-L2-P01")).toHaveCount(0);
  const entry = page.locator("[data-testid=member-row], [data-testid=member-card]").locator("visible=true").filter({ hasText: "WXW-L2-P08" });
  await expect(entry).toContainText("Fail");
  await expect(page.getByTestId("register-total")).toHaveText("1");

  // The address keeps the view.
  await page.reload();
  await expect(page.getByLabel("Search by tag")).toHaveValue("l2-p0");
  await expect(visible(page, "WXW-L2-P08")).toBeVisible();
  await expect(page.getByTestId("register-total")).toHaveText("1");

  await visible(page, "WXW-L2-P08").click();
  await expect(page).toHaveURL(/\/members\/[0-9a-f-]{36}$/);
  await expect(page.getByRole("heading", { level: 1 })).toContainText("WXW-L2-P08");
});

test("import a CSV with one bad row, read the report, then import it fixed", async ({ page }, info) => {
  test.slow();
  const stamp = `${info.project.name === "phone" ? "PH" : "DT"}${Date.now().toString(36).toUpperCase()}`;
  const rows = (extension: number) =>
    [
      "tag,zone,scheme,type,extension_mm,end_conditions,load_kn,spacing_x_mm,spacing_y_mm,notes",
      `E2E-${stamp}-1,"Level 1 slab, bays 1–4",TW-WXW-014,"EN 1065 class D prop, 1.98–3.35 m",2650,pinned-pinned,11,,,`,
      `E2E-${stamp}-2,"Level 1 slab, bays 1–4",TW-WXW-014,"EN 1065 class D prop, 1.98–3.35 m",${extension},pinned-pinned,11,,,`,
    ].join("\n");

  await signIn(page, "engineer@demo.example");
  await openRegister(page);
  await page.getByRole("link", { name: "Import CSV" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Import members" })).toBeVisible();

  await page.getByLabel("CSV file").setInputFiles({ name: "members.csv", mimeType: "text/csv", buffer: Buffer.from(rows(5200)) });
  await page.getByRole("button", { name: "Import" }).click();
  await expect(page.getByRole("alert").filter({ hasText: "Nothing was imported" })).toBeVisible();
  const problem = page.getByRole("table", { name: "Import problems" }).getByRole("row").nth(1);
  await expect(problem.getByRole("cell").nth(0)).toHaveText("3");
  await expect(problem.getByRole("cell").nth(1)).toHaveText("extension_mm");
  await expect(problem.getByRole("cell").nth(2)).toContainText("outside that range");

  await page.getByLabel("CSV file").setInputFiles({ name: "members.csv", mimeType: "text/csv", buffer: Buffer.from(rows(2700)) });
  await page.getByRole("button", { name: "Import" }).click();
  await expect(page.getByRole("status").filter({ hasText: "Imported 2 members as drafts" })).toBeVisible();
  await page.getByRole("link", { name: "Open the register" }).click();
  await page.getByLabel("Search by tag").fill(`E2E-${stamp}`);
  await expect(visible(page, `E2E-${stamp}-1`)).toBeVisible();
  await expect(visible(page, `E2E-${stamp}-2`)).toBeVisible();
});

test("the member count stays in view on later pages, and on a later page opened from its address", async ({ page }) => {
  test.slow();
  await signIn(page, "engineer@demo.example");
  await openRegister(page);
  await page.getByLabel("Rows per page").selectOption("25");
  // Only the demo's own level props: other journeys add members to this site while this one runs,
  // and the count this test follows must not move under it.
  const total = page.getByTestId("register-total");
  await expect(total).toHaveText(/^\d[\d,]*$/);
  const unfiltered = (await total.textContent())!;
  const filtersButton = page.getByRole("button", { name: /^Filters/ });
  if (await filtersButton.isVisible()) await filtersButton.click();
  await page.getByLabel("Search by tag").fill("WXW-L");
  await expect(page).toHaveURL(/q=WXW-L/i);
  // The site has members besides its level props, so the count changes once the filter applies.
  await expect(total).not.toHaveText(unfiltered);
  await expect(total).toHaveText(/^\d[\d,]*$/);
  const count = (await total.textContent())!;
  // More than one page of the demo site at 25 a page.
  expect(Number(count.replace(/,/g, ""))).toBeGreaterThan(25);

  await page.getByRole("button", { name: "Next →" }).click();
  await expect(page).toHaveURL(/cursor=/);
  await expect(page.getByRole("button", { name: "← Previous" })).toBeEnabled();
  await expect(total).toHaveText(count);

  // A kept link to page 2: the count is fetched for it.
  await page.reload();
  await expect(page.getByRole("button", { name: "← Previous" })).toBeEnabled();
  await expect(total).toHaveText(count);
});
