// The first thing the member record says: the state the member is in, why, and what to do next.
// A member out of service after a failed inspection says so above its capacity result, with the
// date, the inspector and what failed, so nobody reads a passing check as "safe to load".
import type { Member } from "@/db/schema";
import { formatDateTime } from "@/lib/format-date";
import { MEMBER_STATUS_LABELS } from "@/lib/labels";
import type { HistoryEntry } from "./member-history-text";

export type MemberState = {
  status: Member["status"];
  label: string;
  tone: "bad" | "warn" | "ok" | "neutral";
  headline: string;
  details: string[];
  nextStep: string;
};

type Inspection = { result: "pass" | "fail"; inspectedAt: Date; inspectorName: string | null; failedItems: string[]; notes: string | null };
type Permit = { kind: "load" | "strike"; status: string; label: string; covers: boolean; validUntil: Date | null; closedAt: Date | null };

export function memberState(args: {
  member: Pick<Member, "status" | "checkPass" | "utilisation">;
  inspections: Inspection[];
  permits: Permit[];
  history: HistoryEntry[];
  timeZone: string;
}): MemberState {
  const { member, inspections, permits, history, timeZone } = args;
  const label = MEMBER_STATUS_LABELS[member.status];
  const last = inspections[0] ?? null;
  const failing = member.checkPass === false;
  const failingLine = failing
    ? `It also fails its capacity check${member.utilisation != null ? ` (utilisation ${Math.round(member.utilisation * 100)} %)` : ""}.`
    : null;
  const when = (d: Date) => formatDateTime(d, timeZone);

  switch (member.status) {
    case "out_of_service": {
      if (last?.result === "fail") {
        const details = [
          ...(last.failedItems.length ? [`Failed: ${last.failedItems.join("; ")}.`] : []),
          ...(last.notes ? [`Inspector's notes: ${last.notes}`] : []),
          ...(failingLine ? [failingLine] : []),
        ];
        return {
          status: member.status, label, tone: "bad",
          headline: `Out of service: failed inspection on ${when(last.inspectedAt)}${last.inspectorName ? ` by ${last.inspectorName}` : ""}`,
          details,
          nextStep:
            "Do not load it. Put right what failed (repair, re-plumb or replace the member), then record a passing re-inspection: only that returns it to service. It is off every permit; loading it again needs a new permit to load.",
        };
      }
      const taken = history.find((h) => /to Out of service/.test(h.summary) || h.details.some((d) => /to Out of service/.test(d)));
      return {
        status: member.status, label, tone: "bad",
        headline: `Out of service${taken ? ` since ${when(taken.at)}${taken.actorName ? `, set by ${taken.actorName}` : ""}` : ""}`,
        details: failingLine ? [failingLine] : [],
        nextStep: "Do not load it. When what was wrong is put right, record a passing inspection: only that returns it to service.",
      };
    }
    case "loaded": {
      const permit = permits.find((p) => p.kind === "load" && p.status === "issued" && p.covers);
      return {
        status: member.status, label, tone: failing ? "bad" : "ok",
        headline: `Loaded${permit ? ` under ${permit.label}${permit.validUntil ? `, valid until ${when(permit.validUntil)}` : ""}` : ""}`,
        details: failingLine ? [failingLine] : [],
        nextStep: failing
          ? "It carries more than its capacity: the temporary works coordinator should review it now."
          : "Keep to the permit's conditions; inspect it when due.",
      };
    }
    case "struck": {
      const permit = permits.find((p) => p.kind === "strike" && p.covers);
      return {
        status: member.status, label, tone: "neutral",
        headline: `Struck${permit ? ` under ${permit.label}` : ""}: no longer standing`,
        details: [],
        nextStep: "Nothing to do. If the member is put back in use, log it again with a new tag.",
      };
    }
    case "draft":
    case "submitted":
    default: {
      if (failing)
        return {
          status: member.status, label, tone: "bad",
          headline: `${label}: failing its capacity check`,
          details: failingLine ? [failingLine.replace(/^It also fails/, "It fails")] : [],
          nextStep: "Treat it as overloaded if it is already standing: the temporary works coordinator should review it. Correct the extension, load or type and it is re-checked.",
        };
      return {
        status: member.status, label, tone: member.status === "draft" ? "warn" : "ok",
        headline: member.status === "draft" ? "Draft: not yet submitted" : "Submitted: ready to be named on a permit to load",
        details: last ? [`Last inspection ${last.result === "pass" ? "passed" : "failed"} on ${when(last.inspectedAt)}${last.inspectorName ? ` (${last.inspectorName})` : ""}.`] : ["Not inspected yet: a permit needs a passing inspection."],
        nextStep: member.status === "draft" ? "Check its details and submit it when it is installed and correct." : "Request a permit to load when the zone is ready.",
      };
    }
  }
}
