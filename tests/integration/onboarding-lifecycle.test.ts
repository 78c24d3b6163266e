// What users notice about invitations, sessions and passwords: links work once and for a
// limited time, a removed or deactivated person loses access on their very next request, and a
// password reset never reveals whether an address has an account.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "@/db";
import { anonymous, signInAs, type Client } from "../support/http";
import { countOutbox, freshEmail, GOOD_PASSWORD, invitePerson, latestLink } from "../support/fixtures";

let admin: Client;
let siteId: string;

beforeAll(async () => {
  admin = await signInAs("admin@demo.example");
  const sites = await admin.json<{ items: { id: string; name: string }[] }>("/api/v1/sites");
  siteId = sites.body.items.find((s) => s.name.startsWith("Orchard"))!.id;
});

afterAll(async () => {
  await sql.end({ timeout: 5 });
});

async function invite(roles: string[], email = freshEmail("inv")) {
  const r = await admin.json<{ invitation: { id: string } }>(`/api/v1/sites/${siteId}/invitations`, { method: "POST", body: { email, roles } });
  expect(r.status).toBe(201);
  const { token, text, subject } = await latestLink({ email, kind: "invitation" });
  return { email, id: r.body.invitation.id, token: token!, text, subject };
}

const accept = (token: string, body: unknown = { name: "New Person", password: GOOD_PASSWORD }, client: Client = anonymous()) =>
  client.json<{ error?: { code: string; message: string; fields?: Record<string, string> }; user?: { email: string }; roles?: string[] }>(
    `/api/v1/invitations/${token}/accept`,
    { method: "POST", body },
  );

describe("invitations", () => {
  it("e-mails a link with a 32-byte token that is stored only hashed", async () => {
    const inv = await invite(["engineer"]);
    expect(inv.subject).toMatch(/invited to Orchard Row Basement/);
    expect(inv.text).toMatch(/Site engineer/);
    expect(Buffer.from(inv.token, "base64url")).toHaveLength(32);
    const rows = await sql<{ token_hash: string }[]>`select token_hash from invitations where id = ${inv.id}`;
    expect(rows[0]!.token_hash).not.toContain(inv.token);
    expect(rows[0]!.token_hash).toMatch(/^[0-9a-f]{64}$/);
  });

  it("creates the account once: the new person signs in with their site roles, and the link cannot be reused", async () => {
    const inv = await invite(["engineer", "supervisor"]);
    const first = await accept(inv.token, { name: "Ines Marlow", password: GOOD_PASSWORD });
    expect(first.status).toBe(201);
    const person = await signInAs(inv.email, GOOD_PASSWORD);
    const sites = await person.json<{ items: { id: string; roles: string[] }[] }>("/api/v1/sites");
    expect(sites.body.items).toHaveLength(1);
    expect(sites.body.items[0]).toMatchObject({ id: siteId });
    expect(sites.body.items[0]!.roles.sort()).toEqual(["engineer", "supervisor"]);
    const again = await accept(inv.token, { name: "Someone Else", password: "gravel otter lantern 91" });
    expect(again.status).toBe(410);
    expect(again.body.error).toMatchObject({ code: "invitation_accepted", message: expect.stringMatching(/already been used/) });
  });

  it("refuses a weak password with the reason and stores nothing; the link still works afterwards", async () => {
    const inv = await invite(["designer"]);
    const weak = await accept(inv.token, { name: "Rui Costa", password: "password1234" });
    expect(weak.status).toBe(422);
    expect(weak.body.error!.fields).toHaveProperty("password");
    const short = await accept(inv.token, { name: "Rui Costa", password: "short" });
    expect(short.body.error!.fields!.password).toMatch(/at least 12 characters/);
    const [row] = await sql<{ n: number }[]>`select count(*)::int as n from users where email = ${inv.email}`;
    expect(row!.n).toBe(0);
    expect((await accept(inv.token, { name: "Rui Costa", password: GOOD_PASSWORD })).status).toBe(201);
  });

  it("an expired link is refused with a clear message", async () => {
    const inv = await invite(["manager"]);
    await sql`update invitations set expires_at = now() - interval '1 minute' where id = ${inv.id}`;
    const r = await accept(inv.token);
    expect(r.status).toBe(410);
    expect(r.body.error).toMatchObject({ code: "invitation_expired", message: expect.stringMatching(/expired/) });
    const page = await anonymous().fetch(`/invite/${inv.token}`);
    expect(await page.text()).toMatch(/has expired/);
  });

  it("expires 7 days after it is sent", async () => {
    const inv = await invite(["manager"]);
    const [row] = await sql<{ days: number }[]>`select extract(epoch from expires_at - created_at) / 86400 as days from invitations where id = ${inv.id}`;
    expect(Number(row!.days)).toBeCloseTo(7, 2);
  });

  it("a revoked link is refused; a re-sent invitation works only with the new link", async () => {
    const revoked = await invite(["engineer"]);
    expect((await admin.json(`/api/v1/sites/${siteId}/invitations/${revoked.id}`, { method: "DELETE" })).status).toBe(200);
    const r = await accept(revoked.token);
    expect(r.status).toBe(410);
    expect(r.body.error).toMatchObject({ code: "invitation_revoked" });

    const resent = await invite(["engineer"]);
    expect((await admin.json(`/api/v1/sites/${siteId}/invitations/${resent.id}/resend`, { method: "POST" })).status).toBe(200);
    const fresh = await latestLink({ email: resent.email, kind: "invitation" });
    expect(fresh.token).not.toBe(resent.token);
    expect((await accept(resent.token)).status).toBe(404);
    expect((await accept(fresh.token!)).status).toBe(201);
  });

  it("someone who already has an account signs in first and just gains the roles", async () => {
    const inv = await invite(["manager"], "designer@demo.example");
    const anon = await accept(inv.token, {});
    expect(anon.status).toBe(401);
    expect(anon.body.error!.message).toMatch(/already have an account/);
    const wrongPerson = await accept(inv.token, {}, await signInAs("manager@demo.example"));
    expect(wrongPerson.status).toBe(401);
    const designer = await signInAs("designer@demo.example");
    const ok = await accept(inv.token, {}, designer);
    expect(ok.status).toBe(200);
    const people = await admin.json<{ items: { email: string; roles: string[] }[] }>(`/api/v1/sites/${siteId}/people`);
    expect(people.body.items.find((p) => p.email === "designer@demo.example")!.roles.sort()).toEqual(["designer", "manager"]);
    // Put the demo back as it was.
    expect((await admin.json(`/api/v1/sites/${siteId}/people/${(await designer.json<{ user: { id: string } }>("/api/v1/me")).body.user.id}`, { method: "PUT", body: { roles: ["designer"] } })).status).toBe(200);
  });
});

