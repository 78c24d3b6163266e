// Sign-in, throttling and per-site authorisation against the real database and running app.
import { afterAll, describe, expect, it } from "vitest";
import { sql } from "@/db";
import { checkCredentials, FREE_FAILURES } from "@/lib/auth/sign-in";
import { anonymous, signInAs } from "../support/http";

afterAll(async () => {
  await sql.end({ timeout: 5 });
});

describe("credentials", () => {
  it("accepts the demo password and refuses a wrong one with a clear message", async () => {
    const ok = await checkCredentials({ email: "Engineer@Demo.Example", password: "strutwise-demo" });
    expect(ok).toMatchObject({ ok: true, user: { email: "engineer@demo.example" } });
    const bad = await checkCredentials({ email: "engineer@demo.example", password: "wrong" });
    expect(bad).toMatchObject({ ok: false, reason: "invalid" });
    if (!bad.ok) expect(bad.message).toMatch(/do not match/);
  });

  it("slows down repeated failures: after the free attempts even the right password waits", async () => {
    const email = "designer@demo.example";
    const t0 = new Date();
    for (let i = 0; i < FREE_FAILURES; i++) {
      const r = await checkCredentials({ email, password: `guess-${i}` }, t0);
      expect(r).toMatchObject({ ok: false, reason: "invalid" });
    }
    // One more failure starts a block.
    await checkCredentials({ email, password: "guess-last" }, t0);
    const blocked = await checkCredentials({ email, password: "strutwise-demo" }, new Date(t0.getTime() + 1000));
    expect(blocked).toMatchObject({ ok: false, reason: "blocked" });
    if (!blocked.ok) expect(blocked.message).toMatch(/Too many failed sign-ins.*Wait \d+ s/);
    // Once the block has passed, the right password works again and clears the count.
    const later = await checkCredentials({ email, password: "strutwise-demo" }, new Date(t0.getTime() + 31_000));
    expect(later.ok).toBe(true);
  });

  it("treats unknown addresses like wrong passwords", async () => {
    const r = await checkCredentials({ email: "nobody@demo.example", password: "x" });
    expect(r).toMatchObject({ ok: false, reason: "invalid" });
  });
});

describe("API access", () => {
  it("answers 401 with the error shape when nobody is signed in", async () => {
    const r = await anonymous().json("/api/v1/sites");
    expect(r.status).toBe(401);
    expect(r.body).toEqual({ error: { code: "unauthorized", message: expect.any(String) } });
  });

  it("lists only the signed-in user's sites, with their roles", async () => {
    const coordinator = await signInAs("coordinator@demo.example");
    const r = await coordinator.json<{ items: { name: string; roles: string[] }[] }>("/api/v1/sites");
    expect(r.status).toBe(200);
    expect(r.body.items.map((s) => s.name).sort()).toEqual(["Orchard Row Basement", "Wexcombe Wharf — Block B"]);
    expect(r.body.items.every((s) => s.roles.includes("coordinator"))).toBe(true);
    const me = await coordinator.json<{ user: { email: string; name: string } }>("/api/v1/me");
    expect(me.body.user).toMatchObject({ email: "coordinator@demo.example", name: "Priya Natarajan" });
  });

  it("hides another organisation's site behind 404, and a malformed id too", async () => {
    const demo = await signInAs("manager@demo.example");
    const other = await signInAs("admin@other.example");
    const { body } = await demo.json<{ items: { id: string }[] }>("/api/v1/sites");
    const demoSiteId = body.items[0]!.id;
    expect((await demo.json(`/api/v1/sites/${demoSiteId}`)).status).toBe(200);
    const r = await other.json(`/api/v1/sites/${demoSiteId}`);
    expect(r.status).toBe(404);
    expect(r.body).toMatchObject({ error: { code: "not_found" } });
    expect((await other.json("/api/v1/sites/not-a-uuid")).status).toBe(404);
    const page = await other.fetch(`/sites/${demoSiteId}`);
    expect(page.status).toBe(404);
  });
});
