// The offline round's last checks, on a phone: an edit that meets a change made on the server
// meanwhile, the server's check taking the place of the phone's provisional one, a second site's
// library, zones and schemes with no signal, and a phone shared by two people signing in and out.
// Each outcome is read back through the API, not only from the screen. Phone project only.
import { expect, test, type Page, type Route } from "@playwright/test";
import { openSite, signIn, signInWithForm } from "./helpers";
import { goOffline, goOnline, membersTagged, siteIdOf, waitUntilKept, workerControls } from "./offline-helpers";
import { APP_URL, signInAs } from "../support/http";
import { ORCHARD, WHARF } from "../support/demo";

test.use({ serviceWorkers: "allow" });

type Types = { items: { id: string; name: string }[] };
type MemberRead = {
  member: { id: string; tag: string; version: number; extensionMm: number; loadN: number; notes: string | null; utilisation: number | null };
  check: { utilisation: number | null; capacityN: number | null; pass: boolean } | null;
};

const PROP_D = "EN 1065 class D prop, 1.98–3.35 m";
const runId = () => `${Date.now().toString(36).toUpperCase()}${Math.floor(Math.random() * 1296).toString(36).toUpperCase()}`;

async function propD(page: Page, siteId: string) {
  const types = (await (await page.request.get(`/api/v1/sites/${siteId}/member-types`)).json()) as Types;
  return types.items.find((t) => t.name === PROP_D)!.id;
}

async function readMember(page: Page, id: string) {
  const r = await page.request.get(`/api/v1/members/${id}`);
  expect(r.status()).toBe(200);
  return (await r.json()) as MemberRead;
}

async function fillMember(page: Page, tag: string, zone = "Level 2 slab, bays 1–4") {
  await page.getByLabel("Tag (the code on its label)").fill(tag);
  await page.getByLabel("Zone").selectOption({ label: zone });
  await page.getByLabel("Member type").selectOption({ label: PROP_D });
  await page.getByLabel("Measured extension (mm)").fill("2600");
  await page.getByLabel(/Working load/).fill("8");
}

/** A member put on the register at the desk, and an engineer on the phone with its page kept. */
async function memberOpenedOnPhone(page: Page, tag: string) {
  await signIn(page, "engineer@demo.example");
  await openSite(page, WHARF);
  const siteId = siteIdOf(page);
  const made = await page.request.post(`/api/v1/sites/${siteId}/members`, {
    data: { tag, memberTypeId: await propD(page, siteId), extensionMm: 2500, loadN: 6000 },
    headers: { origin: APP_URL },
  });
  expect(made.status()).toBe(201);
  const id = ((await made.json()) as { member: { id: string } }).member.id;
  await workerControls(page);
  const url = `/sites/${siteId}/members/${id}`;
  await page.goto(url);
  await expect(page.getByRole("heading", { level: 1, name: tag })).toBeVisible();
  await waitUntilKept(page, url, "the member page");
  return { siteId, id, url };
}

/** Offline on the phone: the member page from its copy, the extension changed, the edit waiting. */
async function editOffline(page: Page, url: string, extension: string) {
  await goOffline(page.context());
  await page.goto(url);
  await expect(page.getByTestId("offline-banner")).toBeVisible();
  await page.getByLabel("Measured extension (mm)").fill(extension);
  await page.getByRole("button", { name: "Save changes" }).click();
  await expect(page.getByText("Saved on this phone — waiting to send.")).toBeVisible();
}

/** Someone else, signed in at the desk, changes the member meanwhile. */
async function changedAtDesk(id: string, body: Record<string, unknown>) {
  const desk = await signInAs("coordinator@demo.example");
  const r = await desk.json<MemberRead>(`/api/v1/members/${id}`, { method: "PATCH", body, headers: { origin: APP_URL } });
  expect(r.status).toBe(200);
  return r.body.member;
}

