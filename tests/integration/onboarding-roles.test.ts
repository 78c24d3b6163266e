// Every onboarding and administration route × every role, the other organisation and nobody
// signed in, in the house order: 401 → 404 → 403 → 422. Runs against the demo seed.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "@/db";
import { anonymous, signInAs, type Client } from "../support/http";
import { freshEmail, invitePerson } from "../support/fixtures";

const ROLES = ["engineer", "coordinator", "supervisor", "designer", "manager"] as const;
let admin: Client;
let other: Client;
let byRole: Record<(typeof ROLES)[number], Client>;
let siteId: string;

beforeAll(async () => {
  admin = await signInAs("admin@demo.example");
  other = await signInAs("admin@other.example");
  byRole = Object.fromEntries(await Promise.all(ROLES.map(async (r) => [r, await signInAs(`${r}@demo.example`)]))) as typeof byRole;
  const sites = await admin.json<{ items: { id: string; name: string }[] }>("/api/v1/sites");
  siteId = sites.body.items.find((s) => s.name.startsWith("Wexcombe"))!.id;
});

afterAll(async () => {
  await sql.end({ timeout: 5 });
});

type Call = { method: string; path: () => string; body?: unknown; okStatus: number; bad?: unknown };

/** Runs one route through nobody, the other organisation, each non-admin role, then the admin. */
async function matrix(c: Call, { adminOnly = true }: { adminOnly?: boolean } = {}) {
  const init = { method: c.method, body: c.body };
  expect((await anonymous().json(c.path(), init)).status, "nobody signed in").toBe(401);
  const o = await other.json(c.path(), init);
  expect(o.status, "another organisation's admin").toBe(404);
  expect(o.body).toMatchObject({ error: { code: "not_found" } });
  if (adminOnly)
    for (const r of ROLES) {
      const res = await byRole[r].json(c.path(), init);
      expect(res.status, `${r}`).toBe(403);
      expect(res.body).toMatchObject({ error: { code: "forbidden", message: expect.stringMatching(/admin/) } });
    }
  if (c.bad !== undefined) {
    const bad = await admin.json<{ error: { fields: Record<string, string> } }>(c.path(), { method: c.method, body: c.bad });
    expect(bad.status, "bad input").toBe(422);
    expect(Object.keys(bad.body.error.fields).length).toBeGreaterThan(0);
  }
  const ok = await admin.json(c.path(), init);
  expect(ok.status, `admin: ${JSON.stringify(ok.body)}`).toBe(c.okStatus);
  return ok;
}

