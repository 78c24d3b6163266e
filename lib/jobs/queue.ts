// The PostgreSQL-backed job queue (pg-boss), shared by the worker and by code that enqueues.
import "server-only";
import PgBoss from "pg-boss";
import { env } from "@/lib/env";

export const QUEUES = {
  heartbeat: "heartbeat",
  alertDigest: "alert-digest",
} as const;

export async function startBoss(opts: { schedule?: boolean } = {}) {
  const boss = new PgBoss({ connectionString: env.DATABASE_URL, max: 4, schedule: opts.schedule ?? false });
  boss.on("error", (e) => console.error("[queue] error", e));
  await boss.start();
  for (const name of Object.values(QUEUES)) await boss.createQueue(name);
  return boss;
}
