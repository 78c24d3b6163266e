import { devices, expect, test, type Browser, type Page } from "@playwright/test";
import { mainNav, openSite, signIn } from "./helpers";
import { WHARF } from "../support/demo";
import { INBOX_URL } from "../support/http";

const SITE = WHARF;

// Demo members on Level 2 that are ready to load (passing check, a photo, an in-date passed
// inspection). The phone and desktop projects run at the same time, so each takes its own pair.
const MEMBERS: Record<string, [string, string]> = {
  phone: ["WXW-L2-P02", "WXW-L2-P03"],
  desktop: ["WXW-L2-P04", "WXW-L2-P06"],
};

type Mail = { to: string[]; subject: string; text: string; attachments: { filename: string; contentType: string; size: number }[] };

async function phonePage(browser: Browser): Promise<Page> {
  const ctx = await browser.newContext({ ...devices["Pixel 7"] });
  return ctx.newPage();
}

async function desktopPage(browser: Browser): Promise<Page> {
  const ctx = await browser.newContext({ viewport: { width: 1366, height: 850 } });
  return ctx.newPage();
}

test("an engineer requests a permit to load on a phone, the coordinator issues it on a desktop, the supervisor gets the PDF", async ({ browser }, info) => {
  test.setTimeout(120_000);
  const [m1, m2] = MEMBERS[info.project.name] ?? MEMBERS.desktop!;

  // 1. The engineer, on a phone, finds Permits in the navigation and requests two members.
  const eng = await phonePage(browser);
  await signIn(eng, "engineer@demo.example");
  await openSite(eng, SITE);
  const nav = mainNav(eng);
  const more = nav.getByRole("button", { name: "More" });
  if (await more.isVisible()) await more.click();
  await nav.getByRole("link", { name: "Permits" }).click();
  await expect(eng.getByRole("heading", { level: 1, name: "Permits" })).toBeVisible();
  await eng.getByRole("link", { name: "Request a permit" }).click();
  await expect(eng.getByRole("heading", { level: 1, name: "Request a permit" })).toBeVisible();
  // The failing member cannot be chosen, and the screen says why.
  await eng.getByLabel("Find by tag or zone").fill("WXW-L2");
  await expect(eng.getByRole("checkbox", { name: /WXW-L2-P08/ })).toBeDisabled();
  await expect(eng.getByText(/Fails its check \(\d+ % utilisation\)/).first()).toBeVisible();
  await eng.getByRole("checkbox", { name: new RegExp(m1) }).check();
  await eng.getByRole("checkbox", { name: new RegExp(m2) }).check();
  await eng.getByLabel(/Note for the coordinator/).fill(`Bays ready for the pour (${info.project.name})`);
  await eng.getByRole("button", { name: "Send the permit to load request" }).click();
  await expect(eng.getByRole("heading", { level: 1, name: "Permit to load — request" })).toBeVisible();
  await expect(eng.getByTestId("permit-status")).toHaveText("Requested");
  await expect(eng.getByText("Waiting for the coordinator's review.")).toBeVisible();
  const permitPath = new URL(eng.url()).pathname;

  // 2. The coordinator, at a desk, reviews every member and issues with a condition.
  const coord = await desktopPage(browser);
  await signIn(coord, "coordinator@demo.example");
  await coord.goto(permitPath);
  await expect(coord.getByTestId("review-verdict")).toContainText("Ready to issue");
  for (const tag of [m1, m2]) {
    const row = coord.getByTestId(`review-${tag}`);
    await expect(row).toContainText("Check passes");
    await expect(row).toContainText(/\d+ photos?/);
    await expect(row).toContainText("passed; next due");
  }
  const condition = `Pour bay 1 before bay 2 — ${info.project.name} ${Date.now()}`;
  await coord.getByLabel("Conditions (printed on the permit)").fill(condition);
  await coord.getByRole("button", { name: "Issue permit" }).click();
  const heading = coord.getByRole("heading", { level: 1, name: /^PTL-\d{4}$/ });
  await expect(heading).toBeVisible();
  const label = (await heading.textContent())!.trim();
  await expect(coord.getByTestId("permit-status")).toHaveText("Issued");
  await expect(coord.getByText(condition)).toBeVisible();
  for (const tag of [m1, m2]) await expect(coord.getByTestId(`scope-${tag}`).getByTestId("member-state")).toHaveText("Loaded");
  await expect(coord.getByRole("link", { name: /Open PDF/ })).toBeVisible();

  // 3. The worker delivers the e-mail with the PDF to the supervisor (and the requester).
  await expect
    .poll(
      async () => {
        const mails = (await (await fetch(`${INBOX_URL}/api/email`)).json()) as Mail[];
        const m = mails.find((x) => x.subject.startsWith(`${label} issued`) && x.to.includes("supervisor@demo.example"));
        return m ? m.attachments.map((a) => `${a.filename} ${a.contentType} ${a.size > 1000 ? "non-empty" : "empty"}`) : null;
      },
      { timeout: 30_000, message: `the supervisor's e-mail for ${label}` },
    )
    .toEqual([`${label}.pdf application/pdf non-empty`]);

  // 4. The permit page shows the delivery, and the members show their new state.
  await expect(coord.getByTestId("email-delivery").filter({ hasText: "supervisor@demo.example" })).toContainText("Sent", { timeout: 20_000 });
  const pdf = await coord.request.get(`/api/v1/permits/${permitPath.split("/").pop()}/pdf`);
  expect(pdf.status()).toBe(200);
  expect(pdf.headers()["content-type"]).toBe("application/pdf");

  await eng.reload();
  await expect(eng.getByTestId("permit-status")).toHaveText("Issued");
  await eng.getByRole("link", { name: m1, exact: true }).click();
  await expect(eng.getByRole("heading", { level: 1, name: new RegExp(m1) })).toBeVisible();
  await expect(eng.getByTestId("member-status")).toHaveText("Loaded");

  await eng.context().close();
  await coord.context().close();
});
