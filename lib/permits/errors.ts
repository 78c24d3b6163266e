// The permit errors that carry their own words: the 422 listing every unmet precondition, and the
// 409 saying who decided a request first.
import "server-only";
import type { DbOrTx } from "@/db";
import { getPermitView } from "@/db/queries/permits";
import { AppError, ConflictError, NotFoundError } from "@/lib/errors";
import { PERMIT_STATUS_LABELS } from "@/lib/labels";
import { permitNumberLabel } from "@/lib/validations/permit";
import { formatDateTime } from "@/lib/format-date";
import type { UnitSystem } from "./format";
import type { Evaluation } from "./preconditions";

/** 422 listing every reason a permit cannot be issued, per member, in words. */
export class PreconditionError extends AppError {
  constructor(readonly evaluation: Evaluation) {
    const fields: Record<string, string> = {};
    for (const f of evaluation.permit.filter((x) => !x.ok)) fields[f.key] = fields[f.key] ? `${fields[f.key]}; ${f.text}` : f.text;
    for (const m of evaluation.members) {
      const bad = m.findings.filter((f) => !f.ok).map((f) => f.text);
      if (bad.length) fields[m.tag] = bad.join("; ");
    }
    super(422, "preconditions_failed", `This permit cannot be issued yet. ${evaluation.reasons.join(". ")}.`, fields);
  }
}

/** The 409 for a permit someone else has already decided, saying who and when. */
export async function alreadyDecided(permitId: string, tx: DbOrTx) {
  const v = await getPermitView({ permitId }, tx);
  if (!v) return new NotFoundError("That permit");
  const p = v.permit;
  const when = (d: Date | null) => formatDateTime(d, v.siteTimezone);
  if (p.status === "issued" || p.status === "closed" || p.status === "expired")
    return new ConflictError(
      `This request has already been issued as ${permitNumberLabel(p.kind, p.number)} by ${v.approvedByName ?? "someone else"} at ${when(p.issuedAt)}; nothing was changed.`,
    );
  if (p.status === "refused") return new ConflictError(`This request was refused by ${v.closedByName ?? "someone else"} at ${when(p.closedAt)}; nothing was changed.`);
  return new ConflictError(`This permit is ${PERMIT_STATUS_LABELS[p.status].toLowerCase()}; nothing was changed.`);
}

/** The 409 for an action the permit's state does not allow, naming the state. */
export function wrongState(what: string, status: keyof typeof PERMIT_STATUS_LABELS) {
  return new ConflictError(`${what}; this one is ${PERMIT_STATUS_LABELS[status].toLowerCase()}.`);
}
