// The worker process: runs scheduled scans and delivers queued work. Several may run at once.
import os from "node:os";
import { QUEUES, startBoss } from "./queue";

const workerName = `${os.hostname()}:${process.pid}`;

async function main() {
  const boss = await startBoss({ schedule: true });
  await boss.schedule(QUEUES.heartbeat, "* * * * *", { from: "schedule" });
  await boss.work(QUEUES.heartbeat, async (jobs) => {
    for (const job of jobs) console.log(`[worker ${workerName}] heartbeat ${job.id} at ${new Date().toISOString()}`);
  });
  console.log(`[worker ${workerName}] started`);

  const stop = async () => {
    console.log(`[worker ${workerName}] stopping`);
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
