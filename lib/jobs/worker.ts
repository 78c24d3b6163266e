// The worker process: delivers the e-mail outbox and runs scheduled scans. Several may run at
// once: outbox rows are claimed with SKIP LOCKED, and scheduled jobs are single-run by pg-boss.
import os from "node:os";
import { deliverDueEmails } from "./outbox";
import { QUEUES, startBoss } from "./queue";

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

  const stops = [
    every(OUTBOX_POLL_MS, "outbox delivery", async () => {
      const r = await deliverDueEmails({ worker: workerName });
      if (r.claimed) console.log(`[worker ${workerName}] outbox: ${r.sent} sent, ${r.failed} failed`);
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
