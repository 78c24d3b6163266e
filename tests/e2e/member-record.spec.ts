import { expect, test, type Page } from "@playwright/test";
import { INSPECTION_CHECKS } from "../../lib/inspections/checklist";
import { signIn } from "./helpers";
import { ORCHARD } from "../support/demo";

const SITE = ORCHARD;

/** A member of its own for each run (copied from a demo member, with a new tag), failed at inspection. */
async function failedMember(page: Page, tag: string) {
  const sites = (await (await page.request.get("/api/v1/sites")).json()) as { items: { id: string; name: string }[] };
  const site = sites.items.find((s) => s.name === SITE)!;
  const rows = (await (await page.request.get(`/api/v1/sites/${site.id}/members?q=ORB-RS-01`)).json()) as { items: { id: string }[] };
  const demo = (await (await page.request.get(`/api/v1/members/${rows.items[0]!.id}`)).json()) as {
    member: { memberTypeId: string; zoneId: string | null; schemeId: string | null; extensionMm: number; endConditions: string; loadN: number };
  };
  const { memberTypeId, zoneId, schemeId, extensionMm, endConditions, loadN } = demo.member;
  const created = await page.request.post(`/api/v1/sites/${site.id}/members`, {
    data: { tag, memberTypeId, zoneId, schemeId, extensionMm, endConditions, loadSource: "direct", loadN, submit: true },
  });
  expect(created.status()).toBe(201);
  const { member } = (await created.json()) as { member: { id: string } };
  const items = INSPECTION_CHECKS.map((c, i) => (i === 0 ? { check: c.key, result: "fail", note: "Base plate cracked" } : { check: c.key, result: "pass" }));
  const inspected = await page.request.post(`/api/v1/members/${member.id}/inspections`, { data: { result: "fail", items, notes: "Fence it off" } });
  expect(inspected.status()).toBe(201);
  return { siteId: site.id, memberId: member.id };
}

test("a member that failed its inspection says so first, with its inspections, permits and history in words, and fits the screen", async ({ page }, testInfo) => {
  await signIn(page, "engineer@demo.example");
  const tag = `E2E-OOS-${testInfo.project.name}-${Date.now().toString(36)}`.toUpperCase();
  const { siteId, memberId } = await failedMember(page, tag);
  await page.goto(`/sites/${siteId}/members/${memberId}`);
  await expect(page.getByRole("heading", { level: 1, name: tag })).toBeVisible();

  // The state leads, above the capacity result: what happened, when, by whom, and what to do next.
  const state = page.getByTestId("member-state");
  await expect(state.getByRole("heading", { level: 2 })).toHaveText(/^Out of service: failed inspection on .+ by Tomasz Wilk$/);
  await expect(state).toContainText("Base plate cracked");
  await expect(state).toContainText("What to do next:");
  await expect(state).toContainText("record a passing re-inspection");
  await expect(state.getByRole("link", { name: "Record a re-inspection" })).toBeVisible();
  const stateBox = await state.boundingBox();
  const checkBox = await page.getByTestId("check-result").first().boundingBox();
  expect(stateBox!.y + stateBox!.height).toBeLessThanOrEqual(checkBox!.y);

  // Its inspection history and its permit history are on the record.
  await expect(page.getByRole("list", { name: "Inspection history" }).getByTestId("member-inspection").first()).toContainText("Failed");
  await expect(page.getByRole("list", { name: "Inspection history" })).toContainText("Base plate cracked");
  await expect(page.getByTestId("member-permits")).toContainText("Not named on any permit yet.");

  // The history reads as sentences: no keys, hashes or ids.
  const history = page.getByRole("list", { name: "Audit history" });
  await expect(history).toContainText(/Status changed from Submitted to Out of service after the failed inspection on \d{1,2} [A-Z][a-z]{2} \d{4}\./);
  await expect(history).toContainText("Logged by Tomasz Wilk");
  const text = await history.innerText();
  expect(text).not.toMatch(/[0-9a-f]{8}-[0-9a-f]{4}-|out_of_service|status_changed|inspectionId|→/);

  // The edit form cannot put it back in service.
  const status = page.getByLabel("Status");
  await expect(status).toBeDisabled();
  await expect(page.getByText("Out of service: it returns to service only through a passing inspection, not by editing.")).toBeVisible();

  // Nothing scrolls sideways (wide tables keep their own scroll box).
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(overflow).toBeLessThanOrEqual(0);
  await page.screenshot({ path: testInfo.outputPath(`member-out-of-service-${testInfo.project.name}.png`), fullPage: true });
});
