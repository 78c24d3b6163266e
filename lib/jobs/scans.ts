// The worker's alert work: the overload sweep (often, so an overload alerts within a minute of
// the change that caused it), the other scans (every minute) and the daily digest (pg-boss cron).
// Every worker runs the sweeps; the alerts' unique key keeps each alert — and its e-mails — single.
import "server-only";
import { runAlertScans, sweepOverloads } from "@/lib/alerts/scans";
import { sendDailyDigests } from "@/lib/alerts/digest";

export const OVERLOAD_SWEEP_MS = Number(process.env.OVERLOAD_SWEEP_MS ?? 10_000);
export const ALERT_SCAN_MS = Number(process.env.ALERT_SCAN_MS ?? 60_000);
/** 07:00 site time (the demo sites are in the UK). */
export const DIGEST_CRON = process.env.DIGEST_CRON ?? "0 7 * * *";
export const DIGEST_TZ = process.env.DIGEST_TZ ?? "Europe/London";

export async function overloadSweep(log: (msg: string) => void) {
  const n = await sweepOverloads();
  if (n) log(`overload sweep: ${n} alert${n === 1 ? "" : "s"} raised`);
}

export async function alertScans(log: (msg: string) => void) {
  const r = await runAlertScans();
  const total = r.overloads + r.permits + r.inspections + r.emails;
  if (total) log(`alert scans: ${JSON.stringify(r)}`);
}

export async function dailyDigest(log: (msg: string) => void) {
  const n = await sendDailyDigests();
  log(`daily digest: ${n} queued`);
}