test.describe("an edit made offline meets a change made on the server meanwhile", () => {
  test("the phone shows both versions; keeping mine writes it once over the new version and keeps the desk's other change", async ({ page }) => {
    test.setTimeout(120_000);
    const tag = `CNF-${runId()}-M`;
    const { id, url } = await memberOpenedOnPhone(page, tag);
    const before = await readMember(page, id);

    await editOffline(page, url, "2700");
    const desk = await changedAtDesk(id, { extensionMm: 2400, notes: "Re-measured from the desk" });
    expect(desk.version).toBe(before.member.version + 1);

    // Back online the edit is sent by itself, refused as made against an older copy, and asked about.
    await goOnline(page.context());
    const item = page.getByTestId("outbox-item");
    await page.getByTestId("outbox-badge").click({ timeout: 30_000 });
    await expect(item).toHaveAttribute("data-status", "conflict", { timeout: 30_000 });
    await expect(item.getByTestId("outbox-reason")).toBeVisible();
    // Side by side, in words and in the site's units: the phone's 2700 mm against the server's 2400 mm.
    const row = item.getByRole("row").filter({ has: page.getByRole("rowheader", { name: "Measured extension" }) });
    await expect(row.getByRole("cell")).toHaveText(["2700 mm", "2400 mm"]);
    // Nothing was written while it waited for an answer.
    expect((await readMember(page, id)).member).toMatchObject({ extensionMm: 2400, version: desk.version });

    await item.getByRole("button", { name: "Keep mine" }).click();
    await expect(page.getByTestId("outbox-badge")).toHaveCount(0, { timeout: 30_000 });
    const after = await readMember(page, id);
    // Mine, written once on top of the desk's version; the desk's notes, which the phone did not touch, stay.
    expect(after.member.extensionMm).toBe(2700);
    expect(after.member.version).toBe(desk.version + 1);
    expect(after.member.notes).toBe("Re-measured from the desk");
  });

  test("taking the server's drops the phone's edit: the member stays as the desk left it", async ({ page }) => {
    test.setTimeout(120_000);
    const tag = `CNF-${runId()}-S`;
    const { id, url } = await memberOpenedOnPhone(page, tag);

    await editOffline(page, url, "2750");
    const desk = await changedAtDesk(id, { extensionMm: 2450 });

    await goOnline(page.context());
    await page.getByTestId("outbox-badge").click({ timeout: 30_000 });
    const item = page.getByTestId("outbox-item");
    await expect(item).toHaveAttribute("data-status", "conflict", { timeout: 30_000 });
    await item.getByRole("button", { name: "Keep the server's" }).click();
    await expect(page.getByTestId("outbox-badge")).toHaveCount(0);
    // A reload finds nothing left waiting on the phone to be sent later.
    await page.reload();
    await expect(page.getByRole("heading", { level: 1, name: tag })).toBeVisible();
    await expect(page.getByTestId("outbox-badge")).toHaveCount(0);
    expect((await readMember(page, id)).member).toMatchObject({ extensionMm: 2450, version: desk.version });
    // The page shows the server's record.
    await expect(page.getByRole("definition").filter({ hasText: /^2450 mm$/ })).toBeVisible();
  });
});

test("after sync the member page shows the server's stored check, no longer provisional, with the API's figure", async ({ page }) => {
  test.setTimeout(120_000);
  const tag = `PRV-${runId()}`;
  await signIn(page, "engineer@demo.example");
  await openSite(page, WHARF);
  const siteId = siteIdOf(page);
  await workerControls(page);
  await page.goto(`/sites/${siteId}/members/new`);
  await waitUntilKept(page, `/sites/${siteId}/members/new`, "Log member");

  await goOffline(page.context());
  await page.reload();
  await fillMember(page, tag);
  await page.getByRole("button", { name: "Save and check" }).click();
  const provisional = page.getByTestId("provisional-check");
  await expect(provisional).toContainText("Provisional — the server's check is the one stored");
  const phoneFigure = (await provisional.getByTestId("check-utilisation").textContent())!.trim();
  expect(phoneFigure).toMatch(/^\d+ %$/);
  await page.getByTestId("outbox-badge").click();
  await expect(page.getByTestId("outbox-provisional")).toContainText(`Provisional — checked on this phone: utilisation ${phoneFigure}`);
  expect(await membersTagged(page, siteId, tag)).toHaveLength(0);

  // Signal: the entry is sent, and the form puts the server's check in the provisional one's place.
  await goOnline(page.context());
  await expect(page.getByTestId("server-check-note")).toBeVisible({ timeout: 30_000 });
  await expect(page.getByTestId("provisional-check")).toHaveCount(0);
  const [m] = await membersTagged(page, siteId, tag);
  expect(m).toBeDefined();
  const stored = await readMember(page, m!.id);
  expect(stored.check).not.toBeNull();
  const serverFigure = `${Math.round(stored.check!.utilisation! * 100)} %`;
  await expect(page.getByTestId("check-utilisation")).toHaveText(serverFigure);
  // The phone ran the same engine on the same library, so it said the same before sync.
  expect(phoneFigure).toBe(serverFigure);

  await page.getByRole("link", { name: "Open the member page" }).click();
  await expect(page.getByRole("heading", { level: 1, name: tag })).toBeVisible();
  const latest = page.getByRole("region", { name: "Latest capacity check" });
  await expect(latest.getByTestId("check-utilisation")).toHaveText(serverFigure);
  await expect(page.getByRole("main")).not.toContainText(/provisional/i);
  expect(stored.member.utilisation).toBe(stored.check!.utilisation);
});

