// The member record's words: which status changes an edit may make, and the history as sentences.
import { describe, expect, it } from "vitest";
import { historySentences } from "@/lib/register/member-history-text";
import { statusEditConflict } from "@/lib/register/member-lifecycle";

const at = new Date("2026-12-02T09:30:00Z");
const names = { zone: new Map([["z1", "Zone A"], ["z2", "Zone B"]]), scheme: new Map<string, string>(), memberType: new Map([["t1", "Light shore"]]) };
const ctx = { timeZone: "Europe/London", unitSystem: "si" as const, names, inspections: [{ id: "i1", result: "fail" as const, inspectedAt: at }] };

describe("statusEditConflict", () => {
  it("lets an edit move between draft and submitted and take either out of service", () => {
    for (const [current, requested] of [["draft", "submitted"], ["submitted", "draft"], ["draft", "out_of_service"], ["submitted", "out_of_service"]] as const)
      expect(statusEditConflict({ tag: "P1", current, requested, lastInspection: null }), `${current} → ${requested}`).toBeNull();
  });

  it("never lets an edit leave loaded, struck or out of service", () => {
    for (const current of ["loaded", "struck", "out_of_service"] as const)
      for (const requested of ["draft", "submitted", "out_of_service", "loaded", "struck"] as const) {
        if (requested === current) continue;
        expect(statusEditConflict({ tag: "P1", current, requested, lastInspection: null }), `${current} → ${requested}`).not.toBeNull();
      }
  });

  it("names the failed inspection, its date in the site's zone and its inspector", () => {
    const m = statusEditConflict({
      tag: "P1", current: "out_of_service", requested: "submitted", timeZone: "Europe/London",
      lastInspection: { result: "fail", inspectedAt: at, inspectorName: "Sam Inspector" },
    });
    expect(m).toBe(
      "P1 is out of service after a failed inspection on 2 Dec 2026, 09:30 GMT by Sam Inspector. It returns to service only through a passing inspection, not by editing: put right what is wrong, then record the inspection on its inspection page.",
    );
  });
});

describe("historySentences", () => {
  const row = (action: string, before: unknown, after: unknown) => ({ id: 1, action, before, after, at, actorName: "Sam Inspector" });

  it("tells a status change after an inspection as one sentence with the inspection's date", () => {
    const [h] = historySentences([row("member.status_changed", { status: "submitted" }, { status: "out_of_service", reason: "failed inspection", inspectionId: "i1" })], ctx);
    expect(h!.summary).toBe("Status changed from Submitted to Out of service after the failed inspection on 2 Dec 2026.");
  });

  it("names zones and types instead of their ids, and gives lengths and loads with units", () => {
    const [h] = historySentences(
      [row("member.edited_and_rechecked", { zoneId: "z1", memberTypeId: "t0", extensionMm: 2000, loadN: 20_000, latestCheckId: "c1" }, { zoneId: "z2", memberTypeId: "t1", extensionMm: 2100, loadN: 22_500, latestCheckId: "c2", check: { id: "c2", pass: false, utilisation: 1.04 } })],
      ctx,
    );
    expect(h!.summary).toBe("Edited and re-checked.");
    expect(h!.details).toEqual([
      "Zone changed from Zone A to Zone B.",
      "Member type changed from a member type since deleted to Light shore.",
      "Measured extension changed from 2000 mm to 2100 mm.",
      "Working load changed from 20.00 kN to 22.50 kN.",
      "The re-check fails (utilisation 104 %): do not load it until it is corrected.",
    ]);
  });

  it("says a photo was added without its hash, and an unknown action in words rather than its key", () => {
    const [photo, other] = historySentences(
      [row("member.photo_added", null, { photoId: "p1", sha256: "ab".repeat(32), takenAt: "2026-12-01T10:00:00Z" }), row("member.label_printed", null, {})],
      ctx,
    );
    expect(photo!.summary).toBe("Photo added (taken 1 Dec 2026).");
    expect(other!.summary).toBe("Label printed.");
  });
});
