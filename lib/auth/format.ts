// Dates in e-mails and admin pages, in the site's time zone ("9 Dec 2026, 14:05").
export function formatDateTime(d: Date, timeZone = "Europe/London") {
  return new Intl.DateTimeFormat("en-GB", { timeZone, day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit" }).format(d);
}
