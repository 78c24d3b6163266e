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
 * A request's own reference until it is issued and numbered: who asked and when, in the site's
 * time zone ("Request by Dana Lee, 3 Dec 2026, 09:30 GMT") — the same words in the list, on the
 * permit page and in e-mails.
 */
export function requestReference(p: { requestedByName: string | null | undefined; requestedAt: Date | string }, timeZone: string) {
  return `Request by ${p.requestedByName || "an unknown person"}, ${formatDateTime(p.requestedAt, timeZone)}`;
}
