// The permit safety points on a phone and at a desk: the coordinator's own request shows why they
// cannot issue it; striking evidence is amended with the old results kept; striking is confirmed
// member by member, and the permit closes with the last.
import { expect, test, type APIRequestContext, type Browser, type Page } from "@playwright/test";
import { signIn } from "./helpers";
import { WHARF } from "../support/demo";

const SITE = WHARF;

async function signedIn(browser: Browser, email: string, use: Record<string, unknown>): Promise<Page> {
  const ctx = await browser.newContext(use);
  const page = await ctx.newPage();
  await signIn(page, email);
  return page;
}

async function ok<T>(r: Awaited<ReturnType<APIRequestContext["get"]>>): Promise<T> {
  expect(r.ok(), `${r.url()} → ${r.status()} ${await r.text()}`).toBe(true);
  return (await r.json()) as T;
}

/** Two draft members logged through the API (as an engineer would on a phone). */
async function twoMembers(api: APIRequestContext, project: string) {
  const sites = await ok<{ items: { id: string; name: string }[] }>(await api.get("/api/v1/sites"));
  const siteId = sites.items.find((s) => s.name === SITE)!.id;
  const types = await ok<{ items: { id: string; name: string }[] }>(await api.get(`/api/v1/sites/${siteId}/member-types`));
  const typeId = types.items.find((t) => t.name === "EN 1065 class B prop, 1.75–3.12 m")!.id;
  const zones = await ok<{ items: { id: string; name: string }[] }>(await api.get(`/api/v1/sites/${siteId}/zones`));
  const zoneId = zones.items.find((z) => z.name === "Level 2 slab, bays 1–4")!.id;
  const stamp = `${project.slice(0, 2).toUpperCase()}${Date.now().toString(36).toUpperCase()}`;
  const ids: { id: string; tag: string }[] = [];
  for (const n of [1, 2]) {
    const tag = `E2E-STR-${stamp}-${n}`;
    const r = await ok<{ member: { id: string } }>(
      await api.post(`/api/v1/sites/${siteId}/members`, { data: { tag, memberTypeId: typeId, extensionMm: 2500, endConditions: "pinned-pinned", loadSource: "direct", loadN: 6000, zoneId } }),
    );
    ids.push({ id: r.member.id, tag });
  }
  return { siteId, members: ids };
}

test("the coordinator's own request shows why they cannot issue it; evidence is amended with the old results kept; striking member by member closes the permit", async ({ browser }, info) => {
  test.setTimeout(120_000);
  const use = info.project.use as Record<string, unknown>;
  const device = { viewport: use.viewport, userAgent: use.userAgent, deviceScaleFactor: use.deviceScaleFactor, isMobile: use.isMobile, hasTouch: use.hasTouch };

  // 1. The coordinator requests a permit to strike with a cube result below the required strength.
  const coord = await signedIn(browser, "coordinator@demo.example", device);
  const { siteId, members } = await twoMembers(coord.request, info.project.name);
  const req = await ok<{ permit: { id: string } }>(
    await coord.request.post(`/api/v1/sites/${siteId}/permits`, {
      data: {
        kind: "strike",
        scope: "members",
        memberIds: members.map((m) => m.id),
        evidence: { basis: "strength", concreteAgeDays: 7, requiredStrengthMpa: 20, results: [{ specimen: "cube", strengthMpa: 24.5 }, { specimen: "cube", strengthMpa: 17.5 }] },
      },
    }),
  );
  await coord.goto(`/sites/${siteId}/permits/${req.permit.id}`);
  await expect(coord.getByRole("heading", { level: 1, name: "Permit to strike — request" })).toBeVisible();
  // Separation of duties, in words, where the Issue button would be.
  await expect(coord.getByTestId("issue-blocked")).toContainText("You requested this permit, so someone else must issue it");
  await expect(coord.getByRole("button", { name: "Issue permit" })).toHaveCount(0);
  await expect(coord.getByRole("button", { name: "Refuse the request…" })).toBeVisible();

  // 2. New cube results replace the low one; the old evidence stays on the page.
  await expect(coord.getByText("Cube result 17.5 MPa is below the required striking strength of 20.0 MPa (concrete 7 days old)").first()).toBeVisible();
  await coord.getByRole("button", { name: "Enter new strength results…" }).click();
  await coord.getByLabel("Concrete age (days)").fill("9");
  await coord.getByLabel("Results (MPa, separated by spaces)").fill("24.5 23");
  await coord.getByRole("button", { name: "Save the new results" }).click();
  await expect(coord.getByText("Concrete 9 days old: cube 24.5 MPa, cube 23.0 MPa, all at or above the required 20.0 MPa").first()).toBeVisible();
  await expect(coord.getByTestId("evidence-history")).toContainText("17.5 MPa");
  await expect(coord.getByTestId("evidence-history")).toContainText("Priya Natarajan");

  // 3. The API agrees: the requester's own issue is refused.
  const own = await coord.request.post(`/api/v1/permits/${req.permit.id}/issue`, { data: {} });
  expect(own.status()).toBe(403);
  await coord.context().close();

  // 4. The engineer's request for the same members is issued by the coordinator; the supervisor
  // confirms striking member by member.
  const eng = await signedIn(browser, "engineer@demo.example", device);
  const refuse = await signedIn(browser, "coordinator@demo.example", device);
  await ok(await refuse.request.post(`/api/v1/permits/${req.permit.id}/refuse`, { data: { reason: "Re-requested by the site engineer" } }));
  const second = await ok<{ permit: { id: string } }>(
    await eng.request.post(`/api/v1/sites/${siteId}/permits`, {
      data: { kind: "strike", scope: "members", memberIds: members.map((m) => m.id), evidence: { basis: "strength", concreteAgeDays: 9, requiredStrengthMpa: 20, results: [{ specimen: "cube", strengthMpa: 24.5 }] } },
    }),
  );
  await ok(await refuse.request.post(`/api/v1/permits/${second.permit.id}/issue`, { data: {} }));
  await eng.context().close();
  await refuse.context().close();

  const sup = await signedIn(browser, "supervisor@demo.example", device);
  await sup.goto(`/sites/${siteId}/permits/${second.permit.id}`);
  await expect(sup.getByTestId("permit-status")).toHaveText("Issued");
  const [a, b] = members;
  await sup.getByRole("checkbox", { name: new RegExp(a!.tag) }).check();
  await sup.getByRole("button", { name: "Confirm 1 member struck" }).click();
  await expect(sup.getByTestId(`scope-${a!.tag}`).getByTestId("member-state")).toHaveText("Struck");
  await expect(sup.getByTestId(`scope-${b!.tag}`).getByTestId("member-state")).not.toHaveText("Struck");
  await expect(sup.getByTestId("permit-status")).toHaveText("Issued");
  // The last one: the permit closes.
  await sup.getByRole("button", { name: "Confirm striking is done" }).click();
  await sup.getByRole("button", { name: "Yes, confirm striking is done" }).click();
  await expect(sup.getByTestId("permit-status")).toHaveText("Closed");
  await expect(sup.getByTestId(`scope-${b!.tag}`).getByTestId("member-state")).toHaveText("Struck");
  await sup.context().close();
});
