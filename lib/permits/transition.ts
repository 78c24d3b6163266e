// The one way a permit changes state: lock the permit row, check its state, let the use case plan
// the change, then update the row, record the audit events and queue the e-mails — all in one
// transaction, so a second person pressing at once waits on the lock and then sees the new state.
import "server-only";
import { transaction, type Tx } from "@/db";
import { recordAudit } from "@/db/queries/audit";
import { enqueueEmails, type NewEmail } from "@/db/queries/outbox";
import { getPermitForUpdate, updatePermit } from "@/db/queries/permits";
import type { Permit, permits } from "@/db/schema";
import { NotFoundError } from "@/lib/errors";

type PermitStatus = Permit["status"];

export type Actor = { organisationId: string; userId: string | null };

/** Another record's audit event written with the change (members loaded, struck, released…). */
export type AlsoAudit = { action: string; entityType: string; entityId: string; before?: unknown; after?: unknown };

export type TransitionPlan<R> = {
  /** Columns to set on the permit row (updatedAt is set for you). */
  values: Partial<typeof permits.$inferInsert>;
  /** The permit's own audit event. */
  audit: { action: string; before?: unknown; after?: unknown };
  also?: AlsoAudit[];
  emails?: NewEmail[];
  result?: R;
};

export async function transitionPermit<R = undefined>(
  {
    permitId,
    actor,
    from,
    refuse,
    plan,
  }: {
    permitId: string;
    actor: Actor;
    /** The states the change may start from. */
    from: readonly PermitStatus[];
    /** The error when the permit is in another state (usually a 409 in words). */
    refuse: (locked: Permit, tx: Tx) => Promise<Error> | Error;
    plan: (locked: Permit, tx: Tx) => Promise<TransitionPlan<R>>;
  },
  outer?: Tx,
): Promise<{ permit: Permit; result: R }> {
  const run = async (tx: Tx) => {
    const locked = await getPermitForUpdate({ permitId }, tx);
    if (!locked) throw new NotFoundError("That permit");
    if (!from.includes(locked.status)) throw await refuse(locked, tx);
    const p = await plan(locked, tx);
    const permit = await updatePermit({ permitId: locked.id, values: p.values }, tx);
    const base = { organisationId: actor.organisationId, siteId: locked.siteId, actorId: actor.userId };
    await recordAudit({ ...base, entityType: "permit", entityId: locked.id, ...p.audit }, tx);
    for (const a of p.also ?? []) await recordAudit({ ...base, ...a }, tx);
    await enqueueEmails(p.emails ?? [], tx);
    return { permit, result: p.result as R };
  };
  return outer ? run(outer) : transaction(run);
}
