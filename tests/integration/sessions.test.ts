// Sessions end when they should (OWASP ASVS 4.0.3 V3.3.1: logout invalidates the session on the
// server), cookies carry the right flags, and invitation sending is rate limited in PostgreSQL.
import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { db, sql } from "@/db";
import { organisations, users } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { APP_URL, DEMO_PASSWORD, signInAs, type Client } from "../support/http";
import { ORCHARD, site, uniqueTag } from "../support/fixtures";

afterAll(async () => {
  await sql.end({ timeout: 5 });
});

async function signOut(c: Client) {
  const { csrfToken } = (await (await c.fetch("/api/auth/csrf")).json()) as { csrfToken: string };
  const res = await c.fetch("/api/auth/signout", {
    method: "POST",
    headers: { "content-type": "application/x-www-form-urlencoded" },
    body: new URLSearchParams({ csrfToken, json: "true" }),
  });
  expect([200, 302]).toContain(res.status);
}

describe("signing out", () => {
  it("ends that session on the server: a kept copy of its cookie is refused; the person's other session goes on", async () => {
    const phone = await signInAs("engineer@demo.example");
    const desk = await signInAs("engineer@demo.example");
    expect((await phone.fetch("/api/v1/me")).status).toBe(200);
    await signOut(phone);
    // The client keeps the cookie it had before signing out, as a stolen copy would.
    expect((await phone.fetch("/api/v1/me")).status).toBe(401);
    const page = await phone.fetch("/sites");
    expect(page.status).toBe(307);
    expect(page.headers.get("location")).toContain("/sign-in");
    expect((await desk.fetch("/api/v1/me")).status).toBe(200);
  });
});

describe("the session cookie as sent", () => {
  it("is HttpOnly and SameSite=Lax (and not Secure on this plain-http test address)", async () => {
    const csrf = await fetch(`${APP_URL}/api/auth/csrf`);
    const jar = csrf.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
    const { csrfToken } = (await csrf.json()) as { csrfToken: string };
    const res = await fetch(`${APP_URL}/api/auth/callback/credentials`, {
      method: "POST",
      headers: { "content-type": "application/x-www-form-urlencoded", cookie: jar },
      body: new URLSearchParams({ csrfToken, email: "manager@demo.example", password: DEMO_PASSWORD, json: "true" }),
      redirect: "manual",
    });
    const session = res.headers.getSetCookie().find((c) => c.includes("session-token="));
    expect(session, "a session cookie was set").toBeTruthy();
    expect(session).toMatch(/;\s*HttpOnly/i);
    expect(session).toMatch(/;\s*SameSite=Lax/i);
    expect(session).not.toMatch(/;\s*Secure/i);
  });
});

describe("invitation sending", () => {
  it("is limited to 30 an hour per admin, counted in the database (429 with a sentence after that)", async () => {
    const orchard = await site(ORCHARD);
    const [org] = await db.select().from(organisations).where(eq(organisations.id, orchard.organisationId));
    const email = `${uniqueTag("admin")}@demo.example`.toLowerCase();
    await db.insert(users).values({ organisationId: org!.id, email, name: "Rate Limit Admin", passwordHash: await hashPassword(DEMO_PASSWORD), isOrgAdmin: true });
    const admin = await signInAs(email);
    const invite = (i: number) =>
      admin.json<{ error?: { code: string; message: string } }>(`/api/v1/sites/${orchard.id}/invitations`, {
        method: "POST",
        body: { email: `${uniqueTag("invitee")}-${i}@invited.example`.toLowerCase(), roles: ["engineer"] },
      });
    for (let i = 0; i < 30; i++) expect((await invite(i)).status, `invitation ${i + 1}`).toBe(201);
    const over = await invite(30);
    expect(over.status).toBe(429);
    expect(over.body.error?.message).toMatch(/30 invitations in the last hour/);
  }, 120_000);
});
