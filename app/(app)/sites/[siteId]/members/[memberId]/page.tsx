import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { CautionNotice } from "@/components/caution-notice";
import { Icon } from "@/components/icons";
import { CapacityChart } from "@/components/capacity-chart";
import { StepSource } from "@/components/step-source";
import { BASIS_LABELS, CheckResult, PassBadge } from "@/components/register/check-result";
import { formatUtilisation } from "@/lib/client/format";
import type { MemberBase } from "@/db/schema";
import { SOILS } from "@/lib/engineering/base-bearing";
import { getMemberType, listMemberTypes } from "@/db/queries/member-types";
import { getMemberForUser } from "@/db/queries/members";
import { listSchemes } from "@/db/queries/schemes";
import { listZones } from "@/db/queries/zones";
import { loadSitePage } from "@/lib/auth/site-page";
import { isUuid } from "@/lib/authz";
import { capacityCurve } from "@/lib/engineering";
import { endConditionInfo } from "@/lib/engineering/effective-length";
import type { Step } from "@/lib/engineering";
import { formatDate, formatDateTime } from "@/lib/format-date";
import { INSPECTION_RESULT_LABELS } from "@/lib/inspections/checklist";
import { MEMBER_STATUS_LABELS, PERMIT_STATUS_LABELS } from "@/lib/labels";
import { buildCheckRequest } from "@/lib/register/check-request";
import { memberDetail } from "@/lib/register/member-detail";
import { formatFeetInches, formatForce, formatLength } from "@/lib/units";
import { MemberEditForm } from "./member-edit-form";
import { AddPhotos } from "./add-photos";
import { MemberStateBanner } from "./member-state-banner";

export const metadata: Metadata = { title: "Member" };

/** Why a check was stored, in words. */
const CHECK_REASONS: Record<string, string> = {
  logged: "When logged",
  edited: "After an edit",
  imported: "When imported",
  "plumb reading": "After a plumb reading at an inspection",
  "scheme changed": "After its scheme changed",
};

/** An inspection's plumb reading in words: the angle used, and the offset as read. */
function plumbText(i: { plumbDeg: number | null; plumbOffsetMm: number | null; plumbOverMm: number | null }, len: (mm: number) => string) {
  if (i.plumbDeg == null) return null;
  const deg = `${Number(i.plumbDeg.toFixed(2))}°`;
  if (i.plumbOffsetMm == null) return `Plumb reading: ${deg} out of plumb.`;
  return `Plumb reading: ${len(i.plumbOffsetMm)} over ${i.plumbOverMm == null ? "the member's length" : len(i.plumbOverMm)} (${deg} out of plumb).`;
}

/** What the member stands on, in words and the site's units. */
function baseText(b: MemberBase | null, len: (mm: number) => string) {
  if (!b) return "Not given: bearing under the base is not checked";
  const plate = `Base plate ${len(b.basePlateBMm)} × ${len(b.basePlateLMm)}`;
  const sole = b.solePlateBMm != null && b.solePlateLMm != null ? `, sole plate ${len(b.solePlateBMm)} × ${len(b.solePlateLMm)}${b.solePlateTMm != null ? ` × ${len(b.solePlateTMm)}` : ""}` : "";
  const below =
    b.slabDepthMm != null || b.slabEffectiveDepthMm != null
      ? `on a slab ${len(b.slabDepthMm ?? b.slabEffectiveDepthMm!)} deep${b.fckMpa != null ? `, f_ck ${b.fckMpa} MPa` : ""}`
      : b.allowablePressureKPa != null
        ? `on ground at ${b.allowablePressureKPa} kPa allowable`
        : b.soil
          ? `on ${SOILS[b.soil].label.toLowerCase()} (${SOILS[b.soil].kPa} kPa allowable: ${SOILS[b.soil].source}${SOILS[b.soil].toConfirm ? `, ${SOILS[b.soil].toConfirm}` : ""})`
          : "on ground of unknown bearing";
  return `${plate}${sole}, ${below}`;
}

function fmtStep(s: Step) {
  if (typeof s.value === "string") return s.value;
  const abs = Math.abs(s.value);
  return abs !== 0 && (abs < 0.001 || abs >= 1e7) ? s.value.toExponential(3) : Number(s.value.toPrecision(5)).toString();
}

