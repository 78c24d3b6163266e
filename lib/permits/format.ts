// How permits show numbers and times: the site's unit system and time zone, with units always written.
import { formatForceFor, formatLengthFor, formatUtilisation, type UnitSystem } from "@/lib/client/format";

export type { UnitSystem };

// Figures are written by the one client kit formatter (lib/client/format.ts).
export const fmtForce = formatForceFor;
export const fmtLength = formatLengthFor;
export const fmtUtilisation = formatUtilisation;

// Dates and times are written by lib/format-date.ts, the same on every screen, PDF and e-mail.
