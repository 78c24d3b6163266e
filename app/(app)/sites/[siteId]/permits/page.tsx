import type { Metadata } from "next";
import Link from "next/link";
import { CautionNotice } from "@/components/caution-notice";
import { Icon } from "@/components/icons";
import { ButtonLink, buttonClass } from "@/components/ui/button";
import { countPermitsAwaitingReview, listPermits } from "@/db/queries/permits";
import { loadSitePage } from "@/lib/auth/site-page";
import { PERMIT_STATUS_LABELS } from "@/lib/labels";
import { formatDateTime } from "@/lib/format-date";
import type { UnitSystem } from "@/lib/permits/format";
import { PERMIT_KIND_LABELS, permitListQuerySchema, permitNumberLabel, type PermitListQuery } from "@/lib/validations/permit";
import { PermitStatus } from "./permit-status";
import { requestReference } from "@/lib/permits/words";

export const metadata: Metadata = { title: "Permits" };

const COLUMNS: { key: PermitListQuery["sort"]; label: string; numeric?: boolean }[] = [
  { key: "number", label: "Permit" },
  { key: "kind", label: "Kind" },
  { key: "status", label: "Status" },
  { key: "scope", label: "Members", numeric: true },
  { key: "requested", label: "Requested" },
  { key: "validUntil", label: "Valid until" },
];

