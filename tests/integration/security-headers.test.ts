// Security headers on every page and API answer, the Origin check on cookie-carrying writes, and
// request body limits (OWASP ASVS 4.0.3 V14.4 HTTP security headers, V13.2 / V4.2.2 CSRF, V13.1.3
// request size). Runs against the real app over HTTP.
import { afterAll, describe, expect, it } from "vitest";
import { sql } from "@/db";
import { anonymous, APP_URL, signInAs } from "../support/http";

afterAll(async () => {
  await sql.end({ timeout: 5 });
});

const photoCount = async () => Number((await sql`select count(*)::int as n from photos`)[0]!.n);

describe("security headers", () => {
  it("a page carries a nonce-based CSP, frame-ancestors 'none' and the rest, and its scripts carry the nonce", async () => {
    const res = await anonymous().fetch("/sign-in");
    expect(res.status).toBe(200);
    const csp = res.headers.get("content-security-policy") ?? "";
    const nonce = /'nonce-([^']+)'/.exec(csp)?.[1];
    expect(nonce, `CSP was: ${csp}`).toBeTruthy();
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("object-src 'none'");
    expect(csp).not.toMatch(/script-src[^;]*'unsafe-inline'/);
    // Photos are shown from, and uploaded to, the configured store and nowhere else.
    const store = new URL(process.env.S3_ENDPOINT ?? "http://127.0.0.1:4579").origin;
    expect(csp).toMatch(new RegExp(`img-src[^;]*${store.replace(/[.:/]/g, "\\$&")}`));
    expect(csp).toMatch(new RegExp(`connect-src[^;]*${store.replace(/[.:/]/g, "\\$&")}`));
    expect(res.headers.get("x-frame-options")).toBe("DENY");
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
    expect(res.headers.get("referrer-policy")).toBe("strict-origin-when-cross-origin");
    expect(res.headers.get("permissions-policy")).toContain("camera=(self)");
    // The test app is served over plain http, so no HSTS (it would pin a local address to https).
    expect(res.headers.get("strict-transport-security")).toBeNull();
    const html = await res.text();
    const scripts = [...html.matchAll(/<script\b[^>]*>/g)].map((m) => m[0]);
    expect(scripts.length).toBeGreaterThan(0);
    for (const tag of scripts) expect(tag, tag).toContain(`nonce="${nonce}"`);
  });

  it("each page answer has its own nonce", async () => {
    const a = (await anonymous().fetch("/sign-in")).headers.get("content-security-policy");
    const b = (await anonymous().fetch("/sign-in")).headers.get("content-security-policy");
    expect(a).not.toBe(b);
  });

  it("API answers are never cached and carry the same framing and sniffing rules", async () => {
    const coordinator = await signInAs("coordinator@demo.example");
    const res = await coordinator.fetch("/api/v1/sites");
    expect(res.status).toBe(200);
    expect(res.headers.get("cache-control")).toContain("no-store");
    expect(res.headers.get("x-frame-options")).toBe("DENY");
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
    const unauth = await anonymous().fetch("/api/v1/sites");
    expect(unauth.status).toBe(401);
    expect(unauth.headers.get("cache-control")).toContain("no-store");
  });
});

describe("cross-site writes with a session cookie", () => {
  it("a write from another site's page is refused with 403 and changes nothing; our own origin passes", async () => {
    const engineer = await signInAs("engineer@demo.example");
    const sites = (await engineer.json<{ items: { id: string }[] }>("/api/v1/sites")).body.items;
    const siteId = sites[0]!.id;
    const body = { contentType: "image/jpeg", size: 1000 };
    const before = await photoCount();
    const evil = await engineer.json<{ error: { code: string; message: string } }>(`/api/v1/sites/${siteId}/photos`, {
      method: "POST",
      headers: { origin: "https://attacker.example" },
      body,
    });
    expect(evil.status).toBe(403);
    expect(evil.body.error.code).toBe("cross_origin");
    expect(evil.body.error.message).toMatch(/another site/);
    expect(await photoCount()).toBe(before);
    const own = await engineer.json<{ photoId: string }>(`/api/v1/sites/${siteId}/photos`, {
      method: "POST",
      headers: { origin: new URL(APP_URL).origin },
      body,
    });
    expect(own.status).toBe(201);
    expect(own.body.photoId).toMatch(/^[0-9a-f-]{36}$/);
  });

  it("reads from another origin are not affected (no state changes)", async () => {
    const engineer = await signInAs("engineer@demo.example");
    const res = await engineer.fetch("/api/v1/me", { headers: { origin: "https://attacker.example" } });
    expect(res.status).toBe(200);
  });
});

describe("request body limits", () => {
  it("a JSON body over the limit is a 413 with a sentence, before anything is read or stored", async () => {
    const engineer = await signInAs("engineer@demo.example");
    const sites = (await engineer.json<{ items: { id: string }[] }>("/api/v1/sites")).body.items;
    const huge = JSON.stringify({ tag: "X", notes: "x".repeat(300 * 1024) });
    const res = await engineer.fetch(`/api/v1/sites/${sites[0]!.id}/members`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: huge,
    });
    expect(res.status).toBe(413);
    const body = (await res.json()) as { error: { code: string; message: string } };
    expect(body.error.code).toBe("too_large");
    expect(body.error.message).toMatch(/at most 256 KB/);
    const list = await engineer.json<{ items: { tag: string }[] }>(`/api/v1/sites/${sites[0]!.id}/members?q=X&limit=200`);
    expect(list.body.items.some((m) => m.tag === "X")).toBe(false);
  });

  it("a photo declaration has a small limit of its own; a CSV import a larger one", async () => {
    const engineer = await signInAs("engineer@demo.example");
    const sites = (await engineer.json<{ items: { id: string }[] }>("/api/v1/sites")).body.items;
    const declaration = await engineer.fetch(`/api/v1/sites/${sites[0]!.id}/photos`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ contentType: "image/jpeg", size: 10, pad: "y".repeat(20 * 1024) }),
    });
    expect(declaration.status).toBe(413);
    const csv = "tag,zone\n" + "A,B\n".repeat(700_000);
    const imp = await engineer.fetch(`/api/v1/sites/${sites[0]!.id}/members/import`, {
      method: "POST",
      headers: { "content-type": "text/csv" },
      body: csv,
    });
    expect(imp.status).toBe(413);
    expect(((await imp.json()) as { error: { message: string } }).error.message).toMatch(/CSV import/);
  });
});
