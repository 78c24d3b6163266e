// What must be true before a permit may be issued, in words, per member and for the permit.
// Pure: the review page, the issue use case and the tests all read the same findings.
import type { ReviewMember } from "@/db/queries/permits";
import { strikeEvidenceSchema, permitNumberLabel } from "@/lib/validations/permit";
import { formatDate } from "@/lib/format-date";
import { fmtForce, fmtUtilisation, type UnitSystem } from "./format";

export type FindingKey = "state" | "check" | "photos" | "inspection" | "scheme";
export type Finding = { key: FindingKey | "scope" | "certificate" | "scheme-validity" | "evidence"; ok: boolean; text: string };
export type MemberFindings = { id: string; tag: string; ready: boolean; findings: Finding[] };

export type SchemeFacts = {
  id: string;
  reference: string;
  category: number;
  certificateKey: string | null;
  validUntil: Date | null;
  /** The current certificate's record (checker, category, date); null for a file recorded before certificates kept them. */
  certificate?: { checkerName: string | null; checkCategory: number | null; documentDate: string | null } | null;
};

export type Evaluation = {
  canIssue: boolean;
  members: MemberFindings[];
  permit: Finding[];
  /** Every blocking reason, one line each ("WXW-L2-P05: has no photo"), for errors and e-mails. */
  reasons: string[];
};

export type EvaluateInput = {
  kind: "load" | "strike";
  members: ReviewMember[];
  schemes: SchemeFacts[];
  evidence: unknown;
  now: Date;
  units: UnitSystem;
  timeZone: string;
};

function coverLabel(c: NonNullable<ReviewMember["coveredBy"]>) {
  return permitNumberLabel(c.kind, c.number) ?? "another permit";
}

function loadFindings(m: ReviewMember, { now, units, timeZone }: EvaluateInput): Finding[] {
  const out: Finding[] = [];
  // State: only members not yet under load can be released for loading.
  if (m.coveredBy && m.coveredBy.kind === "load") out.push({ key: "state", ok: false, text: `Already loaded under issued permit ${coverLabel(m.coveredBy)}` });
  else if (m.status === "loaded") out.push({ key: "state", ok: false, text: "Is already marked loaded" });
  else if (m.status === "struck") out.push({ key: "state", ok: false, text: "Has been struck" });
  else if (m.status === "out_of_service") out.push({ key: "state", ok: false, text: "Is out of service" });
  else out.push({ key: "state", ok: true, text: m.status === "draft" ? "Draft, not yet loaded" : "Submitted, not yet loaded" });

  if (!m.schemeId) out.push({ key: "scheme", ok: false, text: "Belongs to no scheme (temporary works design); assign one before loading" });

  // The capacity check stored with the member.
  if (!m.latestCheckId || m.checkPass == null) out.push({ key: "check", ok: false, text: "Has no capacity check yet" });
  else if (!m.checkPass) {
    out.push({
      key: "check",
      ok: false,
      text:
        m.capacityN == null || m.utilisation == null
          ? "Its capacity check could not be completed; fix the member's data and re-check"
          : `Fails its capacity check: utilisation ${fmtUtilisation(m.utilisation)} (load ${fmtForce(m.loadN, units)} against capacity ${fmtForce(m.capacityN, units)})`,
    });
  } else {
    out.push({ key: "check", ok: true, text: `Check passes: utilisation ${fmtUtilisation(m.utilisation)} (load ${fmtForce(m.loadN, units)}, capacity ${fmtForce(m.capacityN, units)})` });
  }

  if (m.readyPhotos > 0) out.push({ key: "photos", ok: true, text: `${m.readyPhotos} photo${m.readyPhotos === 1 ? "" : "s"}` });
  else if (m.pendingPhotos > 0) out.push({ key: "photos", ok: false, text: `Has no processed photo yet (${m.pendingPhotos} still processing)` });
  else out.push({ key: "photos", ok: false, text: "Has no photo" });

  const i = m.latestInspection;
  if (!i) out.push({ key: "inspection", ok: false, text: "Has no inspection recorded" });
  else if (i.result !== "pass") out.push({ key: "inspection", ok: false, text: `Latest inspection (${formatDate(i.inspectedAt, timeZone)}) failed` });
  else if (!i.nextDueAt) out.push({ key: "inspection", ok: false, text: `Latest inspection (${formatDate(i.inspectedAt, timeZone)}) has no next due date` });
  else if (new Date(i.nextDueAt).getTime() <= now.getTime())
    out.push({ key: "inspection", ok: false, text: `Inspection overdue since ${formatDate(i.nextDueAt, timeZone)}` });
  else out.push({ key: "inspection", ok: true, text: `Inspected ${formatDate(i.inspectedAt, timeZone)}, passed; next due ${formatDate(i.nextDueAt, timeZone)}` });

  return out;
}

