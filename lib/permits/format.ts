// How permits show numbers and times: the site's unit system and time zone, with units always written.
import { formatForceFor, formatLengthFor, formatUtilisation, type UnitSystem } from "@/lib/client/format";
import { formatDateTime, formatDuration } from "@/lib/format-date";

export type { UnitSystem };

// Figures are written by the one client kit formatter (lib/client/format.ts).
export const fmtForce = formatForceFor;
export const fmtLength = formatLengthFor;
export const fmtUtilisation = formatUtilisation;

// Dates and times are written by lib/format-date.ts, the same on every screen, PDF and e-mail.

/** "9 Dec 2026, 09:30 GMT (7 days)": when a permit ends and how long it runs from its issue, in days and hours. */
export function fmtValidUntil(issuedAt: Date | string | null | undefined, validUntil: Date | string | null | undefined, timeZone: string): string {
  const until = formatDateTime(validUntil, timeZone);
  if (!issuedAt || !validUntil || until === "—") return until;
  const ms = new Date(validUntil).getTime() - new Date(issuedAt).getTime();
  return Number.isFinite(ms) && ms > 0 ? `${until} (${formatDuration(ms)})` : until;
}
