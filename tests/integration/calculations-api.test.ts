// POST /api/v1/calculations: the engine over HTTP for signed-in users.
import { describe, expect, it } from "vitest";
import { anonymous, signInAs } from "../support/http";

describe("POST /api/v1/calculations", () => {
  it("needs a signed-in user", async () => {
    const r = await anonymous().json("/api/v1/calculations", { method: "POST", body: { method: "euler" } });
    expect(r.status).toBe(401);
  });

  it("returns the capacity with its working for a valid request", async () => {
    const c = await signInAs("engineer@demo.example");
    // Euler load of a 48.3 × 4.0 CHS scaffold tube over 3 m, pinned: A and I from EN 10219-2
    // tables (I = 13.8 cm⁴); Ncr = π²·210 000·138 000 / 3000² ≈ 31.8 kN (hand calculation).
    const r = await c.json<{ ok: boolean; capacityN: number; steps: unknown[]; basis: string }>("/api/v1/calculations", {
      method: "POST",
      body: { method: "euler", lengthMm: 3000, section: { shape: "chs", dMm: 48.3, tMm: 4 }, eMpa: 210000, loadN: 20000 },
    });
    expect(r.status).toBe(200);
    expect(r.body.ok).toBe(true);
    expect(r.body.basis).toBe("elastic-critical");
    expect(r.body.capacityN / 1000).toBeCloseTo(31.8, 0);
    expect(r.body.steps.length).toBeGreaterThan(3);
  });

  it("answers 422 with the field and a sentence for bad input, never a 500", async () => {
    const c = await signInAs("engineer@demo.example");
    const r = await c.json<{ error: { code: string; fields: Record<string, string> } }>("/api/v1/calculations", {
      method: "POST",
      body: { method: "euler", lengthMm: 3000, section: { shape: "chs", dMm: 100, tMm: 60 } },
    });
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe("invalid");
    expect(r.body.error.fields["section.tMm"]).toMatch(/thickness/i);
    const notJson = await c.fetch("/api/v1/calculations", { method: "POST", body: "{not json", headers: { "content-type": "application/json" } });
    expect(notJson.status).toBe(422);
    const unknown = await c.json<{ error: { fields: Record<string, string> } }>("/api/v1/calculations", { method: "POST", body: { method: "guesswork", lengthMm: 1 } });
    expect(unknown.status).toBe(422);
    expect(Object.keys(unknown.body.error.fields)).toContain("method");
  });
});
