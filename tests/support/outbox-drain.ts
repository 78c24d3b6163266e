// Delivers everything due in the outbox (as a worker would), for tests.
import { deliverDueEmails } from "@/lib/jobs/outbox";

export async function drainOutbox(worker = "test-drain", now?: Date) {
  let total = 0;
  for (let i = 0; i < 50; i++) {
    const r = await deliverDueEmails({ worker, limit: 50, ...(now ? { now } : {}) });
    total += r.sent;
    if (r.claimed === 0) break;
  }
  return total;
}
