"use client";
// The register on a phone: sort as a menu (the same keyset sorts as the desk's headers) and members as cards.
import type { Table } from "@tanstack/react-table";
import Link from "next/link";
import type { MemberListItem } from "@/db/queries/member-list";
import { formatForceFor, formatLengthFor, formatUtilisation, type UnitSystem } from "@/lib/client/format";
import type { MemberSort, SortDir } from "@/lib/validations/member-list";
import { CheckBadge, StatusBadge } from "./member-badges";
import { UtilBar, utilClass } from "./register-cells";

const SORT_CHOICES: { value: string; label: string }[] = [
  { value: "tag:asc", label: "Tag, A to Z" },
  { value: "tag:desc", label: "Tag, Z to A" },
  { value: "utilisation:desc", label: "Utilisation, highest first" },
  { value: "utilisation:asc", label: "Utilisation, lowest first" },
  { value: "status:asc", label: "Status" },
  { value: "extension:desc", label: "Extension, longest first" },
  { value: "extension:asc", label: "Extension, shortest first" },
  { value: "updated:desc", label: "Recently changed first" },
  { value: "updated:asc", label: "Least recently changed first" },
];

export function PhoneSort({ sort, dir, onSort }: { sort: MemberSort; dir: SortDir; onSort: (sort: string, dir: SortDir) => void }) {
  return (
    <label className="flex flex-col gap-1 md:hidden print:hidden">
      <span className="text-sm font-semibold">Sort</span>
      <select
        className="min-h-touch rounded-lg border-2 border-ink/40 bg-paper-raised px-3"
        value={`${sort}:${dir}`}
        onChange={(e) => {
          const [s, d] = e.target.value.split(":");
          onSort(s!, d === "desc" ? "desc" : "asc");
        }}
      >
        {SORT_CHOICES.map((c) => (
          <option key={c.value} value={c.value}>
            {c.label}
          </option>
        ))}
        {SORT_CHOICES.some((c) => c.value === `${sort}:${dir}`) ? null : <option value={`${sort}:${dir}`}>{`${sort}, ${dir}`}</option>}
      </select>
    </label>
  );
}

export function RegisterCards({ table, siteId, unitSystem }: { table: Table<MemberListItem>; siteId: string; unitSystem: UnitSystem }) {
  return (
    <ul className="flex flex-col gap-2 md:hidden print:hidden" aria-label="Members">
      {table.getRowModel().rows.map((row) => {
        const m = row.original;
        const failing = m.pass === false;
        return (
          <li key={row.id} className={`relative rounded-xl border-2 bg-paper-raised p-3 ${failing ? "border-bad bg-bad-soft/60" : "border-ink/15"}`} data-testid="member-card">
            <div className="flex items-start justify-between gap-2">
              <Link href={`/sites/${siteId}/members/${m.id}`} className="text-lg font-bold text-brand underline-offset-2 after:absolute after:inset-0 hover:underline">
                {m.tag}
              </Link>
              <label className="relative z-10 -m-2 flex min-h-touch min-w-touch items-center justify-center">
                <input type="checkbox" className="h-5 w-5" aria-label={`Choose ${m.tag}`} checked={row.getIsSelected()} onChange={row.getToggleSelectedHandler()} />
              </label>
            </div>
            <div className="mt-1 flex flex-wrap items-center gap-x-3 gap-y-1">
              <StatusBadge status={m.status} />
              <CheckBadge pass={m.pass} hasCapacity={m.capacityN !== null} />
              <span className={`tabular ${utilClass(m)}`}>
                <span className="sr-only">Utilisation </span>
                {formatUtilisation(m.utilisation)}
                <UtilBar u={m.utilisation} />
              </span>
            </div>
            <dl className="tabular mt-2 grid grid-cols-2 gap-x-3 text-sm">
              <div>
                <dt className="inline text-ink-soft">Load </dt>
                <dd className="inline">{formatForceFor(m.loadN, unitSystem)}</dd>
              </div>
              <div>
                <dt className="inline text-ink-soft">Capacity </dt>
                <dd className="inline">{formatForceFor(m.capacityN, unitSystem)}</dd>
              </div>
              <div>
                <dt className="inline text-ink-soft">Extension </dt>
                <dd className="inline">{formatLengthFor(m.extensionMm, unitSystem)}</dd>
              </div>
              <div className="truncate">
                <dt className="inline text-ink-soft">Zone </dt>
                <dd className="inline">{m.zone?.name ?? "—"}</dd>
              </div>
              <div className="col-span-2 truncate">
                <dt className="inline text-ink-soft">Type </dt>
                <dd className="inline">{m.type.name}</dd>
              </div>
            </dl>
          </li>
        );
      })}
    </ul>
  );
}