test("the second site's Log member, library, zones and schemes are on the phone with no signal, and a member logged there arrives on that site", async ({ page }) => {
  test.setTimeout(120_000);
  const tag = `SND-${runId()}`;
  await signIn(page, "engineer@demo.example");
  // Only the first site is opened; the engineer also belongs to the basement site.
  await openSite(page, WHARF);
  const sites = (await (await page.request.get("/api/v1/sites")).json()) as { items: { id: string; name: string }[] };
  const second = sites.items.find((s) => s.name === ORCHARD)!.id;
  const zones = (await (await page.request.get(`/api/v1/sites/${second}/zones`)).json()) as { items: { name: string }[] };
  const schemes = (await (await page.request.get(`/api/v1/sites/${second}/schemes`)).json()) as { items: { reference: string }[] };
  const types = (await (await page.request.get(`/api/v1/sites/${second}/member-types`)).json()) as Types;
  expect(zones.items.length).toBeGreaterThan(0);
  expect(schemes.items.length).toBeGreaterThan(0);
  await workerControls(page);
  const logSecond = `/sites/${second}/members/new`;
  await waitUntilKept(page, logSecond, "the second site's Log member");
  await waitUntilKept(page, `/api/v1/sites/${second}/member-types`, "the second site's member library");

  await goOffline(page.context());
  await page.goto(logSecond);
  await expect(page.getByTestId("offline-banner")).toBeVisible();
  await expect(page.getByRole("heading", { name: "Log a member" })).toBeVisible();
  const optionsOf = (label: string) => page.getByLabel(label, { exact: true }).locator("option").allTextContents();
  const zoneOptions = (await optionsOf("Zone")).join("\n");
  for (const z of zones.items) expect(zoneOptions).toContain(z.name);
  const schemeOptions = (await optionsOf("Scheme")).join("\n");
  for (const s of schemes.items) expect(schemeOptions).toContain(s.reference);
  const typeOptions = (await optionsOf("Member type")).join("\n");
  for (const t of types.items) expect(typeOptions).toContain(t.name);
  // The kept API reads answer too, with the same library.
  const keptTypes = await page.evaluate(async (u) => ((await (await fetch(u)).json()) as Types).items.map((t) => t.name), `/api/v1/sites/${second}/member-types`);
  expect(keptTypes.sort()).toEqual(types.items.map((t) => t.name).sort());

  await fillMember(page, tag, zones.items[0]!.name);
  await page.getByRole("button", { name: "Save and check" }).click();
  await expect(page.getByTestId("provisional-check")).toContainText("Provisional");
  await goOnline(page.context());
  await expect(page.getByTestId("server-check-note")).toBeVisible({ timeout: 30_000 });
  const arrived = await membersTagged(page, second, tag);
  expect(arrived).toHaveLength(1);
  const detail = await readMember(page, arrived[0]!.id);
  expect(detail.member).toMatchObject({ tag, extensionMm: 2600, loadN: 8000 });
});

