// One date, time and duration format for screens, PDFs and e-mails, in the site's time zone.
import { describe, expect, it } from "vitest";
import { formatDate, formatDateTime, formatDuration, formatHours, formatTime } from "@/lib/format-date";

describe("formatDateTime", () => {
  it("writes the day, month, year and 24-hour time with the zone, in the site's time zone", () => {
    // 2 Dec 2026 is in winter: London is on GMT (UTC+0), New York on EST (UTC−5) — IANA tz database.
    const at = new Date("2026-12-02T09:30:00Z");
    expect(formatDateTime(at, "Europe/London")).toBe("2 Dec 2026, 09:30 GMT");
    expect(formatDateTime(at, "America/New_York")).toBe("2 Dec 2026, 04:30 GMT-5");
    // Afternoon times stay on the 24-hour clock.
    expect(formatDateTime(new Date("2026-12-02T17:05:00Z"), "Europe/London")).toBe("2 Dec 2026, 17:05 GMT");
  });

  it("follows summer time: 1 July is on BST (UTC+1) in London", () => {
    expect(formatDateTime(new Date("2026-07-01T23:30:00Z"), "Europe/London")).toBe("2 Jul 2026, 00:30 BST");
  });

  it("takes ISO strings and says — for a missing or broken date, never 'Invalid Date'", () => {
    expect(formatDateTime("2026-12-02T09:30:00Z", "Europe/London")).toBe("2 Dec 2026, 09:30 GMT");
    expect(formatDateTime(null, "Europe/London")).toBe("—");
    expect(formatDateTime("not a date", "Europe/London")).toBe("—");
  });
});

describe("formatDate", () => {
  it("gives the day in the site's zone, which can differ from the UTC day", () => {
    const lateEvening = new Date("2026-12-02T23:30:00Z");
    expect(formatDate(lateEvening, "Europe/London")).toBe("2 Dec 2026");
    expect(formatDate(lateEvening, "Asia/Tokyo")).toBe("3 Dec 2026"); // JST is UTC+9
  });
});

describe("formatTime", () => {
  it("gives hours and minutes with the zone", () => {
    expect(formatTime(new Date("2026-12-02T14:05:00Z"), "Europe/London")).toBe("14:05 GMT");
  });
});

describe("formatDuration", () => {
  it("speaks in days and hours, not 168 hours", () => {
    expect(formatHours(168)).toBe("7 days");
    expect(formatHours(30)).toBe("1 day 6 hours");
    expect(formatHours(24)).toBe("1 day");
    expect(formatHours(25)).toBe("1 day 1 hour");
    expect(formatHours(6)).toBe("6 hours");
    expect(formatHours(1)).toBe("1 hour");
  });

  it("rounds to the nearest hour, and uses minutes under an hour", () => {
    expect(formatDuration(7 * 24 * 3_600_000 - 30_000)).toBe("7 days");
    expect(formatDuration(45 * 60_000)).toBe("45 minutes");
    expect(formatDuration(-1)).toBe("—");
  });
});
