// The register on a desk and on paper: sorting by its column headers (a menu on a phone), fitting
// a 1366 px screen with the columns chosen kept in the address, printing the register and the
// inspection round, and a permit request started from the members chosen in the register.
import { expect, test, type Page } from "@playwright/test";
import { mainNav, openSite, signIn } from "./helpers";
import { WHARF } from "../support/demo";

const SITE = WHARF;

async function openRegister(page: Page, email = "coordinator@demo.example") {
  await signIn(page, email);
  await openSite(page, SITE);
  await mainNav(page).getByRole("link", { name: "Register" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Register" })).toBeVisible();
}

/** The members shown, in order, in whichever layout this viewport uses. */
const entries = (page: Page) => page.locator("[data-testid=member-row], [data-testid=member-card]").locator("visible=true");

/** Utilisation figures of the rows shown, top to bottom (a member with no check reads as Infinity). */
async function utilisations(page: Page): Promise<number[]> {
  const texts = await entries(page).allInnerTexts();
  return texts.map((t) => {
    const m = /(\d+) %/.exec(t);
    return m ? Number(m[1]) : Number.POSITIVE_INFINITY;
  });
}

async function sortBy(page: Page, desk: boolean, column: "Utilisation" | "Extension" | "Tag", phoneChoice: string) {
  if (desk) await page.getByRole("columnheader", { name: column }).getByRole("button").click();
  else await page.getByLabel("Sort").selectOption({ label: phoneChoice });
}

test("sort the register by its column headers on a desk (a menu on a phone), and the order survives a reload", async ({ page }, info) => {
  test.slow();
  const desk = info.project.name === "desktop";
  await openRegister(page);
  await expect(entries(page).first()).toBeVisible();

  // Utilisation, lowest first, then highest first: the server's keyset order, not the page's.
  await sortBy(page, desk, "Utilisation", "Utilisation, lowest first");
  await expect(page).toHaveURL(/sort=utilisation/);
  if (desk) {
    await expect(page.getByRole("columnheader", { name: "Utilisation" })).toHaveAttribute("aria-sort", "ascending");
    await expect(page.getByRole("columnheader", { name: "Tag" })).toHaveAttribute("aria-sort", "none");
  }
  await expect.poll(async () => {
    const u = await utilisations(page);
    return u.length > 2 && u.every((v, i) => i === 0 || v >= u[i - 1]!);
  }).toBe(true);

  await sortBy(page, desk, "Utilisation", "Utilisation, highest first");
  await expect(page).toHaveURL(/sort=utilisation&dir=desc|dir=desc&sort=utilisation/);
  if (desk) await expect(page.getByRole("columnheader", { name: "Utilisation" })).toHaveAttribute("aria-sort", "descending");
  await expect.poll(async () => {
    const u = await utilisations(page);
    return u.length > 2 && u.every((v, i) => i === 0 || v <= u[i - 1]!);
  }).toBe(true);
  // The failing member of Level 2 (19 kN on a class B prop) is among the most utilised.
  const top = (await utilisations(page))[0]!;
  expect(top).toBeGreaterThan(100);

  await page.reload();
  if (desk) await expect(page.getByRole("columnheader", { name: "Utilisation" })).toHaveAttribute("aria-sort", "descending");
  else await expect(page.getByLabel("Sort")).toHaveValue("utilisation:desc");
  await expect.poll(async () => (await utilisations(page))[0]).toBe(top);

  // Extension: every other keyset sort is reachable the same way.
  await sortBy(page, desk, "Extension", "Extension, shortest first");
  await expect(page).toHaveURL(/sort=extension/);
  if (desk) await expect(page.getByRole("columnheader", { name: "Extension" })).toHaveAttribute("aria-sort", "ascending");
});

test("the register fits the screen without scrolling sideways, and the columns chosen stay in the address", async ({ page }, info) => {
  test.slow();
  const desk = info.project.name === "desktop";
  await openRegister(page);
  await expect(entries(page).first()).toBeVisible();

  const sideways = () =>
    page.evaluate(() => {
      const doc = document.documentElement;
      const table = document.querySelector<HTMLElement>("[data-testid=register-table]");
      const wide = table && table.offsetParent !== null ? table.scrollWidth - table.clientWidth : 0;
      return Math.max(doc.scrollWidth - doc.clientWidth, wide);
    });
  expect(await sideways()).toBeLessThanOrEqual(0);
  if (!desk) return; // A phone shows cards; the column choice is a desk's.

  // What a coordinator needs is there by default.
  for (const name of ["Tag", "Status", "Check", "Utilisation", "Load", "Capacity", "Extension", "Type", "Zone", "Updated"])
    await expect(page.getByRole("columnheader", { name, exact: true })).toBeVisible();
  await expect(page.getByRole("columnheader", { name: "Scheme", exact: true })).toHaveCount(0);

  // Swap Type for Scheme; the choice is in the address and survives a reload.
  await page.getByText(/^Columns \(/).click();
  const chooser = page.getByTestId("column-chooser");
  await chooser.getByLabel("Type").uncheck();
  await chooser.getByLabel("Scheme").check();
  await expect(page).toHaveURL(/cols=load%2Ccapacity%2Czone%2Cscheme%2Cupdated|cols=load,capacity,zone,scheme,updated/);
  await expect(page.getByRole("columnheader", { name: "Scheme", exact: true })).toBeVisible();
  await expect(page.getByRole("columnheader", { name: "Type", exact: true })).toHaveCount(0);
  expect(await sideways()).toBeLessThanOrEqual(0);

  await page.reload();
  await expect(page.getByRole("columnheader", { name: "Scheme", exact: true })).toBeVisible();
  await expect(page.getByRole("columnheader", { name: "Type", exact: true })).toHaveCount(0);
  // A filter change keeps the columns.
  await page.getByLabel("Search by tag").fill("wxw-l1");
  await expect(page).toHaveURL(/q=wxw-l1/);
  await expect(page).toHaveURL(/cols=/);
  await expect(page.getByRole("columnheader", { name: "Scheme", exact: true })).toBeVisible();
});

test("the register and the inspection round print without navigation, buttons or filters", async ({ page }) => {
  test.slow();
  await openRegister(page);
  await expect(entries(page).first()).toBeVisible();
  await page.emulateMedia({ media: "print" });
  // On paper the register is the table, whatever the screen was.
  await expect(page.getByTestId("register-table")).toBeVisible();
  await expect(page.getByTestId("member-row").first()).toBeVisible();
  await expect(page.getByTestId("member-card").first()).toBeHidden();
  await expect(page.getByRole("navigation", { name: "Main" }).locator("visible=true")).toHaveCount(0);
  await expect(page.getByLabel("Search by tag")).toBeHidden();
  await expect(page.getByRole("button", { name: "Print this page" })).toBeHidden();
  await expect(page.getByRole("heading", { level: 1, name: "Register" })).toBeVisible();

  await page.emulateMedia({ media: "screen" });
  await page.goto(page.url().replace(/\/members(\?.*)?$/, "/inspections"));
  await expect(page.getByRole("heading", { level: 1, name: "Inspection round" })).toBeVisible();
  const item = page.getByTestId("round-item").first();
  await expect(item.getByRole("link", { name: /^Inspect / })).toBeVisible();
  await page.emulateMedia({ media: "print" });
  await expect(item.getByRole("link", { name: /^Inspect / })).toBeHidden();
  await expect(item.getByText(/Initials/)).toBeVisible();
  await expect(page.getByRole("form", { name: "Filter the round" })).toBeHidden();
  await expect(page.getByRole("navigation", { name: "Main" }).locator("visible=true")).toHaveCount(0);
});

test("request a permit for the members chosen in the register", async ({ page }) => {
  test.slow();
  await openRegister(page, "engineer@demo.example");
  const filtersButton = page.getByRole("button", { name: /^Filters/ });
  if (await filtersButton.isVisible()) await filtersButton.click();
  await page.getByLabel("Search by tag").fill("wxw-l2-p0");
  await expect(page).toHaveURL(/q=wxw-l2-p0/);
  // P01 (inspection overdue) and P05 (no photo yet) can be asked for; P08 fails its check.
  for (const tag of ["WXW-L2-P01", "WXW-L2-P05", "WXW-L2-P08"]) await page.getByRole("checkbox", { name: `Choose ${tag}`, exact: true }).locator("visible=true").check();
  await expect(page.getByTestId("selection-count")).toHaveText("3 chosen:");

  await page.getByRole("link", { name: "Request a permit" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Request a permit" })).toBeVisible();
  await expect(page).toHaveURL(/\/permits\/new\?memberIds=[0-9a-f-]{36}(,[0-9a-f-]{36}){2}$/);
  await expect(page.getByRole("radio", { name: /Permit to load/ })).toBeChecked();
  await expect(page.getByTestId("prefill-note")).toContainText("2 of the 3 members chosen in the register are in this request.");
  await expect(page.getByTestId("prefill-note")).toContainText(/Left out: WXW-L2-P08 \(Fails its check/);
  const members = page.getByRole("list", { name: "Members" });
  await expect(members.getByRole("checkbox", { name: /WXW-L2-P01/ })).toBeChecked();
  await expect(members.getByRole("checkbox", { name: /WXW-L2-P05/ })).toBeChecked();
  await expect(members.getByRole("checkbox", { name: /WXW-L2-P08/ })).not.toBeChecked();
  await expect(page.getByText(/^2 chosen · \d+ shown$/)).toBeVisible();
});