describe("a change takes effect on the person's very next request", () => {
  it("losing a role or the site ends that access in a live session", async () => {
    const p = await invitePerson({ admin, siteId, roles: ["engineer"], what: "live" });
    const members = `/api/v1/sites/${siteId}/members`;
    expect((await p.client.json(`/api/v1/sites/${siteId}`)).status).toBe(200);
    // An engineer may log members; as a site manager only, the same session may not.
    expect((await p.client.json(members, { method: "POST", body: {} })).status).toBe(422);
    expect((await admin.json(`/api/v1/sites/${siteId}/people/${p.userId}`, { method: "PUT", body: { roles: ["manager"] } })).status).toBe(200);
    expect((await p.client.json(members, { method: "POST", body: {} })).status).toBe(403);
    expect((await admin.json(`/api/v1/sites/${siteId}/people/${p.userId}`, { method: "DELETE" })).status).toBe(204);
    expect((await p.client.json(`/api/v1/sites/${siteId}`)).status).toBe(404);
    expect((await p.client.fetch(`/sites/${siteId}`)).status).toBe(404);
  });

  it("deactivation signs the person out of every device and refuses sign-in; reactivation needs a new sign-in", async () => {
    const p = await invitePerson({ admin, siteId, roles: ["supervisor"], what: "gone" });
    const secondDevice = await signInAs(p.email, GOOD_PASSWORD);
    expect((await admin.json(`/api/v1/people/${p.userId}/deactivate`, { method: "POST" })).status).toBe(200);
    for (const device of [p.client, secondDevice]) {
      expect((await device.json("/api/v1/me")).status).toBe(401);
      const page = await device.fetch(`/sites/${siteId}`);
      expect(page.status).toBe(307);
    }
    await expect(signInAs(p.email, GOOD_PASSWORD)).rejects.toThrow(/failed/);
    expect((await admin.json(`/api/v1/people/${p.userId}/reactivate`, { method: "POST" })).status).toBe(200);
    expect((await p.client.json("/api/v1/me")).status).toBe(401);
    const back = await signInAs(p.email, GOOD_PASSWORD);
    expect((await back.json(`/api/v1/sites/${siteId}`)).status).toBe(200);
  });
});