export default async function PermitsPage({ params, searchParams }: { params: Promise<{ siteId: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { siteId } = await params;
  const { site, may } = await loadSitePage(siteId);
  const raw = Object.fromEntries(Object.entries(await searchParams).filter(([, v]) => typeof v === "string" && v !== "")) as Record<string, string>;
  const parsed = permitListQuerySchema.safeParse(raw);
  const q: PermitListQuery = parsed.success ? parsed.data : permitListQuerySchema.parse({});
  const [rows, awaiting] = await Promise.all([listPermits({ siteId: site.id, ...q }), countPermitsAwaitingReview({ siteId: site.id })]);
  const units = site.unitSystem as UnitSystem;
  const base = `/sites/${site.id}/permits`;
  const href = (over: Partial<Record<string, string | undefined>>) => {
    const sp = new URLSearchParams();
    const merged = { status: q.status, kind: q.kind, sort: q.sort, dir: q.dir, ...over };
    for (const [k, v] of Object.entries(merged)) if (v) sp.set(k, v);
    return `${base}?${sp}`;
  };
  const canDecide = may("issuePermit");

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold">Permits</h1>
          <p className="text-ink-soft">Permits to load and to strike on {site.name}.</p>
        </div>
        <div className="flex flex-wrap gap-2">
          {may("delegatePermits") ? (
            <ButtonLink href={`${base}/delegations`} variant="secondary">
              Supervisors&apos; issuing scope
            </ButtonLink>
          ) : null}
          {may("requestPermit") ? (
            <ButtonLink href={`${base}/new`}>
              <Icon name="add" /> Request a permit
            </ButtonLink>
          ) : null}
        </div>
      </div>

      {canDecide && awaiting > 0 ? (
        <Link href={href({ status: "requested", sort: "requested", dir: "asc" })} className="flex min-h-touch items-center gap-2 rounded-lg border-2 border-brand bg-brand-soft p-3 font-semibold text-brand-strong">
          <Icon name="permit" /> {awaiting} request{awaiting === 1 ? "" : "s"} waiting for your review — oldest first
        </Link>
      ) : null}

      <form method="get" action={base} className="flex flex-wrap items-end gap-3 rounded-xl border-2 border-ink/15 bg-paper-raised p-3" aria-label="Filter permits">
        <label className="flex flex-col gap-1 text-sm font-semibold">
          Status
          <select name="status" defaultValue={q.status ?? ""} className="min-h-touch rounded-lg border-2 border-ink/40 bg-paper-raised px-3">
            <option value="">Any status</option>
            {Object.entries(PERMIT_STATUS_LABELS).map(([k, v]) => (
              <option key={k} value={k}>
                {v}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1 text-sm font-semibold">
          Kind
          <select name="kind" defaultValue={q.kind ?? ""} className="min-h-touch rounded-lg border-2 border-ink/40 bg-paper-raised px-3">
            <option value="">Load and strike</option>
            <option value="load">{PERMIT_KIND_LABELS.load}</option>
            <option value="strike">{PERMIT_KIND_LABELS.strike}</option>
          </select>
        </label>
        <input type="hidden" name="sort" value={q.sort} />
        <input type="hidden" name="dir" value={q.dir} />
        <button type="submit" className={buttonClass("secondary")}>
          Show
        </button>
        {q.status || q.kind ? (
          <Link href={base} className={buttonClass("ghost")}>
            Clear filters
          </Link>
        ) : null}
      </form>

      {rows.length === 0 ? (
        <p className="rounded-xl border-2 border-dashed border-ink/30 p-6 text-center text-ink-soft">
          No permits {q.status || q.kind ? "match these filters" : "yet"}.
        </p>
      ) : (
        <>
          {/* Phone: one card per permit. */}
          <ul className="flex flex-col gap-2 md:hidden" aria-label="Permits">
            {rows.map((r) => (
              <li key={r.id}>
                <Link href={`${base}/${r.id}`} className="flex flex-col gap-1 rounded-xl border-2 border-ink/15 bg-paper-raised p-3">
                  <span className="flex items-center justify-between gap-2">
                    <span className="font-bold">{permitNumberLabel(r.kind, r.number) ?? requestReference(r, site.timezone)}</span>
                    <PermitStatus status={r.status} />
                  </span>
                  <span className="text-sm">
                    {PERMIT_KIND_LABELS[r.kind]} · <span className="tabular">{r.scopeSize}</span> member{r.scopeSize === 1 ? "" : "s"}
                    {r.zoneName ? ` · ${r.zoneName}` : ""}
                  </span>
                  <span className="text-sm text-ink-soft">
                    {r.validUntil ? `Valid until ${formatDateTime(r.validUntil, site.timezone)}` : `Requested ${formatDateTime(r.requestedAt, site.timezone)} by ${r.requestedByName}`}
                  </span>
                </Link>
              </li>
            ))}
          </ul>
          {/* Desktop: a dense, sortable table. */}
          <div className="hidden overflow-x-auto rounded-xl border-2 border-ink/15 bg-paper-raised md:block">
            <table className="w-full text-left">
              <thead className="bg-paper-sunk">
                <tr>
                  {COLUMNS.map((c) => {
                    const active = q.sort === c.key;
                    const nextDir = active && q.dir === "desc" ? "asc" : "desc";
                    return (
                      <th key={c.key} scope="col" className={`p-2 ${c.numeric ? "text-right" : ""}`} aria-sort={active ? (q.dir === "asc" ? "ascending" : "descending") : "none"}>
                        <Link href={href({ sort: c.key, dir: nextDir })} className="inline-flex min-h-touch items-center gap-1 font-bold underline-offset-4 hover:underline">
                          {c.label}
                          <span aria-hidden>{active ? (q.dir === "asc" ? "▲" : "▼") : "↕"}</span>
                        </Link>
                      </th>
                    );
                  })}
                  <th scope="col" className="p-2">
                    Zone / scheme
                  </th>
                </tr>
              </thead>
              <tbody>
                {rows.map((r) => (
                  <tr key={r.id} className="border-t border-ink/10 hover:bg-paper-sunk">
                    <td className="p-2 font-bold">
                      <Link href={`${base}/${r.id}`} className="underline-offset-4 hover:underline">
                        {permitNumberLabel(r.kind, r.number) ?? requestReference(r, site.timezone)}
                      </Link>
                    </td>
                    <td className="p-2">{PERMIT_KIND_LABELS[r.kind]}</td>
                    <td className="p-2">
                      <PermitStatus status={r.status} />
                    </td>
                    <td className="tabular p-2 text-right">{r.scopeSize}</td>
                    <td className="tabular p-2">
                      {formatDateTime(r.requestedAt, site.timezone)}
                      <div className="text-sm text-ink-soft">{r.requestedByName}</div>
                    </td>
                    <td className="tabular p-2">{formatDateTime(r.validUntil, site.timezone)}</td>
                    <td className="p-2 text-sm">
                      {r.zoneName ?? "Several zones"}
                      <div className="text-ink-soft">{r.schemeReference ?? "Several schemes"}</div>
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </>
      )}
      <CautionNotice compact />
    </div>
  );
}
