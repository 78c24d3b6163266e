// The worker process: delivers the e-mail outbox and runs scheduled scans. Several may run at
// once: outbox rows are claimed with SKIP LOCKED, and scheduled jobs are single-run by pg-boss.
import os from "node:os";
import { purgeExpiredRevocations } from "@/db/queries/users";
import { deliverDueEmails } from "./outbox";
import { renderPendingPermitPdfs } from "@/lib/permits/pdf";
import { QUEUES, startBoss } from "./queue";
import { ALERT_SCAN_MS, DIGEST_CRON, DIGEST_TZ, OVERLOAD_SWEEP_MS, alertScans, dailyDigest, overloadSweep } from "./scans";

const workerName = `${os.hostname()}:${process.pid}`;
const OUTBOX_POLL_MS = Number(process.env.OUTBOX_POLL_MS ?? 2000);

/** Runs `fn` every `ms`, never overlapping itself, logging (not dying on) errors. */
function every(ms: number, label: string, fn: () => Promise<unknown>) {
  let running = false;
  const timer = setInterval(async () => {
    if (running) return;
    running = true;
    try {
      await fn();
    } catch (e) {
      console.error(`[worker ${workerName}] ${label} failed:`, e instanceof Error ? e.message : e);
    } finally {
      running = false;
    }
  }, ms);
  return () => clearInterval(timer);
}

async function main() {
  const boss = await startBoss({ schedule: true });
  await boss.schedule(QUEUES.heartbeat, "* * * * *", { from: "schedule" });
  await boss.work(QUEUES.heartbeat, async (jobs) => {
    for (const job of jobs) console.log(`[worker ${workerName}] heartbeat ${job.id} at ${new Date().toISOString()}`);
  });

  const say = (msg: string) => console.log(`[worker ${workerName}] ${msg}`);
  await boss.schedule(QUEUES.alertDigest, DIGEST_CRON, { from: "schedule" }, { tz: DIGEST_TZ });
  await boss.work(QUEUES.alertDigest, async () => dailyDigest(say));

  const stops = [
    every(OVERLOAD_SWEEP_MS, "overload sweep", () => overloadSweep(say)),
    every(ALERT_SCAN_MS, "alert scans", () => alertScans(say)),
    every(OUTBOX_POLL_MS, "outbox delivery", async () => {
      const r = await deliverDueEmails({ worker: workerName });
      if (r.claimed) console.log(`[worker ${workerName}] outbox: ${r.sent} sent, ${r.failed} failed`);
    }),
    // Sign-outs are remembered only until the signed-out cookie would have expired anyway.
    every(60 * 60 * 1000, "session clean-up", async () => {
      const n = await purgeExpiredRevocations();
      if (n) console.log(`[worker ${workerName}] forgot ${n} expired signed-out sessions`);
    }),
    // A permit PDF that failed to render after its issue is retried here; its e-mails wait for it.
    every(10_000, "permit PDFs", async () => {
      const r = await renderPendingPermitPdfs();
      if (r.pending) console.log(`[worker ${workerName}] permit PDFs: ${r.rendered} rendered, ${r.failed.length} failed`);
    }),
  ];
  console.log(`[worker ${workerName}] started`);

  const stop = async () => {
    console.log(`[worker ${workerName}] stopping`);
    stops.forEach((s) => s());
    await boss.stop({ graceful: true, timeout: 5000 });
    process.exit(0);
  };
  process.on("SIGTERM", stop);
  process.on("SIGINT", stop);
}

main().catch((e) => {
  console.error("[worker] failed to start", e);
  process.exit(1);
});