/** The working of a check, step by step, with each step's source. */
function StepsTable({ caption, steps }: { caption: string; steps: Step[] }) {
  return (
    <table className="w-full min-w-[36rem] text-left text-sm">
      <caption className="sr-only">{caption}</caption>
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
            <td className="p-1 text-ink-soft"><StepSource step={s} /></td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

export default async function MemberPage({ params }: { params: Promise<{ siteId: string; memberId: string }> }) {
  const { siteId, memberId } = await params;
  const { user, site, may } = await loadSitePage(siteId);
  if (!isUuid(memberId)) notFound();
  const member = await getMemberForUser({ memberId, organisationId: user.organisationId });
  if (!member || member.siteId !== site.id) notFound();
  // The same view model as GET /api/v1/members/{id}.
  const [detail, type] = await Promise.all([
    memberDetail({ member, site }),
    getMemberType({ organisationId: user.organisationId, memberTypeId: member.memberTypeId, includeArchived: true }),
  ]);
  const { checks, photos, inspections, permits, history, state } = detail;
  const us = site.unitSystem === "us";
  const forceUnit = us ? "kip" : "kN";
  const len = (mm: number | null) => (mm == null ? "—" : us ? formatFeetInches(mm) : formatLength(mm));
  const latest = detail.check;
  const when = (d: Date) => formatDateTime(d, site.timezone);

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
        formworkKnM2: s.formworkKnM2, constructionKnM2: s.constructionKnM2, backprop: s.backprop, designSpacingXMm: s.designSpacingXMm, designSpacingYMm: s.designSpacingYMm,
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
          <span
            className={`inline-flex items-center gap-1 rounded-lg border-2 px-2 py-1 text-sm font-bold ${member.status === "out_of_service" ? "border-bad bg-bad-soft text-bad" : "border-ink/30"}`}
            data-testid="member-status"
          >
            <Icon name={member.status === "out_of_service" ? "bad" : "register"} className="h-4 w-4" /> {MEMBER_STATUS_LABELS[member.status]}
          </span>
        </div>
        <p className="text-ink-soft">
          {member.memberTypeName}
          {member.zoneName ? ` · ${member.zoneName}` : ""}
          {member.schemeReference ? ` · ${member.schemeReference}` : ""}
        </p>
        {member.zoneId ? (
          <a href={`/sites/${site.id}/zones/${member.zoneId}/plan`} className="inline-flex min-h-touch w-fit items-center gap-2 font-semibold text-brand underline">
            <Icon name="overview" className="h-5 w-5" />
            {member.planX != null ? `See ${member.tag} on the plan of ${member.zoneName}` : `Plan of ${member.zoneName} (${member.tag} is not placed on it yet)`}
          </a>
        ) : null}
        <a
          href={`/sites/${site.id}/members/${member.id}/inspect`}
          className="inline-flex min-h-touch w-fit items-center gap-2 rounded-lg border-2 border-ink/70 bg-paper-raised px-4 font-semibold hover:bg-paper-sunk"
        >
          <Icon name="inspect" className="h-5 w-5" /> {may("inspect") && member.status !== "struck" ? "Record inspection" : "Inspection history"}
        </a>
      </header>

      <MemberStateBanner state={state} inspectHref={may("inspect") && member.status !== "struck" ? `/sites/${site.id}/members/${member.id}/inspect` : null} />

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
            ["Working load", `${formatForce(member.loadN, forceUnit)}${member.loadSource === "slab" ? " (derived from the scheme's slab)" : member.loadSource === "backprop" ? ` (from the scheme's back-propping, level ${member.level ?? "?"} of props: 1 = right under the slab being cast)` : ""}`],
            ["As-built spacing", member.spacingXMm != null && member.spacingYMm != null ? `${len(member.spacingXMm)} × ${len(member.spacingYMm)}` : "—"],
            ["Out of plumb (latest reading)", member.outOfPlumbDeg == null ? "No reading: checked standing plumb" : `${Number(member.outOfPlumbDeg.toFixed(2))}° — checked at this lean`],
            ["Base", baseText(member.base, len)],
            ["Capacity", member.capacityN == null ? "—" : formatForce(member.capacityN, forceUnit)],
            ["Utilisation", formatUtilisation(member.utilisation)],
            ["Logged by", `${member.createdByName ?? "—"}, ${when(member.createdAt)}`],
            ["Notes", member.notes ?? "—"],
          ].map(([k, v]) => (
            <div key={k} className="flex flex-col border-b border-ink/10 pb-1">
              <dt className="text-sm text-ink-soft">{k}</dt>
              <dd className="tabular font-semibold">{v}</dd>
            </div>
          ))}
        </dl>
      </section>

      <section aria-labelledby="inspections-h" className="rounded-xl border-2 border-ink/15 bg-paper-raised p-4" data-testid="member-inspections">
        <h2 id="inspections-h" className="mb-2 text-lg font-bold">Inspections ({inspections.length})</h2>
        {inspections.length === 0 ? (
          <p className="text-ink-soft">Not inspected yet.</p>
        ) : (
          <ol className="flex flex-col gap-2" aria-label="Inspection history">
            {inspections.map((i) => (
              <li key={i.id} className="break-words border-b border-ink/10 pb-2" data-testid="member-inspection">
                <p className="flex flex-wrap items-center gap-2">
                  <span className={`inline-flex items-center gap-1 rounded-lg px-2 py-0.5 text-sm font-bold ${i.result === "pass" ? "bg-ok-soft text-ok" : "bg-bad-soft text-bad"}`}>
                    <Icon name={i.result === "pass" ? "ok" : "bad"} className="h-4 w-4" /> {INSPECTION_RESULT_LABELS[i.result]}
                  </span>
                  <span>{when(i.inspectedAt)}{i.inspectorName ? ` · ${i.inspectorName}` : ""}</span>
                </p>
                {plumbText(i, (mm) => len(mm)) ? <p className="text-sm" data-testid="inspection-plumb">{plumbText(i, (mm) => len(mm))}</p> : null}
                {i.failedItems.length ? <p className="text-sm">Failed: {i.failedItems.join("; ")}</p> : null}
                {i.notes ? <p className="text-sm text-ink-soft">Notes: {i.notes}</p> : null}
                {i.nextDueAt ? <p className="text-sm text-ink-soft">Next due {when(i.nextDueAt)}</p> : null}
              </li>
            ))}
          </ol>
        )}
      </section>

      <section aria-labelledby="permits-h" className="rounded-xl border-2 border-ink/15 bg-paper-raised p-4" data-testid="member-permits">
        <h2 id="permits-h" className="mb-2 text-lg font-bold">Permits ({permits.length})</h2>
        {permits.length === 0 ? (
          <p className="text-ink-soft">Not named on any permit yet.</p>
        ) : (
          <ol className="flex flex-col gap-2" aria-label="Permit history">
            {permits.map((p) => (
              <li key={p.id} className="break-words border-b border-ink/10 pb-2" data-testid="member-permit">
                <p>
                  <a href={`/sites/${site.id}/permits/${p.id}`} className="font-semibold underline">{p.label}</a> · {PERMIT_STATUS_LABELS[p.status]}
                </p>
                <p className="text-sm text-ink-soft">
                  Requested {when(p.requestedAt)}{p.requestedByName ? ` by ${p.requestedByName}` : ""}
                  {p.issuedAt ? `; issued ${when(p.issuedAt)}${p.approvedByName ? ` by ${p.approvedByName}` : ""}` : ""}
                  {p.validUntil && p.status === "issued" ? `; valid until ${when(p.validUntil)}` : ""}
                  {p.closedAt ? `; closed ${when(p.closedAt)}` : ""}.
                </p>
                {!p.covers ? (
                  <p className="text-sm font-semibold text-bad">
                    Taken off this permit{p.removedAt ? ` on ${when(p.removedAt)}` : ""}{p.removedReason ? `: ${p.removedReason}` : ""}.
                  </p>
                ) : null}
              </li>
            ))}
          </ol>
        )}
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
                  {p.thumbnailUrl ? <img src={p.thumbnailUrl} alt={`Photo of ${member.tag}${p.takenAt ? ` taken ${formatDate(p.takenAt, "UTC")}` : ""}`} className="aspect-square w-full rounded-lg object-cover" /> : null}
                </a>
                <p className="text-xs text-ink-soft">{p.takenAt ? `Taken ${formatDate(p.takenAt, "UTC")}` : `Uploaded ${when(p.createdAt)}`}</p>
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
            siteId={site.id}
            memberId={member.id}
            unitSystem={site.unitSystem}
            member={{
              tag: member.tag, zoneId: member.zoneId, schemeId: member.schemeId, memberTypeId: member.memberTypeId, extensionMm: member.extensionMm,
              endConditions: member.endConditions, loadSource: member.loadSource, level: member.level, loadN: member.loadN, spacingXMm: member.spacingXMm, spacingYMm: member.spacingYMm,
              notes: member.notes, status: member.status, version: member.version, planX: member.planX, planY: member.planY,
            }}
            {...editProps}
          />
        </section>
      ) : null}

      <section aria-labelledby="checks-h" className="rounded-xl border-2 border-ink/15 bg-paper-raised p-4">
        <h2 id="checks-h" className="mb-2 text-lg font-bold">Check history ({checks.length})</h2>
        <ol className="flex flex-col gap-2">
          {checks.map((c) => {
            const v = c;
            const steps = c.steps;
            return (
              <li key={c.id}>
                <details className="rounded-lg border-2 border-ink/15" open={c.id === latest?.id && checks.length === 1}>
                  <summary className="flex min-h-touch cursor-pointer flex-wrap items-center gap-2 p-2">
                    <PassBadge pass={c.pass} />
                    <span className="tabular font-semibold">{c.capacityN == null ? "no capacity" : formatForce(c.capacityN, forceUnit)} · {formatUtilisation(c.utilisation)}</span>
                    <span className="text-sm text-ink-soft">
                      {CHECK_REASONS[c.reason] ?? c.reason} · {when(c.createdAt)} · {c.createdByName ?? "system"} · {c.method} · engine {c.engineVersion}
                    </span>
                  </summary>
                  <div className="overflow-x-auto p-2">
                    {v.errors?.length ? <ul className="mb-2">{v.errors.map((e, i) => <li key={i} className="font-semibold text-bad">⛔ {e.message}</li>)}</ul> : null}
                    <p className="mb-2 text-sm">Load factor {v.loadFactor}: {v.loadFactorSource}</p>
                    {steps.length ? (
                      <StepsTable caption="Working of this check" steps={steps} />
                    ) : null}
                    {v.warnings.length ? <ul className="mt-2 text-sm">{v.warnings.map((w, i) => <li key={i}>⚠ {w}</li>)}</ul> : null}
                    {v.bearing ? (
                      <div className="mt-3 border-t border-ink/10 pt-2" data-testid="check-bearing">
                        <h3 className="flex flex-wrap items-center gap-2 font-bold">
                          Bearing under the base <PassBadge pass={v.bearing.pass} /> <span className="tabular">{formatUtilisation(v.bearing.utilisation)}</span>
                        </h3>
                        <p className="mb-1 text-sm">
                          Load on the base {v.bearing.loadN == null ? "—" : formatForce(v.bearing.loadN, forceUnit)}
                          {v.bearing.loadFactor !== 1 ? ` (working load × ${v.bearing.loadFactor} for punching)` : " (working load)"}. Failing bearing fails the member.
                        </p>
                        {v.bearing.errors?.length ? <ul className="mb-2">{v.bearing.errors.map((e, i) => <li key={i} className="font-semibold text-bad">⛔ {e.message}</li>)}</ul> : null}
                        {v.bearing.steps.length ? (
                          <StepsTable caption="Working of the bearing check" steps={v.bearing.steps} />
                        ) : null}
                        {v.bearing.warnings.length ? <ul className="mt-2 text-sm">{v.bearing.warnings.map((w, i) => <li key={i}>⚠ {w}</li>)}</ul> : null}
                      </div>
                    ) : null}
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
          {history.map((h) => (
            <li key={h.id} className="break-words border-b border-ink/10 pb-2 text-sm" data-testid="member-history-item">
              <p>
                <strong>{h.summary}</strong>
              </p>
              {h.details.length ? (
                <ul className="text-ink-soft">
                  {h.details.map((d, i) => (
                    <li key={i}>{d}</li>
                  ))}
                </ul>
              ) : null}
              <p className="text-ink-soft">
                {h.actorName ?? "The system"} · {when(h.at)}
              </p>
            </li>
          ))}
        </ol>
      </section>
    </div>
  );
}
