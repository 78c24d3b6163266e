// A member's audit trail told as sentences a site team reads ("Status changed from Submitted to
// Out of service after the inspection on 2 Dec 2026"), never as raw keys, hashes or ids. Pure, so
// the page, the API and a test all get the same words.
import { endConditionInfo } from "@/lib/engineering/effective-length";
import type { EndCondition } from "@/lib/engineering/types";
import { MEMBER_FIELD_LABELS, MEMBER_STATUS_LABELS } from "@/lib/labels";
import { formatDate } from "@/lib/format-date";
import { formatFeetInches, formatForce, formatLength } from "@/lib/units";

export type AuditRow = { id: number | string; action: string; before: unknown; after: unknown; at: Date; actorName: string | null };

export type HistoryEntry = {
  id: string;
  at: Date;
  actorName: string | null;
  /** One sentence saying what happened. */
  summary: string;
  /** Further sentences: each field that changed, the new check. */
  details: string[];
};

type Names = { zone: Map<string, string>; scheme: Map<string, string>; memberType: Map<string, string> };
type Ctx = {
  timeZone: string;
  unitSystem: "si" | "us";
  names: Names;
  inspections: { id: string; result: "pass" | "fail"; inspectedAt: Date }[];
};

/** A scheme's fields that a derived load depends on, as a re-check after a scheme change names them. */
const SCHEME_FIELD_LABELS: Record<string, string> = {
  slabThicknessMm: "slab thickness",
  concreteDensityKnM3: "concrete density",
  formworkKnM2: "formwork self-weight",
  constructionKnM2: "construction operations load",
  backprop: "back-propping",
};
/** Kept from the record but said through the check sentence, not one by one. */
const CHECK_KEYS = new Set(["latestCheckId", "capacityN", "utilisation", "checkPass", "check"]);


const obj = (v: unknown) => (v && typeof v === "object" ? (v as Record<string, unknown>) : {});
const statusLabel = (v: unknown) => MEMBER_STATUS_LABELS[v as keyof typeof MEMBER_STATUS_LABELS] ?? "an unknown status";

function valueText(key: string, v: unknown, ctx: Ctx): string {
  if (v == null || v === "") return "none";
  const len = (mm: number) => (ctx.unitSystem === "us" ? formatFeetInches(mm) : formatLength(mm));
  switch (key) {
    case "extensionMm":
    case "spacingXMm":
    case "spacingYMm":
      return typeof v === "number" ? len(v) : String(v);
    case "loadN":
      return typeof v === "number" ? formatForce(v, ctx.unitSystem === "us" ? "kip" : "kN") : String(v);
    case "endConditions":
      try {
        return endConditionInfo(v as EndCondition)?.label ?? String(v);
      } catch {
        return String(v);
      }
    case "loadSource":
      return v === "slab" ? "derived from the scheme's slab" : v === "backprop" ? "derived from the scheme's back-propping" : "given directly";
    case "status":
      return statusLabel(v);
    case "zoneId":
      return ctx.names.zone.get(String(v)) ?? "a zone since deleted";
    case "schemeId":
      return ctx.names.scheme.get(String(v)) ?? "a scheme since deleted";
    case "memberTypeId":
      return ctx.names.memberType.get(String(v)) ?? "a member type since deleted";
    case "notes":
    case "tag":
      return `“${String(v)}”`;
    case "planPosition": {
      const p = obj(v);
      return typeof p.x === "number" && typeof p.y === "number" ? `${Math.round(p.x * 100)} % across, ${Math.round(p.y * 100)} % down` : "none";
    }
    default:
      return String(v);
  }
}

function checkSentence(c: Record<string, unknown>): string | null {
  if (!("pass" in c) && !("checkPass" in c)) return null;
  const pass = Boolean(c.pass ?? c.checkPass);
  const u = typeof c.utilisation === "number" ? ` (utilisation ${Math.round(c.utilisation * 100)} %)` : "";
  return pass ? `The re-check passes${u}.` : `The re-check fails${u}: do not load it until it is corrected.`;
}

function inspectionPhrase(id: unknown, ctx: Ctx): string {
  const i = ctx.inspections.find((x) => x.id === id);
  return i ? ` after the ${i.result === "pass" ? "passing " : "failed "}inspection on ${formatDate(i.inspectedAt, ctx.timeZone)}` : " after an inspection";
}

function permitPhrase(label: unknown): string {
  return typeof label === "string" && label ? label : "a permit";
}