test("a shared phone: sign-out forgets the kept pages; the next person never sends or sees the first one's entry; it goes once when its author is back", async ({ page }) => {
  test.setTimeout(180_000);
  const run = runId();
  const [tagA, tagB, draftA] = [`SHR-${run}-A`, `SHR-${run}-B`, `SHR-${run}-D`];
  const context = page.context();
  // Counted at the desk, through the API, whoever is signed in on the phone.
  const desk = await signInAs("coordinator@demo.example");
  const onServer = async (siteId: string, tag: string) => {
    const r = await desk.json<{ items: { tag: string }[] }>(`/api/v1/sites/${siteId}/members?q=${encodeURIComponent(tag)}`);
    expect(r.status).toBe(200);
    return r.body.items.filter((m) => m.tag === tag).length;
  };

  // Person A (the engineer) opens a member page and Log member with signal, then logs a member with none.
  await signInWithForm(page, "engineer@demo.example");
  await openSite(page, WHARF);
  const siteId = siteIdOf(page);
  await workerControls(page);
  const made = await page.request.post(`/api/v1/sites/${siteId}/members`, {
    data: { tag: `SHR-${run}-P`, memberTypeId: await propD(page, siteId), extensionMm: 2500, loadN: 6000 },
    headers: { origin: APP_URL },
  });
  expect(made.status()).toBe(201);
  const seenUrl = `/sites/${siteId}/members/${((await made.json()) as { member: { id: string } }).member.id}`;
  await page.goto(seenUrl);
  await waitUntilKept(page, seenUrl, "the member page A opened");
  await page.goto(`/sites/${siteId}/members/new`);
  await waitUntilKept(page, `/sites/${siteId}/members/new`, "Log member");
  await goOffline(context);
  await page.reload();
  await fillMember(page, tagA);
  await page.getByRole("button", { name: "Save and check" }).click();
  await expect(page.getByRole("status").filter({ hasText: `${tagA} saved on this phone — waiting to send` })).toBeVisible();
  // A starts the next one and leaves it unsaved: a draft on the phone.
  await page.getByRole("button", { name: "Log another member" }).click();
  await page.getByLabel("Tag (the code on its label)").fill(draftA);

  // A signs out on a weak signal: pages load, but the entry's sending does not get through.
  const stuck = (route: Route) => route.abort("connectionreset");
  await context.route("**/api/v1/ping", stuck);
  await goOnline(context);
  await page.goto("/sign-out");
  await expect(page.getByTestId("sign-out-waiting")).toContainText("1 entry saved on this phone has not reached the server yet");
  await page.getByRole("button", { name: "Sign out anyway" }).click();
  await expect(page).toHaveURL(/\/sign-in/);
  await context.unroute("**/api/v1/ping", stuck);
  expect(await onServer(siteId, tagA)).toBe(0);

  // Nothing A kept is left: the member page A opened is not served to the signed-out phone.
  await expect.poll(() => page.evaluate(async (u) => (await caches.match(u)) != null, seenUrl)).toBe(false);
  await expect.poll(() => page.evaluate(async (u) => (await caches.match(u)) != null, `/api/v1/sites/${siteId}/member-types`)).toBe(false);
  await goOffline(context);
  await page.goto(seenUrl).catch(() => undefined);
  await expect(page.getByText(`SHR-${run}-P`)).toHaveCount(0);
  await goOnline(context);

  // Person B (the coordinator) signs in on the same phone: A's entry is not B's to see or send.
  await signInWithForm(page, "coordinator@demo.example");
  await openSite(page, WHARF);
  await expect(page.getByTestId("outbox-badge")).toHaveCount(0);
  // B logs one of their own with no signal; back online it is sent, and A's older entry, first in
  // the queue, would have gone before it had it been sent under B.
  await workerControls(page);
  await page.goto(`/sites/${siteId}/members/new`);
  await waitUntilKept(page, `/sites/${siteId}/members/new`, "Log member for B");
  await goOffline(context);
  await page.reload();
  await fillMember(page, tagB);
  // A's unsaved draft is not offered to B (had it been restored, it would show here or replace B's values).
  await expect(page.getByText("Your unsaved entry was restored.")).toHaveCount(0);
  await expect(page.getByLabel("Tag (the code on its label)")).toHaveValue(tagB);
  await page.getByRole("button", { name: "Save and check" }).click();
  await expect(page.getByTestId("outbox-count")).toHaveText("1");
  await page.getByTestId("outbox-badge").click();
  await expect(page.getByTestId("outbox-item")).toHaveCount(1);
  await expect(page.getByTestId("outbox-item")).toContainText(`Member ${tagB}`);
  await goOnline(context);
  await expect(page.getByTestId("server-check-note")).toBeVisible({ timeout: 30_000 });
  expect(await onServer(siteId, tagB)).toBe(1);
  expect(await onServer(siteId, tagA)).toBe(0);
  await expect(page.getByTestId("outbox-badge")).toHaveCount(0);

  // B signs out (nothing of B's waits) and A signs in again: A's entry is sent, once.
  await page.goto("/sign-out");
  await page.getByRole("button", { name: "Sign out now" }).click();
  await expect(page).toHaveURL(/\/sign-in/);
  await signInWithForm(page, "engineer@demo.example");
  await expect.poll(() => onServer(siteId, tagA), { timeout: 45_000, message: "A's entry arrives after A signs in again" }).toBe(1);
  await expect(page.getByTestId("outbox-badge")).toHaveCount(0);
  await page.reload();
  await expect(page.getByTestId("outbox-badge")).toHaveCount(0);
  expect(await onServer(siteId, tagA)).toBe(1);
  // A's unsaved draft is A's again.
  await page.goto(`/sites/${siteId}/members/new`);
  await expect(page.getByText("Your unsaved entry was restored.")).toBeVisible();
  await expect(page.getByLabel("Tag (the code on its label)")).toHaveValue(draftA);
});
