import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { CautionNotice } from "@/components/caution-notice";
import { Icon } from "@/components/icons";
import { buttonClass } from "@/components/ui/button";
import { RESOURCES } from "@/lib/api/resources";
import { loadSitePage } from "@/lib/auth/site-page";
import { NotFoundError } from "@/lib/errors";
import { MEMBER_STATUS_LABELS } from "@/lib/labels";
import { permitDetail, type PermitDetail } from "@/lib/permits";
import { formatDateTime } from "@/lib/format-date";
import { requestReference } from "@/lib/permits/words";
import { fmtForce, fmtValidUntil, fmtLength, fmtUtilisation } from "@/lib/permits/format";
import { evidenceFinding as describeEvidence } from "@/lib/permits/preconditions";
import type { Finding } from "@/lib/permits/preconditions";
import { MAX_VALIDITY_DAYS, PERMIT_KIND_LABELS } from "@/lib/validations/permit";
import { PermitStatus } from "../permit-status";
import { AmendEvidence, IssuePanel, LiveRefresh, PostAction, ReasonAction, StrikeMembers } from "./permit-actions";

export const metadata: Metadata = { title: "Permit" };

function FindingLine({ f, compact = false }: { f: Finding; compact?: boolean }) {
  return (
    <span className={`flex items-start gap-1.5 ${f.ok ? "text-ink" : "font-semibold text-bad"} ${compact ? "text-sm" : ""}`}>
      <Icon name={f.ok ? "ok" : "bad"} className={`mt-0.5 h-4 w-4 shrink-0 ${f.ok ? "text-ok" : "text-bad"}`} />
      <span>
        <span className="sr-only">{f.ok ? "Met: " : "Not met: "}</span>
        {f.text}
      </span>
    </span>
  );
}

const FINDING_COLUMNS = [
  { key: "check", label: "Capacity check" },
  { key: "photos", label: "Photos" },
  { key: "inspection", label: "Inspection" },
  { key: "state", label: "State" },
] as const;