describe("sites", () => {
  it("POST /api/v1/sites: only organisation admins add a site; bad input names each field and stores nothing", async () => {
    expect((await anonymous().json("/api/v1/sites", { method: "POST", body: {} })).status).toBe(401);
    for (const r of ROLES) expect((await byRole[r].json("/api/v1/sites", { method: "POST", body: { name: "X site", code: "XS1", units: "si", basis: "eurocode" } })).status, r).toBe(403);
    const before = (await admin.json<{ items: unknown[] }>("/api/v1/sites")).body.items.length;
    const bad = await admin.json<{ error: { fields: Record<string, string> } }>("/api/v1/sites", {
      method: "POST",
      body: { name: "", code: "no spaces!", units: "metric", basis: "bs5950", inspectionIntervalDays: 0, timezone: "Mars/Olympus" },
    });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(["basis", "code", "inspectionIntervalDays", "name", "timezone", "units"]);
    expect((await admin.json<{ items: unknown[] }>("/api/v1/sites")).body.items.length).toBe(before);

    const code = `T${Date.now().toString(36).slice(-6).toUpperCase()}`;
    const created = await admin.json<{ site: Record<string, unknown> }>("/api/v1/sites", {
      method: "POST",
      body: { name: "Quayside Annexe", code, address: "1 Quay Lane", units: "us", basis: "aisc", inspectionIntervalDays: 5, permitValidityDays: 3, permitWarningHours: 12, timezone: "America/Chicago" },
    });
    expect(created.status).toBe(201);
    expect(created.body.site).toMatchObject({ name: "Quayside Annexe", code, units: "us", basis: "aisc", inspectionIntervalDays: 5, permitValidityDays: 3, permitWarningHours: 12, timezone: "America/Chicago", archived: false });
    const dup = await admin.json("/api/v1/sites", { method: "POST", body: { name: "Another", code, units: "si", basis: "eurocode" } });
    expect(dup.status).toBe(409);
  });

  it("PATCH /api/v1/sites/{id}: admins change policies; others 403, another organisation 404", async () => {
    const ok = await matrix({ method: "PATCH", path: () => `/api/v1/sites/${siteId}`, body: { inspectionIntervalDays: 7 }, bad: { permitValidityDays: 0, units: "imperial" }, okStatus: 200 });
    expect(ok.body).toMatchObject({ site: { inspectionIntervalDays: 7 } });
    expect((await admin.json(`/api/v1/sites/${siteId}`, { method: "PATCH", body: {} })).status).toBe(422);
  });

  it("archiving makes a site read-only and hides it from lists, keeping its data; restoring undoes both", async () => {
    const code = `A${Date.now().toString(36).slice(-6).toUpperCase()}`;
    const made = await admin.json<{ site: { id: string } }>("/api/v1/sites", { method: "POST", body: { name: "Short-lived Yard", code, units: "si", basis: "eurocode" } });
    const id = made.body.site.id;
    const invited = await admin.json(`/api/v1/sites/${id}/invitations`, { method: "POST", body: { email: freshEmail("arch"), roles: ["engineer"] } });
    expect(invited.status).toBe(201);
    expect((await admin.json(`/api/v1/sites/${id}`, { method: "PATCH", body: { archived: true } })).body).toMatchObject({ site: { archived: true } });
    const listed = await admin.json<{ items: { id: string }[] }>("/api/v1/sites");
    expect(listed.body.items.map((s) => s.id)).not.toContain(id);
    const all = await admin.json<{ items: { id: string; archived: boolean }[] }>("/api/v1/sites?archived=include");
    expect(all.body.items.find((s) => s.id === id)).toMatchObject({ archived: true });
    // Read-only: a write is refused with the reason; reading still works and the invitation is kept.
    const write = await admin.json<{ error: { message: string } }>(`/api/v1/sites/${id}/invitations`, { method: "POST", body: { email: freshEmail("arch"), roles: ["engineer"] } });
    expect(write.status).toBe(409);
    expect(write.body.error.message).toMatch(/archived and read-only/);
    const zone = await admin.json<{ error: { message: string } }>(`/api/v1/sites/${id}/zones`, { method: "POST", body: { name: "Level 1" } });
    expect(zone.status).toBe(409);
    expect((await admin.json<{ items: unknown[] }>(`/api/v1/sites/${id}/zones`)).body.items).toHaveLength(0);
    const pending = await admin.json<{ items: unknown[] }>(`/api/v1/sites/${id}/invitations`);
    expect(pending.status).toBe(200);
    expect(pending.body.items).toHaveLength(1);
    expect((await admin.json(`/api/v1/sites/${id}`, { method: "PATCH", body: { archived: false } })).body).toMatchObject({ site: { archived: false } });
    expect((await admin.json<{ items: { id: string }[] }>("/api/v1/sites")).body.items.map((s) => s.id)).toContain(id);
  });
});

describe("invitations", () => {
  it("POST and GET /api/v1/sites/{id}/invitations: admins only", async () => {
    const email = freshEmail("matrix");
    await matrix({ method: "POST", path: () => `/api/v1/sites/${siteId}/invitations`, body: { email, roles: ["engineer"] }, bad: { email: "not-an-address", roles: ["foreman"] }, okStatus: 201 });
    const list = await matrix({ method: "GET", path: () => `/api/v1/sites/${siteId}/invitations`, okStatus: 200 });
    expect((list.body as { items: { email: string; state: string }[] }).items.find((i) => i.email === email)).toMatchObject({ state: "pending" });
  });

  it("resend and revoke: admins only; another organisation's invitation is not found", async () => {
    const inv = await admin.json<{ invitation: { id: string } }>(`/api/v1/sites/${siteId}/invitations`, { method: "POST", body: { email: freshEmail("rr"), roles: ["supervisor"] } });
    const id = inv.body.invitation.id;
    const resent = await matrix({ method: "POST", path: () => `/api/v1/sites/${siteId}/invitations/${id}/resend`, okStatus: 200 });
    expect(resent.body).toMatchObject({ invitation: { state: "pending", sendCount: 2 } });
    const revoked = await matrix({ method: "DELETE", path: () => `/api/v1/sites/${siteId}/invitations/${id}`, okStatus: 200 });
    expect(revoked.body).toMatchObject({ invitation: { state: "revoked" } });
    expect((await admin.json(`/api/v1/sites/${siteId}/invitations/${id}/resend`, { method: "POST" })).status).toBe(409);
    expect((await admin.json(`/api/v1/sites/${siteId}/invitations/not-a-uuid`, { method: "DELETE" })).status).toBe(404);
  });
});

