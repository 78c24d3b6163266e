import "server-only";
import { and, desc, eq, inArray, sql } from "drizzle-orm";
import { db, type DbOrTx } from "@/db";
import { outbox, outboxAttempts, type OutboxMessage } from "@/db/schema";

export type NewEmail = {
  siteId?: string | null;
  kind: string;
  toEmail: string;
  toUserId?: string | null;
  subject: string;
  text: string;
  html?: string | null;
  attachments?: { key: string; filename: string; contentType: string }[];
  /** Hold delivery until this is cleared (e.g. "pdf:<permitId>" while the permit PDF renders). */
  waitFor?: string | null;
  relatedType?: string | null;
  relatedId?: string | null;
};

/** Write e-mails in the caller's transaction; the worker delivers them. */
export async function enqueueEmails(messages: NewEmail[], tx: DbOrTx = db) {
  if (messages.length === 0) return [];
  return tx
    .insert(outbox)
    .values(
      messages.map((m) => ({
        siteId: m.siteId ?? null,
        kind: m.kind,
        toEmail: m.toEmail,
        toUserId: m.toUserId ?? null,
        subject: m.subject,
        text: m.text,
        html: m.html ?? null,
        attachments: m.attachments ?? [],
        waitFor: m.waitFor ?? null,
        relatedType: m.relatedType ?? null,
        relatedId: m.relatedId ?? null,
      })),
    )
    .returning({ id: outbox.id });
}

/** Releases messages held for `waitFor`, optionally adding attachments that are now ready. */
export async function releaseHeldEmails(
  { waitFor, attachments }: { waitFor: string; attachments?: { key: string; filename: string; contentType: string }[] },
  tx: DbOrTx = db,
) {
  const extra = attachments ?? [];
  return tx
    .update(outbox)
    .set({
      waitFor: null,
      attachments: extra.length ? sql`${outbox.attachments} || ${JSON.stringify(extra)}::jsonb` : outbox.attachments,
    })
    .where(eq(outbox.waitFor, waitFor))
    .returning({ id: outbox.id });
}

export const LOCK_SECONDS = 120;

/**
 * Claims due messages for one worker. SKIP LOCKED plus the lease means two workers never hold
 * the same message; a worker that dies mid-send leaves a lease that expires and is retried.
 */
export async function claimDueEmails({ now, limit, worker: _worker }: { now: Date; limit: number; worker: string }, tx: DbOrTx = db) {
  const nowIso = now.toISOString();
  const rows = await tx.execute(sql`
    update outbox set status = 'sending', attempts = attempts + 1,
      locked_until = ${nowIso}::timestamptz + make_interval(secs => ${LOCK_SECONDS})
    where id in (
      select id from outbox
      where wait_for is null
        and next_attempt_at <= ${nowIso}::timestamptz
        and (status = 'queued' or (status = 'sending' and locked_until < ${nowIso}::timestamptz))
      order by next_attempt_at
      limit ${limit}
      for update skip locked
    )
    returning id`);
  const ids = (rows as unknown as { id: string }[]).map((r) => r.id);
  if (ids.length === 0) return [] as OutboxMessage[];
  return tx.select().from(outbox).where(inArray(outbox.id, ids));
}

export async function markEmailSent({ id, now, worker }: { id: string; now: Date; worker: string }, tx: DbOrTx = db) {
  await tx.update(outbox).set({ status: "sent", sentAt: now, lockedUntil: null, lastError: null }).where(eq(outbox.id, id));
  await tx.insert(outboxAttempts).values({ outboxId: id, at: now, ok: true, worker });
}

export async function markEmailFailed(
  { id, now, worker, error, nextAttemptAt, giveUp }: { id: string; now: Date; worker: string; error: string; nextAttemptAt: Date; giveUp: boolean },
  tx: DbOrTx = db,
) {
  await tx
    .update(outbox)
    .set({ status: giveUp ? "failed" : "queued", lastError: error, nextAttemptAt, lockedUntil: null })
    .where(eq(outbox.id, id));
  await tx.insert(outboxAttempts).values({ outboxId: id, at: now, ok: false, error, worker });
}

/** Delivery status of the e-mails about one thing (a permit, an alert…). */
export async function listEmailsFor({ relatedType, relatedId }: { relatedType: string; relatedId: string }, tx: DbOrTx = db) {
  return tx
    .select({
      id: outbox.id,
      kind: outbox.kind,
      toEmail: outbox.toEmail,
      subject: outbox.subject,
      status: outbox.status,
      attempts: outbox.attempts,
      lastError: outbox.lastError,
      sentAt: outbox.sentAt,
      createdAt: outbox.createdAt,
      waiting: sql<boolean>`${outbox.waitFor} is not null`,
    })
    .from(outbox)
    .where(and(eq(outbox.relatedType, relatedType), eq(outbox.relatedId, relatedId)))
    .orderBy(desc(outbox.createdAt));
}
