// A permit to load follows its members: once none of them is still standing under it (all
// struck, out of service, or taken out of its scope after a failed inspection) it closes itself,
// audited, in the same transaction as the change that left it empty.
import "server-only";
import type { Tx } from "@/db";
import { countStandingMembers, listIssuedLoadPermitsCovering } from "@/db/queries/permits";
import { transitionPermit, type Actor } from "./transition";

/** The permit was decided some other way meanwhile (closed, withdrawn, expired): nothing to close. */
class NoLongerIssued extends Error {}

/**
 * Closes each issued permit to load in `permitIds` that has no member standing any more.
 * `because` is recorded with the close ("every member struck under PTS-0003").
 */
export async function closeLoadPermitsLeftEmpty({ permitIds, actor, because }: { permitIds: string[]; actor: Actor; because: string }, tx: Tx) {
  const closed: string[] = [];
  for (const permitId of [...new Set(permitIds)].sort()) {
    if ((await countStandingMembers({ permitId }, tx)) > 0) continue;
    const r = await transitionPermit(
      {
        permitId,
        actor,
        from: ["issued"],
        refuse: () => new NoLongerIssued(),
        plan: async () => ({
          values: { status: "closed", closedAt: new Date(), closedBy: actor.userId },
          audit: { action: "permit.closed", before: { status: "issued" }, after: { status: "closed", automatic: true, reason: because } },
        }),
      },
      tx,
    ).catch((e: unknown) => {
      if (e instanceof NoLongerIssued) return null;
      throw e;
    });
    if (r) closed.push(permitId);
  }
  return closed;
}

/** After members were struck or taken out of service: the permits to load that cover them, closed if left empty. */
export async function closeLoadPermitsCovering({ memberIds, actor, because }: { memberIds: string[]; actor: Actor; because: string }, tx: Tx) {
  const permitIds = await listIssuedLoadPermitsCovering({ memberIds }, tx);
  return closeLoadPermitsLeftEmpty({ permitIds, actor, because }, tx);
}
