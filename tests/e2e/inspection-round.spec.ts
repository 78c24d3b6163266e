// Walking the inspection round on a phone and at a desk: "All satisfactory" on the checklist, then
// straight on to the next member due; and the register's bulk "all satisfactory" for chosen members.
// Each run makes members of its own in a zone of its own, so the round it walks is its own.
import { expect, test, type Page } from "@playwright/test";
import { signIn } from "./helpers";
import { ORCHARD } from "../support/demo";

/** A zone of this run's own on Orchard Row with `n` submitted members in it (copied from a demo member, new tags). */
async function roundOfOwn(page: Page, prefix: string, n: number) {
  const sites = (await (await page.request.get("/api/v1/sites")).json()) as { items: { id: string; name: string }[] };
  const site = sites.items.find((s) => s.name === ORCHARD)!;
  const zone = await page.request.post(`/api/v1/sites/${site.id}/zones`, { data: { name: `Round ${prefix}` } });
  expect(zone.status(), await zone.text()).toBe(201);
  const zoneBody = (await zone.json()) as { zone?: { id: string }; id?: string };
  const zoneId = zoneBody.zone?.id ?? zoneBody.id!;
  const rows = (await (await page.request.get(`/api/v1/sites/${site.id}/members?q=ORB-RS-01`)).json()) as { items: { id: string }[] };
  const demo = (await (await page.request.get(`/api/v1/members/${rows.items[0]!.id}`)).json()) as {
    member: { memberTypeId: string; schemeId: string | null; extensionMm: number; endConditions: string; loadN: number };
  };
  const { memberTypeId, schemeId, extensionMm, endConditions, loadN } = demo.member;
  const tags: string[] = [];
  for (let i = 1; i <= n; i++) {
    const tag = `${prefix}-${i}`;
    const created = await page.request.post(`/api/v1/sites/${site.id}/members`, {
      data: { tag, memberTypeId, zoneId, schemeId, extensionMm, endConditions, loadSource: "direct", loadN, submit: true },
    });
    expect(created.status(), await created.text()).toBe(201);
    tags.push(tag);
  }
  return { siteId: site.id, zoneId, tags };
}

const prefixFor = (what: string, project: string) => `E2E-${what}-${project}-${Date.now().toString(36)}`.toUpperCase();

