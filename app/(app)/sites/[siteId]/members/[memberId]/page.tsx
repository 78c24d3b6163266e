import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { CautionNotice } from "@/components/caution-notice";
import { Icon } from "@/components/icons";
import { CapacityChart } from "@/components/capacity-chart";
import { BASIS_LABELS, CheckResult, PassBadge } from "@/components/register/check-result";
import { formatUtilisation } from "@/lib/client/format";
import { listAuditForEntity } from "@/db/queries/audit";
import { listChecks } from "@/db/queries/checks";
import { getMemberType, listMemberTypes } from "@/db/queries/member-types";
import { getMemberForUser } from "@/db/queries/members";
import { listPhotos } from "@/db/queries/photos";
import { listSchemes } from "@/db/queries/schemes";
import { listZones } from "@/db/queries/zones";
import { loadSitePage } from "@/lib/auth/site-page";
import { isUuid } from "@/lib/authz";
import { capacityCurve } from "@/lib/engineering";
import { endConditionInfo } from "@/lib/engineering/effective-length";
import type { Step } from "@/lib/engineering";
import { MEMBER_STATUS_LABELS } from "@/lib/labels";
import { presignGet } from "@/lib/storage";
import { buildCheckRequest } from "@/lib/register/check-request";
import { checkView } from "@/lib/register/members";
import { formatFeetInches, formatForce, formatLength } from "@/lib/units";
import { MemberEditForm } from "./member-edit-form";
import { AddPhotos } from "./add-photos";

export const metadata: Metadata = { title: "Member" };

const ACTION_LABELS: Record<string, string> = {
  "member.created": "Logged",
  "member.edited": "Edited",
  "member.edited_and_rechecked": "Edited and re-checked",
  "member.rechecked": "Re-checked after its type changed",
  "member.photo_added": "Photo added",
};

function short(v: unknown): string {
  if (v == null) return "—";
  if (typeof v === "number") return Number.isInteger(v) ? String(v) : v.toFixed(3);
  if (typeof v === "object") return JSON.stringify(v);
  return String(v);
}

function fmtStep(s: Step) {
  if (typeof s.value === "string") return s.value;
  const abs = Math.abs(s.value);
  return abs !== 0 && (abs < 0.001 || abs >= 1e7) ? s.value.toExponential(3) : Number(s.value.toPrecision(5)).toString();
}

