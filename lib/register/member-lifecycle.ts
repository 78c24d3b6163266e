// Which status changes an edit may make. The lifecycle owns three states, and an edit can never
// talk a member out of them:
// - loaded: set by issuing a permit to load; left only through that permit (withdrawn, expired,
//   closed) or by a failed inspection, which also takes the member off the permit.
// - struck: set by confirming a permit to strike; the member is no longer standing.
// - out of service: whoever put it there (a failed inspection, or a person reporting damage by
//   editing), it returns to service only through a passing inspection — an inspection is the one
//   record that says someone looked at the member and found it sound.
// An edit may move a member between draft and submitted (submitting needs a passing check) and
// may always take a draft or submitted member out of service: stopping work is never refused.
import type { Member } from "@/db/schema";
import { MEMBER_STATUS_LABELS } from "@/lib/labels";
import { formatDateTime } from "@/lib/format-date";

type MemberStatus = Member["status"];

export type LastInspection = { result: "pass" | "fail"; inspectedAt: Date; inspectorName: string | null } | null;

/** The sentence explaining why an edit cannot change this member's status, or null if it may. */
export function statusEditConflict(args: {
  tag: string;
  current: MemberStatus;
  requested: MemberStatus;
  lastInspection: LastInspection;
  timeZone?: string;
}): string | null {
  const { tag, current, requested, lastInspection, timeZone } = args;
  if (requested === current) return null;
  const to = MEMBER_STATUS_LABELS[requested];
  if (current === "loaded") {
    return (
      `${tag} is loaded under an issued permit to load, so its status follows that permit and cannot be changed to ${to} by editing. ` +
      "To unload it, withdraw or close the permit; if it is damaged, record a failed inspection, which takes it out of service and off the permit."
    );
  }
  if (current === "struck") {
    return `${tag} has been struck under a permit to strike and is no longer standing; its status cannot be changed by editing. If it is back in use, log it again with a new tag.`;
  }
  if (current === "out_of_service") {
    const failed = lastInspection?.result === "fail";
    const why = failed
      ? `${tag} is out of service after a failed inspection on ${formatDateTime(lastInspection.inspectedAt, timeZone)}${lastInspection.inspectorName ? ` by ${lastInspection.inspectorName}` : ""}`
      : `${tag} is out of service`;
    return `${why}. It returns to service only through a passing inspection, not by editing: put right what is wrong, then record the inspection on its inspection page.`;
  }
  return null;
}
