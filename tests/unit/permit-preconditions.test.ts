// The issue preconditions for a scheme's design check certificate, read from its record.
// Design check categories 0–3 and who checks each: BS 5975:2019+A1:2020 §17.4 (a category 2 or 3
// design needs a check of that category; a lower category's check does not cover it).
import { describe, expect, it } from "vitest";
import type { ReviewMember } from "@/db/queries/permits";
import { evaluatePermit, type SchemeFacts } from "@/lib/permits/preconditions";

const now = new Date("2026-12-02T10:00:00Z");
const member = (schemeId: string): ReviewMember => ({
  id: "m1", siteId: "s1", tag: "T-1", status: "submitted", zoneId: "z1", zoneName: "L2", schemeId, schemeReference: "TW-1",
  memberTypeName: "Prop", extensionMm: 2500, loadN: 6000, capacityN: 20000, utilisation: 0.3, checkPass: true, latestCheckId: "c1",
  readyPhotos: 1, pendingPhotos: 0, latestInspection: { result: "pass", inspectedAt: "2026-12-01T09:00:00Z", nextDueAt: "2026-12-08T09:00:00Z" }, coveredBy: null,
});
const run = (scheme: SchemeFacts) =>
  evaluatePermit({ kind: "load", members: [member(scheme.id)], schemes: [scheme], evidence: null, now, units: "si", timeZone: "Europe/London" });
const base = { id: "sch", reference: "TW-1", category: 2, validUntil: null };

describe("check certificate preconditions", () => {
  it("a category 2 scheme whose certificate is for category 1 cannot be issued, and says so", () => {
    const e = run({ ...base, certificateKey: "k", certificate: { checkerName: "R. Checker", checkCategory: 1, documentDate: "2026-11-20" } });
    expect(e.canIssue).toBe(false);
    expect(e.permit.find((f) => f.key === "certificate")?.text).toBe(
      "Scheme TW-1 is design check category 2, but its check certificate (R. Checker) is for category 1; upload a category 2 check certificate",
    );
  });

  it("a certificate of the scheme's category names its checker and date", () => {
    const e = run({ ...base, certificateKey: "k", certificate: { checkerName: "R. Checker", checkCategory: 2, documentDate: "2026-11-20" } });
    expect(e.canIssue).toBe(true);
    expect(e.permit.find((f) => f.key === "certificate")?.text).toBe("Scheme TW-1 (category 2) has its design check certificate: checked by R. Checker on 20 Nov 2026");
  });

  it("no certificate at all still blocks the issue", () => {
    const e = run({ ...base, certificateKey: null, certificate: null });
    expect(e.canIssue).toBe(false);
  });
});