export default async function MemberPage({ params }: { params: Promise<{ siteId: string; memberId: string }> }) {
  const { siteId, memberId } = await params;
  const { user, site, may } = await loadSitePage(siteId);
  if (!isUuid(memberId)) notFound();
  const member = await getMemberForUser({ memberId, organisationId: user.organisationId });
  if (!member || member.siteId !== site.id) notFound();
  const [checks, photoRows, audit, type] = await Promise.all([
    listChecks({ memberId }),
    listPhotos({ memberId }),
    listAuditForEntity({ entityType: "member", entityId: memberId, organisationId: user.organisationId }),
    getMemberType({ organisationId: user.organisationId, memberTypeId: member.memberTypeId, includeArchived: true }),
  ]);
  const photos = await Promise.all(
    photoRows.map(async (p) => ({ ...p, thumbUrl: p.thumbnailKey ? await presignGet(p.thumbnailKey) : null, displayUrl: p.displayKey ? await presignGet(p.displayKey) : null })),
  );
  const us = site.unitSystem === "us";
  const forceUnit = us ? "kip" : "kN";
  const len = (mm: number | null) => (mm == null ? "—" : us ? formatFeetInches(mm) : formatLength(mm));
  const latestRow = checks.find((c) => c.id === member.latestCheckId) ?? checks[0];
  const latest = latestRow ? checkView(latestRow) : null;

  // The curve: the same request as the check, over the type's range (or around the member's length).
  let curve: { lengthMm: number; capacityN: number }[] = [];
  let factor = 1;
  if (type) {
    const built = buildCheckRequest(type, member, site);
    factor = built.loadFactor;
    const { loadN: _l, ...req } = built.request;
    const lo = type.minExtensionMm ?? Math.max(300, member.extensionMm * 0.5);
    const hi = type.maxExtensionMm ?? member.extensionMm * 1.5;
    curve = capacityCurve(req, lo, hi, 60).map((p) => ({ lengthMm: p.lengthMm, capacityN: p.capacityN }));
  }

  let editProps = null;
  if (may("editMember")) {
    const [zones, schemes, types] = await Promise.all([listZones({ siteId: site.id }), listSchemes({ siteId: site.id }), listMemberTypes({ organisationId: site.organisationId })]);
    editProps = {
      zones: zones.map((z) => ({ id: z.id, name: z.name })),
      schemes: schemes.map((s) => ({
        id: s.id, reference: s.reference, title: s.title, slabThicknessMm: s.slabThicknessMm, concreteDensityKnM3: s.concreteDensityKnM3,
        formworkKnM2: s.formworkKnM2, constructionKnM2: s.constructionKnM2, designSpacingXMm: s.designSpacingXMm, designSpacingYMm: s.designSpacingYMm,
      })),
      types: types.map((t) => ({ id: t.id, name: t.name, kind: t.kind, minExtensionMm: t.minExtensionMm, maxExtensionMm: t.maxExtensionMm })),
    };
  }

  return (
    <div className="flex flex-col gap-6">
      <header className="flex flex-col gap-2">
        <p className="text-sm text-ink-soft">
          <a href={`/sites/${site.id}/members`} className="underline">Register</a> / member
        </p>
        <div className="flex flex-wrap items-center gap-3">
          <h1 className="text-2xl font-bold">{member.tag}</h1>
          <PassBadge pass={member.checkPass} />
          <span className="inline-flex items-center gap-1 rounded-lg border-2 border-ink/30 px-2 py-1 text-sm font-bold" data-testid="member-status">
            <Icon name={member.status === "out_of_service" ? "bad" : "register"} className="h-4 w-4" /> {MEMBER_STATUS_LABELS[member.status]}
          </span>
        </div>
        <p className="text-ink-soft">
          {member.memberTypeName}
          {member.zoneName ? ` · ${member.zoneName}` : ""}
          {member.schemeReference ? ` · ${member.schemeReference}` : ""}
        </p>
        <a
          href={`/sites/${site.id}/members/${member.id}/inspect`}
          className="inline-flex min-h-touch w-fit items-center gap-2 rounded-lg border-2 border-ink/70 bg-paper-raised px-4 font-semibold hover:bg-paper-sunk"
        >
          <Icon name="inspect" className="h-5 w-5" /> {may("inspect") && member.status !== "struck" ? "Record inspection" : "Inspection history"}
        </a>
      </header>

      <CautionNotice />

      {latest ? <CheckResult check={latest} loadN={member.loadN} forceUnit={forceUnit} title="Latest capacity check" /> : <p>No check has been stored for this member.</p>}

      <section aria-labelledby="chart-h" className="rounded-xl border-2 border-ink/15 bg-paper-raised p-4">
        <h2 id="chart-h" className="mb-2 text-lg font-bold">Capacity against extension</h2>
        <CapacityChart
          points={curve}
          operating={{ lengthMm: member.extensionMm, loadN: member.loadN * factor }}
          pass={member.checkPass}
          basisLabel={latest ? `capacity as ${BASIS_LABELS[latest.basis] ?? latest.basis}` : "capacity"}
          forceUnit={forceUnit}
          lengthUnit={us ? "in" : "mm"}
        />
      </section>

      <section aria-labelledby="details-h" className="rounded-xl border-2 border-ink/15 bg-paper-raised p-4">
        <h2 id="details-h" className="mb-2 text-lg font-bold">Details</h2>
        <dl className="grid grid-cols-1 gap-x-6 gap-y-2 sm:grid-cols-2">
          {[
            ["Tag", member.tag],
            ["Status", MEMBER_STATUS_LABELS[member.status]],
            ["Member type", member.memberTypeName],
            ["Zone", member.zoneName ?? "—"],
            ["Scheme", member.schemeReference ? `${member.schemeReference} — ${member.schemeTitle}` : "—"],
            ["Measured extension", len(member.extensionMm)],
            ["End conditions", endConditionInfo(member.endConditions).label],
            ["Working load", `${formatForce(member.loadN, forceUnit)}${member.loadSource === "slab" ? " (derived from the scheme's slab)" : ""}`],
            ["As-built spacing", member.spacingXMm != null && member.spacingYMm != null ? `${len(member.spacingXMm)} × ${len(member.spacingYMm)}` : "—"],
            ["Capacity", member.capacityN == null ? "—" : formatForce(member.capacityN, forceUnit)],
            ["Utilisation", formatUtilisation(member.utilisation)],
            ["Logged by", `${member.createdByName ?? "—"}, ${member.createdAt.toLocaleString("en-GB", { timeZone: site.timezone })}`],
            ["Notes", member.notes ?? "—"],
          ].map(([k, v]) => (
            <div key={k} className="flex flex-col border-b border-ink/10 pb-1">
              <dt className="text-sm text-ink-soft">{k}</dt>
              <dd className="tabular font-semibold">{v}</dd>
            </div>
          ))}
        </dl>
      </section>

      <section aria-labelledby="photos-h" className="rounded-xl border-2 border-ink/15 bg-paper-raised p-4">
        <h2 id="photos-h" className="mb-2 text-lg font-bold">Photos ({photos.length})</h2>
        {photos.length === 0 ? (
          <p className="flex items-center gap-2 font-semibold text-warn"><Icon name="warn" /> No photo yet: a permit needs one.</p>
        ) : (
          <ul className="grid grid-cols-3 gap-2 sm:grid-cols-5" aria-label="Photos of this member">
            {photos.map((p) => (
              <li key={p.id}>
                <a href={p.displayUrl ?? "#"} target="_blank" rel="noreferrer" className="block">
                  {p.thumbUrl ? <img src={p.thumbUrl} alt={`Photo of ${member.tag}${p.takenAt ? ` taken ${p.takenAt.toLocaleString("en-GB", { timeZone: "UTC" })}` : ""}`} className="aspect-square w-full rounded-lg object-cover" /> : null}
                </a>
                <p className="text-xs text-ink-soft">{p.takenAt ? `Taken ${p.takenAt.toLocaleDateString("en-GB", { timeZone: "UTC" })}` : `Uploaded ${p.createdAt.toLocaleDateString("en-GB", { timeZone: site.timezone })}`}</p>
              </li>
            ))}
          </ul>
        )}
        {may("editMember") ? <AddPhotos memberId={member.id} /> : null}
      </section>

      {editProps ? (
        <section aria-labelledby="edit-h" className="rounded-xl border-2 border-ink/15 bg-paper-raised p-4">
          <h2 id="edit-h" className="mb-2 text-lg font-bold">Edit this member</h2>
          <p className="mb-3 text-sm text-ink-soft">A change to the extension, load, spacing, end conditions, type or scheme re-checks the member and keeps the old check in its history.</p>
          <MemberEditForm
            memberId={member.id}
            unitSystem={site.unitSystem}
            member={{
              tag: member.tag, zoneId: member.zoneId, schemeId: member.schemeId, memberTypeId: member.memberTypeId, extensionMm: member.extensionMm,
              endConditions: member.endConditions, loadSource: member.loadSource, loadN: member.loadN, spacingXMm: member.spacingXMm, spacingYMm: member.spacingYMm,
              notes: member.notes, status: member.status,
            }}
            {...editProps}
          />
        </section>
      ) : null}

      <section aria-labelledby="checks-h" className="rounded-xl border-2 border-ink/15 bg-paper-raised p-4">
        <h2 id="checks-h" className="mb-2 text-lg font-bold">Check history ({checks.length})</h2>
        <ol className="flex flex-col gap-2">
          {checks.map((c) => {
            const v = checkView(c);
            const result = c.result as { steps?: Step[] };
            const slab = (c.inputs as { slabLoad?: { steps?: Step[] } }).slabLoad;
            const steps = [...(slab?.steps ?? []), ...(result.steps ?? [])];
            return (
              <li key={c.id}>
                <details className="rounded-lg border-2 border-ink/15" open={c.id === latestRow?.id && checks.length === 1}>
                  <summary className="flex min-h-touch cursor-pointer flex-wrap items-center gap-2 p-2">
                    <PassBadge pass={c.pass} />
                    <span className="tabular font-semibold">{c.capacityN == null ? "no capacity" : formatForce(c.capacityN, forceUnit)} · {formatUtilisation(c.utilisation)}</span>
                    <span className="text-sm text-ink-soft">
                      {c.reason} · {c.createdAt.toLocaleString("en-GB", { timeZone: site.timezone })} · {c.createdByName ?? "system"} · {c.method} · engine {c.engineVersion}
                    </span>
                  </summary>
                  <div className="overflow-x-auto p-2">
                    {v.errors?.length ? <ul className="mb-2">{v.errors.map((e, i) => <li key={i} className="font-semibold text-bad">⛔ {e.message}</li>)}</ul> : null}
                    <p className="mb-2 text-sm">Load factor {v.loadFactor}: {v.loadFactorSource}</p>
                    {steps.length ? (
                      <table className="w-full min-w-[36rem] text-left text-sm">
                        <caption className="sr-only">Working of this check</caption>
                        <thead className="bg-paper-sunk">
                          <tr><th scope="col" className="p-1">Step</th><th scope="col" className="p-1">Symbol</th><th scope="col" className="p-1 text-right">Value</th><th scope="col" className="p-1">Unit</th><th scope="col" className="p-1">Source</th></tr>
                        </thead>
                        <tbody>
                          {steps.map((s, i) => (
                            <tr key={i} className="border-t border-ink/10">
                              <td className="p-1">{s.label}</td>
                              <td className="p-1 font-mono">{s.symbol}</td>
                              <td className="tabular p-1 text-right">{fmtStep(s)}</td>
                              <td className="p-1">{s.unit}</td>
                              <td className="p-1 text-ink-soft">{s.source}</td>
                            </tr>
                          ))}
                        </tbody>
                      </table>
                    ) : null}
                    {v.warnings.length ? <ul className="mt-2 text-sm">{v.warnings.map((w, i) => <li key={i}>⚠ {w}</li>)}</ul> : null}
                  </div>
                </details>
              </li>
            );
          })}
        </ol>
      </section>

      <section aria-labelledby="audit-h" className="rounded-xl border-2 border-ink/15 bg-paper-raised p-4">
        <h2 id="audit-h" className="mb-2 text-lg font-bold">History</h2>
        <ol className="flex flex-col gap-2" aria-label="Audit history">
          {audit.map((a) => {
            const before = (a.before ?? {}) as Record<string, unknown>;
            const after = (a.after ?? {}) as Record<string, unknown>;
            const keys = a.action === "member.created" ? [] : Object.keys(after).filter((k) => k !== "check");
            return (
              <li key={a.id} className="border-b border-ink/10 pb-2 text-sm">
                <p>
                  <strong>{ACTION_LABELS[a.action] ?? a.action}</strong> by {a.actorName ?? "the system"} · {a.at.toLocaleString("en-GB", { timeZone: site.timezone })}
                </p>
                {keys.length ? (
                  <ul className="tabular text-ink-soft">
                    {keys.map((k) => (
                      <li key={k}>{k}: {short(before[k])} → {short(after[k])}</li>
                    ))}
                  </ul>
                ) : null}
              </li>
            );
          })}
        </ol>
      </section>
    </div>
  );
}