describe("passwords", () => {
  it("a reset request gets the same answer whether or not the address exists, and only a real account is e-mailed", async () => {
    const p = await invitePerson({ admin, siteId, roles: ["engineer"], what: "reset" });
    const unknown = freshEmail("nobody");
    const a = await anonymous().json("/api/v1/password-resets", { method: "POST", body: { email: p.email } });
    const b = await anonymous().json("/api/v1/password-resets", { method: "POST", body: { email: unknown } });
    expect(a.status).toBe(202);
    expect(b.status).toBe(202);
    expect(a.body).toEqual(b.body);
    expect(await countOutbox({ email: p.email, kind: "password_reset" })).toBe(1);
    expect(await countOutbox({ email: unknown, kind: "password_reset" })).toBe(0);
  });

  it("the link sets a new password once, ends old sessions, and refuses weak passwords without using up the link", async () => {
    const p = await invitePerson({ admin, siteId, roles: ["engineer"], what: "reset2" });
    await anonymous().json("/api/v1/password-resets", { method: "POST", body: { email: p.email.toUpperCase() } });
    const { token } = await latestLink({ email: p.email, kind: "password_reset" });
    expect(token).toBeTruthy();
    const weak = await anonymous().json<{ error: { fields: Record<string, string> } }>(`/api/v1/password-resets/${token}`, { method: "POST", body: { password: "qwertyuiop12" } });
    expect(weak.status).toBe(422);
    expect(weak.body.error.fields).toHaveProperty("password");
    const ok = await anonymous().json(`/api/v1/password-resets/${token}`, { method: "POST", body: { password: "gravel otter lantern 91" } });
    expect(ok.status).toBe(200);
    const again = await anonymous().json<{ error: { code: string } }>(`/api/v1/password-resets/${token}`, { method: "POST", body: { password: "another fine phrase 55" } });
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe("reset_used");
    expect((await p.client.json("/api/v1/me")).status).toBe(401);
    await expect(signInAs(p.email, GOOD_PASSWORD)).rejects.toThrow(/failed/);
    expect((await (await signInAs(p.email, "gravel otter lantern 91")).json("/api/v1/me")).status).toBe(200);
  });

  it("a reset link expires after 1 hour", async () => {
    const p = await invitePerson({ admin, siteId, roles: ["engineer"], what: "reset3" });
    await anonymous().json("/api/v1/password-resets", { method: "POST", body: { email: p.email } });
    const { token } = await latestLink({ email: p.email, kind: "password_reset" });
    const [row] = await sql<{ minutes: number }[]>`select extract(epoch from expires_at - created_at) / 60 as minutes from password_resets where user_id = ${p.userId}`;
    expect(Number(row!.minutes)).toBeCloseTo(60, 0);
    await sql`update password_resets set expires_at = now() - interval '1 second' where user_id = ${p.userId}`;
    const r = await anonymous().json<{ error: { code: string } }>(`/api/v1/password-resets/${token}`, { method: "POST", body: { password: "gravel otter lantern 91" } });
    expect(r.status).toBe(410);
    expect(r.body.error.code).toBe("reset_expired");
  });

  it("reset requests are throttled per address, known or not", async () => {
    const unknown = freshEmail("flood");
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) statuses.push((await anonymous().json("/api/v1/password-resets", { method: "POST", body: { email: unknown } })).status);
    expect(statuses).toEqual([202, 202, 202, 202, 202, 429]);
  });

  it("changing your own password needs the current one, refuses common ones, and is throttled", async () => {
    const p = await invitePerson({ admin, siteId, roles: ["engineer"], what: "change" });
    const wrong = await p.client.json<{ error: { fields: Record<string, string> } }>("/api/v1/me/password", { method: "POST", body: { currentPassword: "not it at all", newPassword: "gravel otter lantern 91" } });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.fields.currentPassword).toMatch(/not your current password/);
    const common = await p.client.json<{ error: { fields: Record<string, string> } }>("/api/v1/me/password", { method: "POST", body: { currentPassword: GOOD_PASSWORD, newPassword: "password1234" } });
    expect(common.status).toBe(422);
    expect(common.body.error.fields).toHaveProperty("newPassword");
    expect((await p.client.json("/api/v1/me/password", { method: "POST", body: { currentPassword: GOOD_PASSWORD, newPassword: "gravel otter lantern 91" } })).status).toBe(200);
    expect((await p.client.json("/api/v1/me")).status).toBe(200);
    await signInAs(p.email, "gravel otter lantern 91");
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) statuses.push((await p.client.json("/api/v1/me/password", { method: "POST", body: { currentPassword: `guess ${i}`, newPassword: "whatever phrase 1234" } })).status);
    expect(statuses.slice(0, 5)).toEqual([422, 422, 422, 422, 422]);
    expect(statuses[5]).toBe(429);
  });
});

describe("deep links survive sign-in", () => {
  it("a signed-out QR label link goes to sign-in with exactly that address as the way back", async () => {
    const [m] = await sql<{ id: string }[]>`select id from members where site_id = ${siteId} limit 1`;
    for (const path of [`/sites/${siteId}/members/${m!.id}`, `/sites/${siteId}/members/new?tag=ORB-P-999`]) {
      const r = await anonymous().fetch(path);
      expect(r.status).toBe(307);
      const to = new URL(r.headers.get("location")!, "http://x");
      expect(to.pathname).toBe("/sign-in");
      expect(to.searchParams.get("callbackUrl")).toBe(path);
    }
  });

  it("a signed-in person on the sign-in page is sent on only to a same-origin path", async () => {
    const engineer = await signInAs("engineer@demo.example");
    const go = async (cb: string) => (await engineer.fetch(`/sign-in?callbackUrl=${encodeURIComponent(cb)}`)).headers.get("location");
    expect(await go(`/sites/${siteId}/members/new?tag=ORB-P-1`)).toBe(`/sites/${siteId}/members/new?tag=ORB-P-1`);
    for (const evil of ["//evil.example/x", "https://other.example/", "javascript:alert(1)", "/\\evil.example"]) expect(await go(evil)).toBe("/sites");
  });
});
