// QR labels on a part-used sheet: the register's sheet picture picks the first free label, and the
// label sheet downloaded for the chosen members — or for everything the filters show — starts there.
import { expect, test, type Page } from "@playwright/test";
import { mainNav, openSite, signIn } from "./helpers";
import { WHARF } from "../support/demo";

async function openRegister(page: Page) {
  await signIn(page, "supervisor@demo.example");
  await openSite(page, WHARF);
  await mainNav(page).getByRole("link", { name: "Register" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Register" })).toBeVisible();
  const filtersButton = page.getByRole("button", { name: /^Filters/ });
  if (await filtersButton.isVisible()) await filtersButton.click();
  await page.getByLabel("Search by tag").fill("wxw-l2-p0");
  await expect(page).toHaveURL(/q=wxw-l2-p0/);
}

test("choose the first free label of a part-used sheet and download the labels from there", async ({ page }) => {
  test.slow();
  await openRegister(page);
  const group = page.getByRole("group", { name: "Chosen members" });

  // The sheet picture: 21 labels, 3 across; choosing label 5 shades 1–4 as used.
  await group.getByTestId("label-start-summary").click();
  await expect(group.getByRole("radio")).toHaveCount(21);
  await expect(group.getByRole("radio", { name: "Label 1", exact: true })).toBeChecked();
  await group.locator("label", { has: page.getByRole("radio", { name: "Label 5", exact: true }) }).click();
  await expect(group.getByRole("radio", { name: "Label 5", exact: true })).toBeChecked();
  await expect(group.getByTestId("label-start-summary")).toHaveText("Part-used sheet: start at label 5");

  // Nothing chosen: the filtered set's link carries the start, and answers with a PDF.
  const link = group.getByRole("link", { name: /^Labels for all/ });
  const href = await link.getAttribute("href");
  expect(href).toMatch(/[?&]start=5(&|$)/);
  expect(href).toMatch(/q=wxw-l2-p0/);
  const res = await page.request.get(href!);
  expect(res.status()).toBe(200);
  expect(res.headers()["content-type"]).toBe("application/pdf");
  expect((await res.body()).subarray(0, 5).toString()).toBe("%PDF-");

  // Two members chosen: the sheet for them is asked for from label 5 and comes back as a PDF download.
  for (const tag of ["WXW-L2-P01", "WXW-L2-P05"]) await page.getByRole("checkbox", { name: `Choose ${tag}`, exact: true }).locator("visible=true").check();
  await expect(page.getByTestId("selection-count")).toHaveText("2 chosen:");
  await expect(group.getByTestId("label-start-summary")).toHaveText("Part-used sheet: start at label 5");
  const [request, response, download] = await Promise.all([
    page.waitForRequest((r) => r.url().endsWith("/labels") && r.method() === "POST"),
    page.waitForResponse((r) => r.url().endsWith("/labels") && r.request().method() === "POST"),
    page.waitForEvent("download"),
    group.getByRole("button", { name: "QR labels for 2" }).click(),
  ]);
  const body = request.postDataJSON() as { memberIds: string[]; start: number };
  expect(body.start).toBe(5);
  expect(body.memberIds).toHaveLength(2);
  expect(response.status()).toBe(200);
  expect(response.headers()["content-type"]).toBe("application/pdf");
  expect(download.suggestedFilename()).toBe("labels-2.pdf");
});
