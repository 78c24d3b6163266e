// Delivers the e-mail outbox with retries and back-off. Every attempt is recorded.
import "server-only";
import { claimDueEmails, markEmailFailed, markEmailSent } from "@/db/queries/outbox";
import { env } from "@/lib/env";
import { sendMail } from "@/lib/mail";
import { getObject } from "@/lib/storage";

/** After this many failed attempts a message is marked failed (and alerted on); until then it is retried. */
export const MAX_ATTEMPTS = 10;

/** 15 s, 30 s, 1 min, 2 min … capped at 1 h: a mail server that is down for a while loses nothing. */
export function backoffMs(attempts: number): number {
  return Math.min(15_000 * 2 ** Math.max(0, attempts - 1), 60 * 60 * 1000);
}

/** The Message-ID of an outbox row: the same on every attempt, so a resend is recognisably one e-mail. */
export function outboxMessageId(id: string): string {
  const host = (() => {
    try {
      return new URL(env.APP_URL).hostname || "strutwise.local";
    } catch {
      return "strutwise.local";
    }
  })();
  return `<outbox.${id}@${host}>`;
}

export type DeliveryReport = { claimed: number; sent: number; failed: number };

export async function deliverDueEmails({ now = new Date(), limit = 20, worker }: { now?: Date; limit?: number; worker: string }): Promise<DeliveryReport> {
  const batch = await claimDueEmails({ now, limit, worker });
  const report: DeliveryReport = { claimed: batch.length, sent: 0, failed: 0 };
  for (const msg of batch) {
    try {
      const attachments = await Promise.all(
        msg.attachments.map(async (a) => ({ filename: a.filename, contentType: a.contentType, content: await getObject(a.key) })),
      );
      await sendMail({ messageId: outboxMessageId(msg.id), to: msg.toEmail, subject: msg.subject, text: msg.text, html: msg.html, attachments });
      await markEmailSent({ id: msg.id, now: new Date(), worker });
      report.sent++;
    } catch (e) {
      const error = e instanceof Error ? e.message : String(e);
      const at = new Date();
      await markEmailFailed({
        id: msg.id,
        now: at,
        worker,
        error: error.slice(0, 500),
        nextAttemptAt: new Date(at.getTime() + backoffMs(msg.attempts)),
        giveUp: msg.attempts >= MAX_ATTEMPTS,
      });
      report.failed++;
    }
  }
  return report;
}