function strikeFindings(m: ReviewMember): Finding[] {
  if (m.coveredBy && m.coveredBy.kind === "strike") return [{ key: "state", ok: false, text: `Already released for striking under ${coverLabel(m.coveredBy)}` }];
  if (m.status === "struck") return [{ key: "state", ok: false, text: "Has already been struck" }];
  const words = { draft: "Draft", submitted: "Submitted", loaded: "Loaded", out_of_service: "Out of service" } as const;
  return [{ key: "state", ok: true, text: `${words[m.status as keyof typeof words]}, ready to strike when released` }];
}

/** Plain words for the striking evidence, and whether it supports striking. */
export function evidenceFinding(evidence: unknown): Finding {
  const parsed = strikeEvidenceSchema.safeParse(evidence);
  if (!parsed.success) return { key: "evidence", ok: false, text: "No striking evidence recorded" };
  const e = parsed.data;
  if (e.basis === "designer") {
    return { key: "evidence", ok: true, text: `Designer's instruction${e.reference ? ` (${e.reference})` : ""}: “${e.instruction}”` };
  }
  const below = e.results.filter((r) => r.strengthMpa < e.requiredStrengthMpa);
  const list = e.results.map((r) => `${r.specimen} ${r.strengthMpa.toFixed(1)} MPa`).join(", ");
  if (below.length) {
    return {
      key: "evidence",
      ok: false,
      text: `${below.map((r) => `${r.specimen === "cube" ? "Cube" : "Cylinder"} result ${r.strengthMpa.toFixed(1)} MPa`).join(" and ")} ${below.length === 1 ? "is" : "are"} below the required striking strength of ${e.requiredStrengthMpa.toFixed(1)} MPa (concrete ${e.concreteAgeDays} days old)`,
    };
  }
  return { key: "evidence", ok: true, text: `Concrete ${e.concreteAgeDays} days old: ${list}, all at or above the required ${e.requiredStrengthMpa.toFixed(1)} MPa` };
}

export function evaluatePermit(input: EvaluateInput): Evaluation {
  const schemesById = new Map(input.schemes.map((s) => [s.id, s]));
  const members: MemberFindings[] = input.members.map((m) => {
    const findings = input.kind === "load" ? loadFindings(m, input) : strikeFindings(m);
    return { id: m.id, tag: m.tag, findings, ready: findings.every((f) => f.ok) };
  });

  const permit: Finding[] = [];
  if (input.members.length === 0) permit.push({ key: "scope", ok: false, text: "No members are in scope" });
  else permit.push({ key: "scope", ok: true, text: `${input.members.length} member${input.members.length === 1 ? "" : "s"} in scope` });

  if (input.kind === "load") {
    const used = [...new Set(input.members.map((m) => m.schemeId).filter((s): s is string => !!s))];
    for (const id of used) {
      const s = schemesById.get(id);
      if (!s) continue;
      const cert = s.certificate;
      if (s.category >= 1 && !s.certificateKey)
        permit.push({ key: "certificate", ok: false, text: `Scheme ${s.reference} (design check category ${s.category}) has no design check certificate` });
      else if (s.category >= 1 && cert?.checkCategory != null && cert.checkCategory < s.category)
        permit.push({
          key: "certificate",
          ok: false,
          text: `Scheme ${s.reference} is design check category ${s.category}, but its check certificate (${cert.checkerName ?? "checker not named"}) is for category ${cert.checkCategory}; upload a category ${s.category} check certificate`,
        });
      else if (s.category >= 1 && cert)
        permit.push({
          key: "certificate",
          ok: true,
          text: `Scheme ${s.reference} (category ${s.category}) has its design check certificate: checked by ${cert.checkerName} on ${cert.documentDate ? formatDate(cert.documentDate, input.timeZone) : "—"}`,
        });
      else
        permit.push({
          key: "certificate",
          ok: true,
          text: s.category >= 1 ? `Scheme ${s.reference} (category ${s.category}) has its design check certificate` : `Scheme ${s.reference} is category 0: no separate check certificate needed`,
        });
      if (s.validUntil && s.validUntil.getTime() <= input.now.getTime())
        permit.push({ key: "scheme-validity", ok: false, text: `Scheme ${s.reference} was valid until ${formatDate(s.validUntil, input.timeZone)}` });
    }
  } else {
    permit.push(evidenceFinding(input.evidence));
  }

  const reasons = [
    ...permit.filter((f) => !f.ok).map((f) => f.text),
    ...members.flatMap((m) => m.findings.filter((f) => !f.ok).map((f) => `${m.tag}: ${f.text.charAt(0).toLowerCase()}${f.text.slice(1)}`)),
  ];
  return { canIssue: reasons.length === 0, members, permit, reasons };
}