function Review({ d, siteId }: { d: PermitDetail; siteId: string }) {
  const ev = d.evaluation;
  const bad = ev.reasons.length;
  const kindLoad = d.permit.kind === "load";
  return (
    <section aria-labelledby="review-h" className="flex flex-col gap-3">
      <h2 id="review-h" className="text-xl font-bold">
        Review before issuing
      </h2>
      {ev.canIssue ? (
        <p role="status" className="flex items-center gap-2 rounded-lg border-2 border-ok bg-ok-soft p-3 font-bold text-ok" data-testid="review-verdict">
          <Icon name="ok" /> Ready to issue: every precondition is met for all {d.scope.length} member{d.scope.length === 1 ? "" : "s"}.
        </p>
      ) : (
        <div role="status" className="rounded-lg border-2 border-bad bg-bad-soft p-3 text-bad" data-testid="review-verdict">
          <p className="flex items-center gap-2 font-bold">
            <Icon name="bad" /> Cannot be issued yet: {bad} problem{bad === 1 ? "" : "s"}
          </p>
          <ul className="mt-2 list-disc pl-8 font-semibold">
            {ev.reasons.map((r) => (
              <li key={r}>{r}</li>
            ))}
          </ul>
        </div>
      )}
      <ul className="flex flex-col gap-1 rounded-xl border-2 border-ink/15 bg-paper-raised p-3" aria-label="Permit preconditions">
        {ev.permit.map((f, i) => (
          <li key={i}>
            <FindingLine f={f} />
          </li>
        ))}
      </ul>

      {/* Desktop: one row per member, one column per precondition. */}
      <div className="hidden overflow-x-auto rounded-xl border-2 border-ink/15 bg-paper-raised md:block">
        <table className="w-full text-left" aria-label="Members in scope, precondition by precondition">
          <thead className="bg-paper-sunk">
            <tr>
              <th scope="col" className="p-2">
                Member
              </th>
              {(kindLoad ? FINDING_COLUMNS : FINDING_COLUMNS.filter((c) => c.key === "state")).map((c) => (
                <th key={c.key} scope="col" className="p-2">
                  {c.label}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {ev.members.map((m) => {
              const row = d.scope.find((s) => s.id === m.id)!;
              return (
                <tr key={m.id} className={`border-t border-ink/10 align-top ${m.ready ? "" : "bg-bad-soft/40"}`} data-testid={`review-${m.tag}`}>
                  <th scope="row" className="p-2">
                    <Link href={`/sites/${siteId}/members/${m.id}`} className="font-bold underline-offset-4 hover:underline">
                      {m.tag}
                    </Link>
                    <div className="text-sm font-normal text-ink-soft">
                      {row.memberTypeName} · {fmtLength(row.extensionMm, d.units)}
                    </div>
                    <div className="mt-1 text-sm">
                      {m.ready ? (
                        <span className="inline-flex items-center gap-1 font-semibold text-ok">
                          <Icon name="ok" className="h-4 w-4" /> Ready
                        </span>
                      ) : (
                        <span className="inline-flex items-center gap-1 font-semibold text-bad">
                          <Icon name="bad" className="h-4 w-4" /> Not ready
                        </span>
                      )}
                    </div>
                  </th>
                  {(kindLoad ? FINDING_COLUMNS : FINDING_COLUMNS.filter((c) => c.key === "state")).map((c) => (
                    <td key={c.key} className="p-2">
                      <div className="flex flex-col gap-1">
                        {m.findings
                          .filter((f) => f.key === c.key || (c.key === "state" && f.key === "scheme"))
                          .map((f, i) => (
                            <FindingLine key={i} f={f} compact />
                          ))}
                      </div>
                    </td>
                  ))}
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {/* Phone: one card per member. */}
      <ul className="flex flex-col gap-2 md:hidden" aria-label="Members in scope">
        {ev.members.map((m) => (
          <li key={m.id} className={`rounded-xl border-2 p-3 ${m.ready ? "border-ink/15 bg-paper-raised" : "border-bad bg-bad-soft/40"}`}>
            <Link href={`/sites/${siteId}/members/${m.id}`} className="font-bold underline-offset-4 hover:underline">
              {m.tag}
            </Link>{" "}
            <span className={`text-sm font-semibold ${m.ready ? "text-ok" : "text-bad"}`}>{m.ready ? "Ready" : "Not ready"}</span>
            <div className="mt-1 flex flex-col gap-1">
              {m.findings.map((f, i) => (
                <FindingLine key={i} f={f} compact />
              ))}
            </div>
          </li>
        ))}
      </ul>
    </section>
  );
}

function ScopeTable({ d, siteId }: { d: PermitDetail; siteId: string }) {
  return (
    <section aria-labelledby="scope-h" className="flex flex-col gap-2">
      <h2 id="scope-h" className="text-xl font-bold">
        Members ({d.scope.length})
      </h2>
      <div className="overflow-x-auto rounded-xl border-2 border-ink/15 bg-paper-raised">
        <table className="w-full text-left">
          <thead className="bg-paper-sunk">
            <tr>
              <th scope="col" className="p-2">Tag</th>
              <th scope="col" className="p-2">State now</th>
              <th scope="col" className="hidden p-2 md:table-cell">Type</th>
              <th scope="col" className="p-2 text-right">Extension</th>
              <th scope="col" className="p-2 text-right">Load</th>
              <th scope="col" className="hidden p-2 text-right md:table-cell">Capacity</th>
              <th scope="col" className="p-2 text-right">Util.</th>
            </tr>
          </thead>
          <tbody>
            {d.scope.map((m) => (
              <tr key={m.id} className="border-t border-ink/10" data-testid={`scope-${m.tag}`}>
                <td className="p-2 font-bold">
                  <Link href={`/sites/${siteId}/members/${m.id}`} className="underline-offset-4 hover:underline">
                    {m.tag}
                  </Link>
                </td>
                <td className="p-2" data-testid="member-state">
                  {MEMBER_STATUS_LABELS[m.status]}
                </td>
                <td className="hidden p-2 text-sm md:table-cell">{m.memberTypeName}</td>
                <td className="tabular p-2 text-right">{fmtLength(m.extensionMm, d.units)}</td>
                <td className="tabular p-2 text-right">{fmtForce(m.loadN, d.units)}</td>
                <td className="tabular hidden p-2 text-right md:table-cell">{fmtForce(m.capacityN, d.units)}</td>
                <td className="tabular p-2 text-right">{fmtUtilisation(m.utilisation)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}

function Delivery({ d }: { d: PermitDetail }) {
  if (d.emails.length === 0) return null;
  const word = (e: PermitDetail["emails"][number]) =>
    e.waiting
      ? { icon: "warn" as const, text: "Waiting for the PDF", cls: "text-warn" }
      : e.status === "sent"
        ? { icon: "ok" as const, text: "Sent", cls: "text-ok" }
        : e.status === "failed"
          ? { icon: "bad" as const, text: `Failed: ${e.lastError ?? "unknown reason"}`, cls: "text-bad" }
          : e.lastError
            ? { icon: "warn" as const, text: `Retrying (attempt ${e.attempts}): ${e.lastError}`, cls: "text-warn" }
            : { icon: "permit" as const, text: e.status === "sending" ? "Sending" : "Queued", cls: "text-ink-soft" };
  return (
    <section aria-labelledby="delivery-h" className="flex flex-col gap-2">
      <h2 id="delivery-h" className="text-xl font-bold">
        E-mails
      </h2>
      <ul className="flex flex-col divide-y divide-ink/10 rounded-xl border-2 border-ink/15 bg-paper-raised">
        {d.emails.map((e) => {
          const w = word(e);
          return (
            <li key={e.id} className="flex flex-wrap items-center justify-between gap-2 p-2" data-testid="email-delivery">
              <span className="min-w-0 break-all">
                {e.toEmail} <span className="text-sm text-ink-soft">({e.kind.replace("permit.", "")})</span>
              </span>
              <span className={`inline-flex items-center gap-1 font-semibold ${w.cls}`}>
                <Icon name={w.icon} className="h-4 w-4" /> {w.text}
              </span>
            </li>
          );
        })}
      </ul>
    </section>
  );
}

export default async function PermitPage({ params }: { params: Promise<{ siteId: string; permitId: string }> }) {
  const { siteId, permitId } = await params;
  const { user, site } = await loadSitePage(siteId);
  let d: PermitDetail;
  try {
    // The same loader the API's seam uses: 404 for a malformed id or another organisation's permit.
    d = await permitDetail({ user, ...(await RESOURCES.permit.load(user, { permitId })) });
  } catch (e) {
    if (e instanceof NotFoundError) notFound();
    throw e;
  }
  if (d.permit.siteId !== site.id) notFound();
  const p = d.permit;
  const v = d.view;
  const tz = site.timezone;
  const when = (x: Date | null) => formatDateTime(x, tz);
  const title = d.numberLabel ?? `${PERMIT_KIND_LABELS[p.kind]} — ${requestReference({ requestNumber: p.requestNumber, requestedByName: v.requestedByName, requestedAt: p.requestedAt }, tz)}`;
  const evidenceFinding = p.kind === "strike" ? d.evaluation.permit.find((f) => f.key === "evidence") : undefined;
  const waiting = (p.status === "issued" && !p.pdfKey) || d.emails.some((e) => e.waiting || e.status === "queued" || e.status === "sending");

  const facts: [string, React.ReactNode][] = [
    ["Kind", PERMIT_KIND_LABELS[p.kind]],
    ["Requested", `${when(p.requestedAt)} by ${v.requestedByName}`],
    ["Zone", v.zoneName ?? ([...new Set(d.scope.map((m) => m.zoneName).filter(Boolean))].join(", ") || "—")],
    [
      "Scheme",
      v.schemeReference ? (
        <>
          {v.schemeReference} — {v.schemeTitle} · design check category {v.schemeCategory} ·{" "}
          {v.schemeCategory! >= 1 ? (v.schemeCertificateKey ? "check certificate on file" : "no check certificate") : "no certificate needed"}
        </>
      ) : (
        [...new Set(d.scope.map((m) => m.schemeReference).filter(Boolean))].join(", ") || "—"
      ),
    ],
  ];
  if (p.requestNote) facts.push(["Note", p.requestNote]);
  if (p.issuedAt) facts.push(["Issued", `${when(p.issuedAt)} by ${v.approvedByName ?? "—"}`]);
  if (p.validUntil) facts.push(["Valid until", fmtValidUntil(p.issuedAt, p.validUntil, tz)]);
  if (p.issuedAt) facts.push(["Conditions", p.conditions ?? "None beyond the design and this permit"]);
  if (p.status === "refused") facts.push(["Refused", `${when(p.closedAt)} by ${v.closedByName ?? "—"}: ${p.refusedReason}`]);
  if (p.status === "withdrawn") facts.push(["Withdrawn", `${when(p.closedAt)} by ${v.closedByName ?? "—"}: ${p.withdrawnReason}`]);
  if (p.struckConfirmedAt) facts.push(["Striking done", `${when(p.struckConfirmedAt)}, confirmed by ${v.struckConfirmedByName ?? "—"}`]);
  else if (p.status === "closed") facts.push(["Closed", `${when(p.closedAt)} by ${v.closedByName ?? "—"}`]);

  return (
    <div className="flex flex-col gap-5">
      <LiveRefresh active={waiting} />
      <div>
        <Link href={`/sites/${site.id}/permits`} className="inline-flex min-h-touch items-center text-brand underline-offset-4 hover:underline">
          ← Permits
        </Link>
        <div className="flex flex-wrap items-center gap-3">
          <h1 className="text-2xl font-bold">{title}</h1>
          <PermitStatus status={p.status} />
        </div>
        <p className="text-ink-soft">
          {PERMIT_KIND_LABELS[p.kind]} · {d.scope.length} member{d.scope.length === 1 ? "" : "s"} · {site.name}
        </p>
      </div>

      <dl className="grid grid-cols-1 gap-x-4 gap-y-2 rounded-xl border-2 border-ink/15 bg-paper-raised p-4 md:grid-cols-[10rem_1fr]">
        {facts.map(([k, val]) => (
          <div key={k} className="contents">
            <dt className="font-bold">{k}</dt>
            <dd className="mb-2 md:mb-0">{val}</dd>
          </div>
        ))}
      </dl>

      {evidenceFinding ? (
        <section aria-labelledby="evidence-h" className="flex flex-col gap-2">
          <h2 id="evidence-h" className="text-xl font-bold">
            Striking evidence
          </h2>
          <div className="rounded-xl border-2 border-ink/15 bg-paper-raised p-3">
            <FindingLine f={evidenceFinding} />
          </div>
          {p.evidenceHistory.length ? (
            <div className="rounded-xl border-2 border-ink/15 bg-paper-sunk p-3" data-testid="evidence-history">
              <h3 className="font-bold">Earlier evidence (replaced)</h3>
              <ol className="mt-1 flex flex-col gap-1 text-sm">
                {p.evidenceHistory.map((h, i) => (
                  <li key={i}>
                    {describeEvidence(h.evidence).text} — replaced {when(new Date(h.replacedAt))} by {h.replacedByName}
                  </li>
                ))}
              </ol>
            </div>
          ) : null}
          {d.may.amendEvidence ? (
            <AmendEvidence
              permitId={p.id}
              requiredMpa={typeof p.evidence?.requiredStrengthMpa === "number" ? p.evidence.requiredStrengthMpa : null}
              ageDays={typeof p.evidence?.concreteAgeDays === "number" ? p.evidence.concreteAgeDays : null}
            />
          ) : null}
        </section>
      ) : null}

      {p.issuedAt ? (
        <section aria-labelledby="pdf-h" className="flex flex-col gap-2">
          <h2 id="pdf-h" className="text-xl font-bold">
            The permit document
          </h2>
          {d.pdfUrl ? (
            <div className="flex flex-wrap gap-2">
              <a href={d.pdfUrl} className={buttonClass("primary")} target="_blank" rel="noreferrer">
                <Icon name="permit" /> Open PDF ({d.units === "us" ? "US Letter" : "A4"})
              </a>
              <a href={`${d.pdfUrl}?size=${d.units === "us" ? "a4" : "letter"}`} className={buttonClass("secondary")} target="_blank" rel="noreferrer">
                {d.units === "us" ? "A4" : "US Letter"} version
              </a>
            </div>
          ) : (
            <p role="status" className="flex items-center gap-2 text-warn">
              <Icon name="warn" className="h-5 w-5" /> The PDF is being prepared; e-mails go out as soon as it is ready.
            </p>
          )}
        </section>
      ) : null}

      {p.status === "requested" ? <Review d={d} siteId={site.id} /> : <ScopeTable d={d} siteId={site.id} />}

      {d.may.refuse ? (
        <section aria-labelledby="decide-h" className="flex flex-col gap-3 rounded-xl border-2 border-brand bg-paper-raised p-4">
          <h2 id="decide-h" className="text-xl font-bold">
            Decide
          </h2>
          {d.authority.ok && d.authority.as === "delegated supervisor" ? (
            <p className="text-sm text-ink-soft">You are deciding under the issuing scope the coordinator gave you; the coordinator is e-mailed when you issue.</p>
          ) : null}
          {d.may.issue ? (
            <IssuePanel permitId={p.id} defaultHours={site.permitValidityHours} maxDays={MAX_VALIDITY_DAYS} canIssue={d.evaluation.canIssue} blockers={d.evaluation.reasons.length} />
          ) : d.issueBlockedBy ? (
            <p role="status" className="flex items-start gap-2 rounded-lg border-2 border-warn bg-paper-sunk p-3 font-semibold" data-testid="issue-blocked">
              <Icon name="warn" className="mt-0.5 h-5 w-5 shrink-0 text-warn" /> {d.issueBlockedBy}
            </p>
          ) : null}
          <ReasonAction permitId={p.id} action="refuse" label="Refuse the request" hint="e-mailed to the requester" />
        </section>
      ) : p.status === "requested" ? (
        <p className="flex items-center gap-2 rounded-lg bg-paper-sunk p-3">
          <Icon name="permit" className="h-5 w-5" /> Waiting for the coordinator&apos;s review.
        </p>
      ) : null}

      {d.may.confirmStruck || d.may.withdraw || d.may.close ? (
        <section aria-labelledby="actions-h" className="flex flex-col gap-3 rounded-xl border-2 border-ink/15 bg-paper-raised p-4">
          <h2 id="actions-h" className="text-xl font-bold">
            Actions
          </h2>
          <div className="flex flex-wrap items-start gap-3">
            {d.may.confirmStruck && d.scope.filter((m) => m.status !== "struck").length > 1 ? (
              <StrikeMembers permitId={p.id} members={d.scope.filter((m) => m.status !== "struck").map((m) => ({ id: m.id, tag: m.tag, zone: m.zoneName }))} />
            ) : null}
            {d.may.confirmStruck ? (
              <PostAction permitId={p.id} action="confirm-struck" variant="primary" label="Confirm striking is done" confirm="All members still standing in this permit have been removed safely? They will be recorded as struck." />
            ) : null}
            {d.may.close ? <PostAction permitId={p.id} action="close" label="Close the permit" confirm="The work under this permit is complete? Closing keeps its record; members keep their state." /> : null}
            {d.may.withdraw ? <ReasonAction permitId={p.id} action="withdraw" label="Withdraw the permit" hint="e-mailed to everyone who received it" /> : null}
          </div>
        </section>
      ) : null}

      <Delivery d={d} />
      <CautionNotice />
    </div>
  );
}
