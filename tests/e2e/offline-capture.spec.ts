// A round with no signal, on a phone: the site is opened with signal, the phone goes offline, and
// three members (one with two photos) and an inspection are saved on the phone through reloads.
// Back online, each arrives on the server exactly once (counted through the API) with its photos
// and thumbnails; one whose tag was taken meanwhile stays on the phone with the server's reason,
// and is fixed and resent from the list. Phone project only (playwright.config.ts).
//
// Pages shown "offline" really come from the service worker's cache (see offline-helpers.ts).
import { expect, test, type Page } from "@playwright/test";
import sharp from "sharp";
import { openSite, signIn } from "./helpers";
import { goOffline, goOnline, membersTagged, workerControls } from "./offline-helpers";
import { WHARF } from "../support/demo";

test.use({ serviceWorkers: "allow" });

type Types = { items: { id: string; name: string }[] };

async function fillMember(page: Page, tag: string, extension: string) {
  await page.getByLabel("Tag (the code on its label)").fill(tag);
  await page.getByLabel("Zone").selectOption({ label: "Level 2 slab, bays 1–4" });
  await page.getByLabel("Member type").selectOption({ label: "EN 1065 class D prop, 1.98–3.35 m" });
  await page.getByLabel("Measured extension (mm)").fill(extension);
  await page.getByLabel(/Working load/).fill("8");
}

