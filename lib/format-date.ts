// The one way Strutwise writes a date, a time and a length of time — screens, PDFs, labels and
// e-mails alike: "2 Dec 2026, 09:30 GMT" in the site's own time zone, "2 Dec 2026" for a day,
// "7 days" or "1 day 6 hours" for how long something lasts.

type When = Date | string | number | null | undefined;

const DEFAULT_ZONE = "Europe/London";

function toDate(d: When): Date | null {
  if (d === null || d === undefined || d === "") return null;
  const date = d instanceof Date ? d : new Date(d);
  return Number.isNaN(date.getTime()) ? null : date;
}

const formatters = new Map<string, Intl.DateTimeFormat>();
function formatter(kind: "date" | "datetime" | "time", timeZone: string): Intl.DateTimeFormat {
  const key = `${kind}|${timeZone}`;
  let f = formatters.get(key);
  if (!f) {
    const day = { day: "numeric", month: "short", year: "numeric" } as const;
    const time = { hour: "2-digit", minute: "2-digit", hourCycle: "h23", timeZoneName: "short" } as const;
    f = new Intl.DateTimeFormat("en-GB", { timeZone, ...(kind === "time" ? time : kind === "date" ? day : { ...day, ...time }) });
    formatters.set(key, f);
  }
  return f;
}

/** The parts we print, so the separators are ours and not the runtime's. */
function parts(date: Date, kind: "date" | "datetime" | "time", timeZone: string) {
  const out: Record<string, string> = {};
  for (const p of formatter(kind, timeZone).formatToParts(date)) if (p.type !== "literal") out[p.type] = p.value;
  return out;
}

/** "2 Dec 2026, 09:30 GMT" in the given (site's) time zone; "—" when there is no date. */
export function formatDateTime(d: When, timeZone: string = DEFAULT_ZONE): string {
  const date = toDate(d);
  if (!date) return "—";
  const p = parts(date, "datetime", timeZone);
  return `${p.day} ${p.month} ${p.year}, ${p.hour}:${p.minute} ${p.timeZoneName}`;
}

/** "2 Dec 2026" — the day in the given (site's) time zone. */
export function formatDate(d: When, timeZone: string = DEFAULT_ZONE): string {
  const date = toDate(d);
  if (!date) return "—";
  const p = parts(date, "date", timeZone);
  return `${p.day} ${p.month} ${p.year}`;
}

/** "09:30 GMT" — a time on a day the reader already knows (today's queue, the page's print time). */
export function formatTime(d: When, timeZone?: string): string {
  const date = toDate(d);
  if (!date) return "—";
  const p = parts(date, "time", timeZone ?? Intl.DateTimeFormat().resolvedOptions().timeZone);
  return `${p.hour}:${p.minute} ${p.timeZoneName}`;
}

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? "" : "s"}`;

/**
 * How long something lasts, in days and hours: "7 days", "1 day 6 hours", "6 hours"; under an
 * hour in minutes. Rounded to the nearest hour (nearest minute under an hour), so a permit issued
 * at 09:00:30 until 09:00 a week later still reads "7 days".
 */
export function formatDuration(ms: number): string {
  if (!Number.isFinite(ms) || ms < 0) return "—";
  const minutes = Math.round(ms / 60_000);
  if (minutes < 60) return plural(minutes, "minute");
  const hours = Math.round(ms / 3_600_000);
  const days = Math.floor(hours / 24);
  const rest = hours % 24;
  if (days === 0) return plural(rest, "hour");
  return rest === 0 ? plural(days, "day") : `${plural(days, "day")} ${plural(rest, "hour")}`;
}

/** The same, from a number of hours (the site's settings are kept in hours). */
export function formatHours(hours: number): string {
  return formatDuration(hours * 3_600_000);
}
