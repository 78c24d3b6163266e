// Plain words the permit e-mails and messages share.
import type { ReviewMember } from "@/db/queries/permits";

export function scopeWords(n: number, zoneNames: string[]) {
  return `${n} member${n === 1 ? "" : "s"}${zoneNames.length ? ` in ${zoneNames.join(", ")}` : ""}`;
}

export const zonesOf = (ms: Pick<ReviewMember, "zoneName">[]) => [...new Set(ms.map((m) => m.zoneName).filter((z): z is string => !!z))];

export const HOUR = 3600_000;
export const DAY = 24 * HOUR;
