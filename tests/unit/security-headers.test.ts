// The header rules as pure functions: HSTS only under https, the Origin rule for writes.
import { describe, expect, it } from "vitest";
import { baseSecurityHeaders, bodyLimitFor, contentSecurityPolicy, originAllowed } from "@/lib/security/headers";

describe("HSTS and upgrade-insecure-requests follow APP_URL's scheme", () => {
  it("are present under https and absent under http", () => {
    expect(baseSecurityHeaders({ https: true })["Strict-Transport-Security"]).toMatch(/max-age=\d{7,}/);
    expect(baseSecurityHeaders({ https: false })["Strict-Transport-Security"]).toBeUndefined();
    expect(contentSecurityPolicy({ nonce: "n", storeOrigin: null, https: true, dev: false })).toContain("upgrade-insecure-requests");
    expect(contentSecurityPolicy({ nonce: "n", storeOrigin: null, https: false, dev: false })).not.toContain("upgrade-insecure-requests");
  });
  it("allows eval only for the development server's hot reload", () => {
    expect(contentSecurityPolicy({ nonce: "n", storeOrigin: null, https: false, dev: false })).not.toContain("unsafe-eval");
    expect(contentSecurityPolicy({ nonce: "n", storeOrigin: null, https: false, dev: true })).toContain("unsafe-eval");
  });
});

describe("the Origin rule for cookie-carrying writes", () => {
  const app = "https://register.example";
  const base = { hasCookie: true, appOrigin: app, requestOrigin: app };
  it("refuses another origin and the opaque 'null' origin on writes", () => {
    expect(originAllowed({ ...base, method: "POST", origin: "https://attacker.example" })).toBe(false);
    expect(originAllowed({ ...base, method: "DELETE", origin: "null" })).toBe(false);
    expect(originAllowed({ ...base, method: "PATCH", origin: "https://register.example.attacker.example" })).toBe(false);
  });
  it("allows our own origin, reads, and requests without a cookie", () => {
    expect(originAllowed({ ...base, method: "POST", origin: app })).toBe(true);
    expect(originAllowed({ ...base, method: "GET", origin: "https://attacker.example" })).toBe(true);
    expect(originAllowed({ ...base, hasCookie: false, method: "POST", origin: "https://attacker.example" })).toBe(true);
  });
});

describe("body limits by route", () => {
  it("gives imports, declarations and other JSON their own limits", () => {
    expect(bodyLimitFor("/api/v1/sites/abc/members/import").bytes).toBeGreaterThan(2 * 1024 * 1024);
    expect(bodyLimitFor("/api/v1/sites/abc/photos").bytes).toBe(16 * 1024);
    expect(bodyLimitFor("/api/v1/members/abc/photos").bytes).toBe(16 * 1024);
    expect(bodyLimitFor("/api/v1/sites/abc/members").bytes).toBe(256 * 1024);
  });
});