export function sentence(row: AuditRow, ctx: Ctx): { summary: string; details: string[] } {
  const before = obj(row.before);
  const after = obj(row.after);
  switch (row.action) {
    case "member.created": {
      const how = after.source === "import" ? " from an imported file" : after.source === "form" ? " on the phone form" : "";
      const check = obj(after.check);
      const details = "pass" in check ? [check.pass ? "Its capacity check passes." : "Its capacity check fails: do not load it until it is corrected."] : [];
      return { summary: `Logged${row.actorName ? ` by ${row.actorName}` : ""}${how}, as ${statusLabel(after.status)}.`, details };
    }
    case "member.edited":
    case "member.edited_and_rechecked": {
      const details: string[] = [];
      for (const k of Object.keys(after)) {
        if (CHECK_KEYS.has(k)) continue;
        const label = MEMBER_FIELD_LABELS[k] ?? "Another detail";
        if (k === "notes" && after[k] == null) details.push("Notes removed.");
        else details.push(`${label} changed from ${valueText(k, before[k], ctx)} to ${valueText(k, after[k], ctx)}.`);
      }
      const check = checkSentence(obj(after.check));
      if (row.action === "member.edited_and_rechecked" && check) details.push(check);
      const statusOnly = Object.keys(after).filter((k) => !CHECK_KEYS.has(k));
      if (statusOnly.length === 1 && statusOnly[0] === "status")
        return { summary: `Status changed from ${statusLabel(before.status)} to ${statusLabel(after.status)} by editing.`, details: [] };
      return { summary: row.action === "member.edited" ? "Edited." : "Edited and re-checked.", details };
    }
    case "member.rechecked": {
      const checkText = [checkSentence({ pass: after.checkPass, utilisation: after.utilisation }) ?? ""].filter(Boolean);
      if (typeof after.plumbDeg === "number") {
        const deg = Number(after.plumbDeg.toFixed(2));
        return {
          summary: deg > 0 ? `Re-checked ${deg}° out of plumb, as read at an inspection.` : "Re-checked standing plumb, as read at an inspection.",
          details: checkText,
        };
      }
      if (after.reason === "scheme changed") {
        const ref = typeof after.schemeReference === "string" ? `scheme ${after.schemeReference}` : "its scheme";
        const fields = Array.isArray(after.schemeFields) ? after.schemeFields.map((f) => SCHEME_FIELD_LABELS[String(f)]).filter(Boolean) : [];
        const what = fields.length ? ` (${fields.join(", ")})` : "";
        const load = typeof before.loadN === "number" && typeof after.loadN === "number" && before.loadN !== after.loadN ? [`Working load changed from ${valueText("loadN", before.loadN, ctx)} to ${valueText("loadN", after.loadN, ctx)}.`] : [];
        return { summary: `Re-checked because ${ref} was changed${what}.`, details: [...load, ...checkText] };
      }
      const rev = typeof after.memberTypeRevision === "number" ? ` (revision ${after.memberTypeRevision})` : "";
      return { summary: `Re-checked because its member type was revised${rev}.`, details: [checkSentence({ pass: after.checkPass, utilisation: after.utilisation }) ?? ""].filter(Boolean) };
    }
    case "member.status_changed": {
      const from = statusLabel(before.status);
      const to = statusLabel(after.status);
      const reason = String(after.reason ?? "");
      if (after.inspectionId) return { summary: `Status changed from ${from} to ${to}${inspectionPhrase(after.inspectionId, ctx)}.`, details: [] };
      return { summary: `Status changed from ${from} to ${to}${reason ? `: ${reason}` : ""}.`, details: [] };
    }
    case "member.loaded":
      return { summary: `Status changed from ${statusLabel(before.status)} to Loaded when ${permitPhrase(after.permit)} was issued.`, details: [] };
    case "member.unloaded":
      return { summary: `Status changed from Loaded to ${statusLabel(after.status)}: ${permitPhrase(after.permit)}${after.reason ? ` (${String(after.reason).replace(/^permit /, "")})` : ""}.`, details: [] };
    case "member.struck":
      return { summary: `Struck under ${permitPhrase(after.permit)}: the member is no longer standing.`, details: [] };
    case "member.photo_added": {
      const taken = after.takenAt ? ` (taken ${formatDate(new Date(String(after.takenAt)), ctx.timeZone)})` : "";
      return { summary: `Photo added${taken}.`, details: [] };
    }
    default: {
      // An action this page has no words for yet: say it plainly rather than show its key.
      const words = row.action.replace(/^[a-z]+\./, "").replace(/[_.]/g, " ");
      return { summary: `${words.charAt(0).toUpperCase()}${words.slice(1)}.`, details: [] };
    }
  }
}

export function historySentences(rows: AuditRow[], ctx: Ctx): HistoryEntry[] {
  return rows.map((r) => ({ id: String(r.id), at: r.at, actorName: r.actorName, ...sentence(r, ctx) }));
}

/** The zone, scheme and member type ids that the trail mentions, to look their names up once. */
export function idsInAudit(rows: AuditRow[]) {
  const zoneIds = new Set<string>();
  const schemeIds = new Set<string>();
  const memberTypeIds = new Set<string>();
  for (const r of rows) {
    for (const side of [obj(r.before), obj(r.after)]) {
      if (typeof side.zoneId === "string") zoneIds.add(side.zoneId);
      if (typeof side.schemeId === "string") schemeIds.add(side.schemeId);
      if (typeof side.memberTypeId === "string") memberTypeIds.add(side.memberTypeId);
    }
  }
  return { zoneIds: [...zoneIds], schemeIds: [...schemeIds], memberTypeIds: [...memberTypeIds] };
}
