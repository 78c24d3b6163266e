// The zone plan journey across three people and two devices: the designer uploads the plan on a
// desk, the engineer places a member on it from a phone (412 × 915), and the coordinator, on a
// desk, sees the failing member marked on the plan and opens it. Runs in the phone project only;
// the desk browsers are made here (playwright.config.ts).
import { devices, expect, test, type Browser } from "@playwright/test";
import sharp from "sharp";
import { signIn } from "./helpers";
import { WHARF } from "../support/demo";

const DESK = { viewport: { width: 1366, height: 850 } };

async function person(browser: Browser, email: string, baseURL: string, device: "phone" | "desk") {
  const context = await browser.newContext({ ...(device === "phone" ? devices["Pixel 7"] : DESK), baseURL });
  const page = await context.newPage();
  await signIn(page, email);
  return { context, page };
}

/** A plan of our own: a white sheet with four grid lines each way. */
function planPng() {
  const lines = [0.2, 0.4, 0.6, 0.8]
    .map((f) => `<line x1="${f * 1600}" y1="0" x2="${f * 1600}" y2="1000" stroke="#333" stroke-width="6"/><line x1="0" y1="${f * 1000}" x2="1600" y2="${f * 1000}" stroke="#333" stroke-width="6"/>`)
    .join("");
  return sharp(Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg" width="1600" height="1000"><rect width="100%" height="100%" fill="#fff"/>${lines}</svg>`)).png().toBuffer();
}

test("the designer uploads a zone plan, the engineer pins a member on a phone, the coordinator sees the failing one marked on a desk and opens it", async ({ browser }, testInfo) => {
  const baseURL = String(testInfo.project.use.baseURL ?? "http://127.0.0.1:3100");
  const stamp = Date.now().toString(36).toUpperCase();

  // The designer: a new zone of its own, then its plan uploaded from the plan page.
  const designer = await person(browser, "designer@demo.example", baseURL, "desk");
  const sites = (await (await designer.page.request.get("/api/v1/sites")).json()) as { items: { id: string; name: string }[] };
  const siteId = sites.items.find((s) => s.name === WHARF)!.id;
  const zoneName = `E2E plan zone ${stamp}`;
  const made = await designer.page.request.post(`/api/v1/sites/${siteId}/zones`, { data: { name: zoneName, level: "L5", grid: "A–E / 1–5" } });
  expect(made.status()).toBe(201);
  const zoneId = ((await made.json()) as { zone: { id: string } }).zone.id;
  await designer.page.goto(`/sites/${siteId}/zones/${zoneId}/plan`);
  await expect(designer.page.getByText("This zone has no plan yet")).toBeVisible();
  await designer.page.getByTestId("plan-file").setInputFiles({ name: "level-5.png", mimeType: "image/png", buffer: await planPng() });
  await designer.page.getByRole("button", { name: "Upload plan" }).click();
  await expect(designer.page.getByRole("status").filter({ hasText: "Plan uploaded." })).toBeVisible();
  await expect(designer.page.getByRole("img", { name: `${zoneName} plan`, exact: true })).toBeVisible();
  await designer.context.close();

  // The engineer, on a phone: a member over its capacity in that zone, placed by tapping the plan.
  const engineer = await person(browser, "engineer@demo.example", baseURL, "phone");
  const types = (await (await engineer.page.request.get(`/api/v1/sites/${siteId}/member-types`)).json()) as { items: { id: string; name: string }[] };
  const propB = types.items.find((t) => t.name.startsWith("EN 1065 class B"))!.id;
  const tag = `E2E-PLN-${stamp}`;
  // 200 kN on a class B prop at 3.1 m is far beyond any EN 1065 class B rating (value to be confirmed against EN 1065 Table 2).
  const created = await engineer.page.request.post(`/api/v1/sites/${siteId}/members`, {
    data: { tag, memberTypeId: propB, zoneId, extensionMm: 3100, endConditions: "pinned-pinned", loadSource: "direct", loadN: 200_000 },
  });
  expect(created.status()).toBe(201);
  const memberId = ((await created.json()) as { member: { id: string } }).member.id;
  await engineer.page.goto(`/sites/${siteId}/members/${memberId}`);
  await expect(engineer.page.getByRole("heading", { level: 1, name: tag })).toBeVisible();
  const picker = engineer.page.getByRole("group", { name: "Place on the zone plan (optional)" });
  await expect(picker.getByText("Tap where the member stands.")).toBeVisible();
  const svg = picker.getByTestId("plan-svg");
  await svg.scrollIntoViewIfNeeded();
  const box = (await svg.boundingBox())!;
  expect(box.width).toBeLessThanOrEqual(412);
  await svg.tap({ position: { x: box.width * 0.6, y: box.height * 0.4 } });
  await expect(picker.getByText(/Placed at 60 % across, 40 % down/)).toBeVisible();
  await expect(picker.getByTestId("plan-marker")).toBeVisible();
  await engineer.page.getByRole("button", { name: "Save changes" }).tap();
  await expect(engineer.page.getByRole("status").filter({ hasText: "Saved." })).toBeVisible();
  const stored = (await (await engineer.page.request.get(`/api/v1/members/${memberId}`)).json()) as { member: { planX: number; planY: number } };
  expect(stored.member.planX).toBeCloseTo(0.6, 1);
  expect(stored.member.planY).toBeCloseTo(0.4, 1);
  await engineer.context.close();

  // The coordinator, on a desk: from the overview to the plan, the failing member marked with its word.
  const coordinator = await person(browser, "coordinator@demo.example", baseURL, "desk");
  await coordinator.page.goto(`/sites/${siteId}`);
  await coordinator.page.getByRole("navigation", { name: "Zone plans" }).getByRole("link", { name: zoneName }).click();
  await expect(coordinator.page.getByRole("heading", { level: 1, name: `${zoneName}: plan` })).toBeVisible();
  const pin = coordinator.page.locator(`[data-pin="${memberId}"]`);
  await expect(pin).toHaveAttribute("data-state", "fail");
  await expect(pin).toContainText(`${tag} Fail`);
  await expect(coordinator.page.getByRole("region", { name: "Legend" }).or(coordinator.page.locator("section[aria-labelledby=legend-h]"))).toContainText("Fail (1)");
  await pin.click();
  const detail = coordinator.page.getByTestId("pin-detail");
  await expect(detail).toContainText(`${tag} — Fail`);
  await expect(detail).toContainText(/Utilisation \d+ %/);
  await detail.getByRole("link", { name: `Open ${tag}` }).click();
  await expect(coordinator.page.getByRole("heading", { level: 1, name: tag })).toBeVisible();
  await expect(coordinator.page.getByRole("link", { name: `See ${tag} on the plan of ${zoneName}` })).toBeVisible();
  await coordinator.context.close();
});