test("a round with no signal: three members, two photos and an inspection arrive once when back online; a refused one keeps its reason", async ({ page, context }) => {
  test.setTimeout(180_000);
  const run = Date.now().toString(36).toUpperCase();
  const [tagA, tagB, tagC] = ["A", "B", "C"].map((x) => `OFF-${run}-${x}`);
  const photo = (shade: string) => sharp({ create: { width: 480, height: 360, channels: 3, background: shade } }).jpeg().toBuffer();

  await signIn(page, "engineer@demo.example");
  await openSite(page, WHARF);
  const siteId = new URL(page.url()).pathname.split("/")[2]!;

  // A member already on the register, inspected later in the basement with no signal.
  const types = (await (await page.request.get(`/api/v1/sites/${siteId}/member-types`)).json()) as Types;
  const propD = types.items.find((t) => t.name.startsWith("EN 1065 class D"))!.id;
  const existing = await page.request.post(`/api/v1/sites/${siteId}/members`, {
    data: { tag: `OFF-${run}-I`, memberTypeId: propD, extensionMm: 2500, loadN: 6000 },
    headers: { origin: new URL(page.url()).origin },
  });
  expect(existing.status()).toBe(201);
  const inspectedId = ((await existing.json()) as { member: { id: string } }).member.id;

  // With signal: the app is installed as a worker and keeps the round's pages.
  await workerControls(page);
  await page.reload();
  await expect
    .poll(() => page.evaluate(async (u) => (await caches.match(u)) != null, `/sites/${siteId}/members/new`), { timeout: 30_000, message: "Log member is kept for offline use" })
    .toBe(true);
  await page.goto(`/sites/${siteId}/members/${inspectedId}/inspect`);
  await expect(page.getByRole("button", { name: "Record inspection" })).toBeVisible();
  const inspectionsBefore = ((await (await page.request.get(`/api/v1/members/${inspectedId}/inspections`)).json()) as { items: unknown[] }).items.length;

  // No signal. Reloading still shows the app (from the phone), and says it is offline.
  await page.goto(`/sites/${siteId}/members/new`);
  await goOffline(context);
  await page.reload();
  await expect(page.getByTestId("offline-banner")).toContainText(/Offline — showing what was loaded at \d\d:\d\d/);
  await expect(page.getByRole("heading", { name: "Log a member" })).toBeVisible();

  // Member A with two photos, then B and C.
  await fillMember(page, tagA, "2600");
  await page.getByLabel("Take or add photos").setInputFiles([
    { name: "head.jpg", mimeType: "image/jpeg", buffer: await photo("#7a6a5a") },
    { name: "base.jpg", mimeType: "image/jpeg", buffer: await photo("#4a5a6a") },
  ]);
  await expect(page.getByTestId("photo-item").and(page.locator('[data-status="queued"]'))).toHaveCount(2);
  await page.getByRole("button", { name: "Save and check" }).click();
  await expect(page.getByRole("status").filter({ hasText: `${tagA} saved on this phone — waiting to send` })).toBeVisible();
  // The phone checks it at once from the library it kept, clearly marked as not the stored check.
  await expect(page.getByTestId("provisional-check")).toContainText("Provisional — the server's check is the one stored");
  await expect(page.getByTestId("provisional-check")).toContainText(/Provisional check \(on this phone\)/);
  for (const [tag, ext] of [[tagB, "2700"], [tagC, "2800"]] as const) {
    await page.getByRole("button", { name: "Log another member" }).click();
    await fillMember(page, tag, ext);
    await page.getByRole("button", { name: "Save and check" }).click();
    await expect(page.getByRole("status").filter({ hasText: `${tag} saved on this phone — waiting to send` })).toBeVisible();
  }

  // The inspection, from the kept checklist.
  await page.goto(`/sites/${siteId}/members/${inspectedId}/inspect`);
  await expect(page.getByTestId("offline-banner")).toBeVisible();
  const passes = page.locator("label").filter({ hasText: /Pass —/ });
  await expect(passes).toHaveCount(7);
  for (const label of await passes.all()) await label.click();
  await page.locator("label").filter({ hasText: "Passed" }).click();
  await page.getByRole("button", { name: "Record inspection" }).click();
  await expect(page.getByText(/saved on this phone — waiting to send/)).toBeVisible();

  // A send cut short by the page going away leaves its item marked "sending" in IndexedDB;
  // the reload must show it waiting again, not stuck half-sent.
  await page.evaluate(
    () =>
      new Promise<void>((resolve, reject) => {
        const open = indexedDB.open("strutwise-outbox");
        open.onerror = () => reject(open.error);
        open.onsuccess = () => {
          const tx = open.result.transaction("items", "readwrite");
          const all = tx.objectStore("items").getAll();
          all.onsuccess = () => {
            const oldest = (all.result as { queuedAt: string }[]).sort((a, b) => a.queuedAt.localeCompare(b.queuedAt))[0];
            if (oldest) tx.objectStore("items").put({ ...oldest, status: "sending", step: "Sending photos", progress: 0.5 });
          };
          tx.oncomplete = () => {
            open.result.close();
            resolve();
          };
          tx.onerror = () => reject(tx.error);
        };
      }),
  );

  // A reload (or a flat battery) loses nothing: four entries wait, with their photos.
  await page.reload();
  await expect(page.getByTestId("outbox-count")).toHaveText("4");
  await page.getByTestId("outbox-badge").click();
  await expect(page.getByTestId("outbox-item")).toHaveCount(4);
  await expect(page.getByTestId("outbox-item").filter({ hasText: `Member ${tagA}` })).toContainText("2 photos");
  await expect(page.getByTestId("outbox-item").first()).toContainText("Waiting for signal");
  await page.getByRole("button", { name: "Send now" }).click();
  await expect(page.getByText(/No signal: the entries wait/)).toBeVisible();
  expect(await membersTagged(page, siteId, tagA)).toHaveLength(0);

  // Meanwhile someone at the desk logs a member with C's tag.
  const taken = await page.request.post(`/api/v1/sites/${siteId}/members`, {
    data: { tag: tagC, memberTypeId: propD, extensionMm: 2400, loadN: 5000 },
    headers: { origin: new URL(page.url()).origin },
  });
  expect(taken.status()).toBe(201);

  // Signal again: everything is sent by itself, in order; C stays with the server's reason.
  await goOnline(context);
  await expect(page.getByTestId("outbox-count")).toHaveText("1", { timeout: 60_000 });
  const refused = page.getByTestId("outbox-item");
  await expect(refused).toHaveAttribute("data-status", "refused");
  await expect(refused.getByTestId("outbox-reason")).toContainText(`${tagC} is already on this site's register`);

  // Exactly once on the server, through the API, with photos and thumbnails.
  expect(await membersTagged(page, siteId, tagB)).toHaveLength(1);
  expect(await membersTagged(page, siteId, tagC)).toHaveLength(1);
  const [a] = await membersTagged(page, siteId, tagA);
  expect(a).toBeDefined();
  expect(await membersTagged(page, siteId, tagA)).toHaveLength(1);
  const detail = (await (await page.request.get(`/api/v1/members/${a!.id}`)).json()) as { photos: { thumbnailUrl: string | null }[] };
  expect(detail.photos).toHaveLength(2);
  for (const p of detail.photos) {
    expect(p.thumbnailUrl).toBeTruthy();
    expect((await page.request.get(p.thumbnailUrl!)).status()).toBe(200);
  }
  const after = ((await (await page.request.get(`/api/v1/members/${inspectedId}/inspections`)).json()) as { items: unknown[] }).items.length;
  expect(after).toBe(inspectionsBefore + 1);

  // Fix C's tag from the list and resend: it arrives, once.
  const fixed = `${tagC}2`;
  await refused.getByLabel("Tag").fill(fixed);
  await refused.getByRole("button", { name: "Fix and resend" }).click();
  await expect(page.getByTestId("outbox-badge")).toHaveCount(0, { timeout: 30_000 });
  expect(await membersTagged(page, siteId, fixed)).toHaveLength(1);
  expect(await membersTagged(page, siteId, tagC)).toHaveLength(1);
});