test("All satisfactory marks every item, a failed item still needs its note, and saving goes on to the next member due, then back to the round, complete", async ({ page }, testInfo) => {
  test.setTimeout(120_000);
  await signIn(page, "coordinator@demo.example");
  const { siteId, zoneId, tags } = await roundOfOwn(page, prefixFor("RND", testInfo.project.name), 2);
  const [first, second] = tags as [string, string];

  await page.goto(`/sites/${siteId}/inspections?zone=${zoneId}`);
  await expect(page.getByRole("heading", { level: 1, name: "Inspection round" })).toBeVisible();
  await page.getByRole("link", { name: `Inspect ${first}` }).click();
  await expect(page.getByRole("heading", { level: 1, name: `Inspect ${first}` })).toBeVisible();

  // One item failed first: "All satisfactory" keeps it failed, and recording still asks for its note.
  const damage = page.getByRole("group", { name: "No damage or corrosion" });
  await damage.locator("label").filter({ hasText: "Fail" }).click();
  await page.getByRole("button", { name: "All satisfactory" }).click();
  await expect(page.getByRole("status").filter({ hasText: "1 failed item is kept as failed and still needs a note" })).toBeVisible();
  await expect(damage.getByRole("radio", { name: /Fail/ })).toBeChecked();
  await expect(page.getByRole("group", { name: "Head secure" }).getByRole("radio", { name: /Pass/ })).toBeChecked();
  await page.getByRole("button", { name: "Record inspection" }).click();
  await expect(damage.getByRole("alert")).toContainText("Say what is wrong");
  expect(new URL(page.url()).pathname).toMatch(/\/inspect$/);

  // Changed to satisfactory after all: every item, and the member, pass.
  await damage.locator("label").filter({ hasText: "Pass" }).click();
  await page.getByRole("button", { name: "All satisfactory" }).click();
  await expect(page.getByRole("status").filter({ hasText: "items and the overall result marked satisfactory" })).toBeVisible();
  for (const radio of await page.getByRole("group").getByRole("radio", { name: /^Pass/ }).all()) await expect(radio).toBeChecked();
  await expect(page.getByRole("radio", { name: "Passed" })).toBeChecked();
  await page.getByRole("button", { name: "Record inspection" }).click();

  // Straight on to the next member due in this zone's round.
  await expect(page.getByRole("heading", { level: 1, name: `Inspect ${second}` })).toBeVisible();
  await expect(page.getByTestId("recorded-next")).toContainText(`Recorded ${first} — next: ${second}`);
  expect(new URL(page.url()).searchParams.get("zone")).toBe(zoneId);
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(page.viewportSize()!.width);
  await page.screenshot({ path: testInfo.outputPath("next-due.png"), fullPage: true });

  await page.getByRole("button", { name: "All satisfactory" }).click();
  await page.getByRole("button", { name: "Record inspection" }).click();
  // Nothing else due in the zone: back to the round, which says so.
  await expect(page.getByRole("heading", { level: 1, name: "Inspection round" })).toBeVisible();
  await expect(page.getByRole("status").filter({ hasText: `Recorded ${second} — round complete` })).toBeVisible();
  await expect(page.getByRole("link", { name: `Inspect ${first}` })).toHaveCount(0);
  expect(new URL(page.url()).searchParams.get("zone")).toBe(zoneId);

  // Both recorded as passes, by the coordinator.
  for (const tag of tags) {
    const rows = (await (await page.request.get(`/api/v1/sites/${siteId}/members?q=${tag}`)).json()) as { items: { id: string }[] };
    const history = (await (await page.request.get(`/api/v1/members/${rows.items[0]!.id}/inspections`)).json()) as { items: { result: string }[] };
    expect(history.items.map((i) => i.result), tag).toEqual(["pass"]);
  }
});

test("bulk all satisfactory from the register: a confirm step saying how many, then each member recorded as its own satisfactory inspection", async ({ page }, testInfo) => {
  test.setTimeout(120_000);
  // The coordinator: makes the run's own zone, and records inspections.
  await signIn(page, "coordinator@demo.example");
  const prefix = prefixFor("BLK", testInfo.project.name);
  const { siteId, zoneId, tags } = await roundOfOwn(page, prefix, 3);

  await page.goto(`/sites/${siteId}/members?q=${prefix}`);
  for (const tag of tags.slice(0, 2)) await page.getByRole("checkbox", { name: `Choose ${tag}`, exact: true }).locator("visible=true").check();
  await expect(page.getByTestId("selection-count")).toHaveText("2 chosen:");
  await page.getByRole("button", { name: "All satisfactory" }).click();

  // The confirm step states how many and what is recorded; cancelling records nothing.
  const confirm = page.getByRole("alertdialog", { name: "Record 2 members as inspected and satisfactory?" });
  await expect(confirm).toContainText("Each of the 2 members is recorded as its own satisfactory inspection");
  await confirm.getByRole("button", { name: "Cancel" }).click();
  await expect(confirm).toHaveCount(0);
  await page.getByRole("button", { name: "All satisfactory" }).click();
  await page.getByRole("button", { name: "Record 2 members satisfactory" }).click();
  await expect(page.getByRole("status").filter({ hasText: `Recorded 2 satisfactory inspections (${tags[0]}, ${tags[1]})` })).toBeVisible();
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(page.viewportSize()!.width);
  await page.screenshot({ path: testInfo.outputPath("bulk-done.png"), fullPage: true });

  // On the round of that zone, only the third member is still to inspect.
  await page.goto(`/sites/${siteId}/inspections?zone=${zoneId}`);
  await expect(page.getByRole("link", { name: `Inspect ${tags[2]}` })).toBeVisible();
  for (const tag of tags.slice(0, 2)) await expect(page.getByRole("link", { name: `Inspect ${tag}` })).toHaveCount(0);
});