describe("people and roles", () => {
  it("GET, PUT and DELETE /api/v1/sites/{id}/people[/{userId}]: admins only; a person of another organisation is not found", async () => {
    const person = await invitePerson({ admin, siteId, roles: ["engineer"], what: "people" });
    const list = await matrix({ method: "GET", path: () => `/api/v1/sites/${siteId}/people`, okStatus: 200 });
    expect((list.body as { items: { email: string; roles: string[] }[] }).items.find((p) => p.email === person.email)).toMatchObject({ roles: ["engineer"] });
    const put = await matrix({ method: "PUT", path: () => `/api/v1/sites/${siteId}/people/${person.userId}`, body: { roles: ["engineer", "supervisor"] }, bad: { roles: [] }, okStatus: 200 });
    expect(put.body).toMatchObject({ person: { roles: ["engineer", "supervisor"] } });
    const [otherAdmin] = await sql<{ id: string }[]>`select id from users where email = 'admin@other.example'`;
    expect((await admin.json(`/api/v1/sites/${siteId}/people/${otherAdmin!.id}`, { method: "PUT", body: { roles: ["engineer"] } })).status).toBe(404);
    await matrix({ method: "DELETE", path: () => `/api/v1/sites/${siteId}/people/${person.userId}`, okStatus: 204 });
    expect((await admin.json(`/api/v1/sites/${siteId}/people/${person.userId}`, { method: "DELETE" })).status).toBe(404);
  });

  it("deactivate and reactivate: organisation admins only; another organisation's person is not found", async () => {
    const person = await invitePerson({ admin, siteId, roles: ["designer"], what: "deact" });
    const path = () => `/api/v1/people/${person.userId}/deactivate`;
    expect((await anonymous().json(path(), { method: "POST" })).status).toBe(401);
    expect((await other.json(path(), { method: "POST" })).status).toBe(404);
    for (const r of ROLES) expect((await byRole[r].json(path(), { method: "POST" })).status, r).toBe(403);
    expect((await admin.json(path(), { method: "POST" })).body).toMatchObject({ person: { active: false } });
    expect((await admin.json(`/api/v1/people/${person.userId}/reactivate`, { method: "POST" })).body).toMatchObject({ person: { active: true } });
  });

  it("the last admin cannot deactivate themselves", async () => {
    const [me] = await sql<{ id: string }[]>`select id from users where email = 'admin@other.example'`;
    const r = await other.json<{ error: { message: string } }>(`/api/v1/people/${me!.id}/deactivate`, { method: "POST" });
    expect(r.status).toBe(409);
    expect(r.body.error.message).toMatch(/last admin/);
    expect((await other.json("/api/v1/me")).status).toBe(200);
  });
});

describe("public onboarding routes", () => {
  it("the setup route and page are gone once an organisation exists", async () => {
    const body = { organisationName: "Late Arrivals Ltd", name: "Someone", email: freshEmail("setup"), password: "violet harbour crane 47" };
    expect((await anonymous().json("/api/v1/setup", { method: "POST", body })).status).toBe(404);
    expect((await anonymous().fetch("/setup")).status).toBe(404);
    const [row] = await sql<{ n: number }[]>`select count(*)::int as n from users where email = ${body.email}`;
    expect(row!.n).toBe(0);
  });

  it("password routes and invitation acceptance answer 422 for bad input", async () => {
    expect((await anonymous().json("/api/v1/password-resets", { method: "POST", body: { email: "nope" } })).status).toBe(422);
    expect((await anonymous().json("/api/v1/password-resets/short", { method: "POST", body: {} })).status).toBe(422);
    expect((await anonymous().json("/api/v1/me/password", { method: "POST", body: {} })).status).toBe(401);
    const r = await admin.json<{ error: { fields: Record<string, string> } }>("/api/v1/me/password", { method: "POST", body: { currentPassword: "" } });
    expect(r.status).toBe(422);
    expect(Object.keys(r.body.error.fields).sort()).toEqual(["currentPassword", "newPassword"]);
  });
});
