// Plain words the permit e-mails and messages share.
import type { ReviewMember } from "@/db/queries/permits";
import { formatDateTime } from "@/lib/format-date";

export function scopeWords(n: number, zoneNames: string[]) {
  return `${n} member${n === 1 ? "" : "s"}${zoneNames.length ? ` in ${zoneNames.join(", ")}` : ""}`;
}

export const zonesOf = (ms: Pick<ReviewMember, "zoneName">[]) => [...new Set(ms.map((m) => m.zoneName).filter((z): z is string => !!z))];

export const HOUR = 3600_000;
export const DAY = 24 * HOUR;

/**
 * A request's own reference until it is issued and numbered: its number on the site, who asked and
 * when, in the site's time zone ("Request 14 by Dana Lee, 3 Dec 2026, 09:30 GMT") — the same words
 * in the list, on the permit page, in e-mails and on the PDF. The number tells apart two requests
 * one person made in the same minute.
 */
export function requestReference(
  p: { requestNumber: number; requestedByName: string | null | undefined; requestedAt: Date | string },
  timeZone: string,
) {
  return `Request ${p.requestNumber} by ${p.requestedByName || "an unknown person"}, ${formatDateTime(p.requestedAt, timeZone)}`;
}
