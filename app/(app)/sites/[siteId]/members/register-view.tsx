"use client";
// The site register: filters, sort and page in the address; data from /api/v1 with TanStack Query;
// a dense sortable table on a desk, a card list on a phone, both from one TanStack Table model.
import { keepPreviousData, QueryClient, QueryClientProvider, useQuery } from "@tanstack/react-query";
import {
  flexRender, getCoreRowModel, useReactTable, type ColumnDef, type RowSelectionState, type SortingState,
} from "@tanstack/react-table";
import Link from "next/link";
import { useMemo, useState } from "react";
import { Icon } from "@/components/icons";
import { buttonClass } from "@/components/ui/button";
import { MEMBER_SORTS, type MemberSort } from "@/lib/validations/member-list";
import { CheckBadge, StatusBadge } from "./member-badges";
import { RegisterFilters, type FilterOptions } from "./register-filters";
import { formatExtension, formatForceShort, formatUpdated, formatUtilisation, type UnitSystem } from "./register-format";
import { filterQueryString, useRegisterUrl } from "./use-register-url";

export type RegisterItem = {
  id: string;
  tag: string;
  status: "draft" | "submitted" | "loaded" | "struck" | "out_of_service";
  zone: { id: string; name: string } | null;
  scheme: { id: string; reference: string } | null;
  type: { id: string; name: string; kind: string };
  extensionMm: number;
  endConditions: string;
  loadN: number;
  capacityN: number | null;
  utilisation: number | null;
  pass: boolean | null;
  photoCount: number;
  updatedAt: string;
};
type Page = { items: RegisterItem[]; nextCursor: string | null; prevCursor: string | null; total?: number };
type ApiError = { status: number; message: string; fields: Record<string, string> };

/** Labels for members chosen one by one are sent in one request; more than this is a filter's job. */
const MAX_LABELS = 500;

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

async function fetchPage(siteId: string, qs: string): Promise<Page> {
  const res = await fetch(`/api/v1/sites/${siteId}/members${qs ? `?${qs}` : ""}`, { headers: { accept: "application/json" } });
  if (!res.ok) {
    const body = (await res.json().catch(() => null)) as { error?: { message?: string; fields?: Record<string, string> } } | null;
    const err: ApiError = {
      status: res.status,
      message: body?.error?.message ?? `The register could not be loaded (HTTP ${res.status}).`,
      fields: body?.error?.fields ?? {},
    };
    throw err;
  }
  return res.json();
}

function utilClass(item: RegisterItem) {
  if (item.pass === false) return "text-bad font-bold";
  if (item.utilisation !== null && item.utilisation > 0.9) return "text-warn font-semibold";
  return "";
}

function UtilBar({ u }: { u: number | null }) {
  if (u === null) return null;
  const pct = Math.min(100, Math.max(0, u * 100));
  const colour = u > 1 ? "bg-bad" : u > 0.9 ? "bg-warn" : "bg-ok";
  return (
    <span aria-hidden className="ml-2 inline-block h-1.5 w-12 overflow-hidden rounded bg-paper-sunk align-middle">
      <span className={`block h-full ${colour}`} style={{ width: `${pct}%` }} />
    </span>
  );
}

function SortIcon({ dir }: { dir: false | "asc" | "desc" }) {
  return (
    <span aria-hidden className={`text-xs ${dir ? "text-ink" : "text-ink-faint"}`}>
      {dir === "asc" ? "▲" : dir === "desc" ? "▼" : "↕"}
    </span>
  );
}

export function RegisterView(props: {
  siteId: string;
  siteName: string;
  unitSystem: UnitSystem;
  options: FilterOptions;
  canImport: boolean;
  canLog: boolean;
}) {
  const [client] = useState(() => new QueryClient({ defaultOptions: { queries: { staleTime: 10_000, retry: 1, refetchOnWindowFocus: false } } }));
  return (
    <QueryClientProvider client={client}>
      <Register {...props} />
    </QueryClientProvider>
  );
}

function Register({ siteId, siteName, unitSystem, options, canImport, canLog }: Parameters<typeof RegisterView>[0]) {
  const { query, update, clear } = useRegisterUrl();
  const qs = new URLSearchParams(query).toString();
  const { data, error, isFetching, isPending } = useQuery<Page, ApiError>({
    queryKey: ["members", siteId, qs],
    queryFn: () => fetchPage(siteId, qs),
    placeholderData: keepPreviousData,
  });
  const [selection, setSelection] = useState<RowSelectionState>({});
  const [labelError, setLabelError] = useState<string>();
  const [labelBusy, setLabelBusy] = useState(false);

  const sort = (MEMBER_SORTS as readonly string[]).includes(query.sort ?? "") ? (query.sort as MemberSort) : "tag";
  const dir = query.dir === "desc" ? "desc" : "asc";
  const sorting: SortingState = [{ id: sort, desc: dir === "desc" }];
  const memberHref = (id: string) => `/sites/${siteId}/members/${id}`;

  const columns = useMemo<ColumnDef<RegisterItem>[]>(
    () => [
      {
        id: "select",
        enableSorting: false,
        header: ({ table }) => (
          <input
            type="checkbox"
            className="h-5 w-5"
            aria-label="Choose every member on this page for labels"
            checked={table.getIsAllPageRowsSelected()}
            ref={(el) => {
              if (el) el.indeterminate = table.getIsSomePageRowsSelected();
            }}
            onChange={table.getToggleAllPageRowsSelectedHandler()}
          />
        ),
        cell: ({ row }) => (
          <input
            type="checkbox"
            className="h-5 w-5"
            aria-label={`Choose ${row.original.tag} for labels`}
            checked={row.getIsSelected()}
            onChange={row.getToggleSelectedHandler()}
          />
        ),
      },
      {
        id: "tag",
        header: "Tag",
        cell: ({ row }) => (
          <Link href={memberHref(row.original.id)} className="whitespace-nowrap font-semibold text-brand underline-offset-2 hover:underline">
            {row.original.tag}
          </Link>
        ),
      },
      { id: "status", header: "Status", cell: ({ row }) => <StatusBadge status={row.original.status} /> },
      {
        id: "check",
        header: "Check",
        enableSorting: false,
        cell: ({ row }) => <CheckBadge pass={row.original.pass} hasCapacity={row.original.capacityN !== null} />,
      },
      {
        id: "utilisation",
        header: "Utilisation",
        meta: { numeric: true },
        cell: ({ row }) => (
          <span className={`whitespace-nowrap ${utilClass(row.original)}`}>
            {formatUtilisation(row.original.utilisation)}
            <UtilBar u={row.original.utilisation} />
          </span>
        ),
      },
      { id: "load", header: "Load", enableSorting: false, meta: { numeric: true }, cell: ({ row }) => formatForceShort(row.original.loadN, unitSystem) },
      {
        id: "capacity",
        header: "Capacity",
        enableSorting: false,
        meta: { numeric: true },
        cell: ({ row }) => formatForceShort(row.original.capacityN, unitSystem),
      },
      { id: "extension", header: "Extension", meta: { numeric: true }, cell: ({ row }) => formatExtension(row.original.extensionMm, unitSystem) },
      {
        id: "type",
        header: "Type",
        enableSorting: false,
        cell: ({ row }) => (
          <span className="block max-w-40 truncate" title={row.original.type.name}>
            {row.original.type.name}
          </span>
        ),
      },
      {
        id: "zone",
        header: "Zone",
        enableSorting: false,
        cell: ({ row }) => (
          <span className="block max-w-32 truncate" title={row.original.zone?.name}>
            {row.original.zone?.name ?? "—"}
          </span>
        ),
      },
      { id: "scheme", header: "Scheme", enableSorting: false, cell: ({ row }) => row.original.scheme?.reference ?? "—" },
      {
        id: "photos",
        header: "Photos",
        enableSorting: false,
        meta: { numeric: true, className: "hidden 2xl:table-cell" },
        cell: ({ row }) => row.original.photoCount,
      },
      { id: "updated", header: "Updated", cell: ({ row }) => <span className="whitespace-nowrap">{formatUpdated(row.original.updatedAt)}</span> },
    ],
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [siteId, unitSystem],
  );

  const table = useReactTable({
    data: data?.items ?? [],
    columns,
    getRowId: (r) => r.id,
    getCoreRowModel: getCoreRowModel(),
    manualSorting: true,
    manualPagination: true,
    enableSortingRemoval: false,
    state: { sorting, rowSelection: selection },
    onRowSelectionChange: setSelection,
    onSortingChange: (updater) => {
      const next = typeof updater === "function" ? updater(sorting) : updater;
      const s = next[0];
      if (!s) return;
      update({ sort: s.id === "tag" ? undefined : s.id, dir: s.desc ? "desc" : undefined });
    },
  });

  const selectedIds = Object.keys(selection).filter((k) => selection[k]);
  const filterQs = filterQueryString(query);
  const total = data?.total;
  const fieldErrors = error?.status === 422 ? error.fields : {};

  async function downloadSelectedLabels() {
    setLabelError(undefined);
    setLabelBusy(true);
    try {
      const res = await fetch(`/api/v1/sites/${siteId}/labels`, {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ memberIds: selectedIds }),
      });
      if (!res.ok) {
        const body = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
        setLabelError(body?.error?.message ?? `The label sheet could not be made (HTTP ${res.status}).`);
        return;
      }
      const blob = await res.blob();
      const url = URL.createObjectURL(blob);
      const a = document.createElement("a");
      a.href = url;
      a.download = `labels-${selectedIds.length}.pdf`;
      document.body.appendChild(a);
      a.click();
      a.remove();
      setTimeout(() => URL.revokeObjectURL(url), 60_000);
    } catch {
      setLabelError("The label sheet could not be downloaded; check the connection and try again.");
    } finally {
      setLabelBusy(false);
    }
  }

  const pageLinks = (
    <nav aria-label="Pages" className="flex items-center justify-between gap-2">
      <button
        type="button"
        className={buttonClass("secondary")}
        disabled={!data?.prevCursor}
        onClick={() => data?.prevCursor && update({ cursor: data.prevCursor }, { page: true })}
      >
        ← Previous
      </button>
      <label className="flex items-center gap-2 text-sm">
        <span className="hidden sm:inline">Rows per page</span>
        <span className="sr-only sm:hidden">Rows per page</span>
        <select
          className="min-h-touch rounded-lg border-2 border-ink/40 bg-paper-raised px-2"
          value={query.limit ?? "50"}
          onChange={(e) => update({ limit: e.target.value === "50" ? undefined : e.target.value })}
        >
          {["25", "50", "100", "200"].map((n) => (
            <option key={n}>{n}</option>
          ))}
        </select>
      </label>
      <button
        type="button"
        className={buttonClass("secondary")}
        disabled={!data?.nextCursor}
        onClick={() => data?.nextCursor && update({ cursor: data.nextCursor }, { page: true })}
      >
        Next →
      </button>
    </nav>
  );

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end justify-between gap-2">
        <div>
          <h1 className="text-2xl font-bold">Register</h1>
          <p className="text-ink-soft">
            {siteName}
            {total !== undefined ? (
              <>
                {" · "}
                <span className="tabular" data-testid="register-total">
                  {total.toLocaleString("en-GB")}
                </span>{" "}
                {Object.keys(query).some((k) => !["sort", "dir", "limit", "cursor"].includes(k)) ? "members match" : "members"}
              </>
            ) : null}
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          {canLog ? (
            // On a phone the bottom bar already offers it.
            <div className="hidden md:block">
              <Link className={buttonClass("primary")} href={`/sites/${siteId}/members/new`}>
                <Icon name="add" className="h-5 w-5" /> Log a member
              </Link>
            </div>
          ) : null}
          <a className={buttonClass("secondary", "text-sm md:text-base")} href={`/api/v1/sites/${siteId}/members/export.csv${filterQs ? `?${filterQs}` : ""}`} download>
            Export CSV
          </a>
          {canImport ? (
            <Link className={buttonClass("secondary", "text-sm md:text-base")} href={`/sites/${siteId}/members/import`}>
              Import CSV
            </Link>
          ) : null}
        </div>
      </div>

      <RegisterFilters query={query} update={update} clear={clear} options={options} errors={fieldErrors} />

      <div className="order-last flex flex-wrap items-center gap-2 rounded-lg bg-paper-sunk p-2 md:order-none" role="group" aria-label="QR labels">
        <span className="text-sm font-semibold">QR labels:</span>
        {selectedIds.length > 0 ? (
          <>
            <button type="button" className={buttonClass("primary", "text-sm")} onClick={downloadSelectedLabels} disabled={labelBusy || selectedIds.length > MAX_LABELS}>
              {labelBusy ? "Making labels…" : `Labels for ${selectedIds.length} chosen`}
            </button>
            <button type="button" className={buttonClass("ghost", "text-sm")} onClick={() => setSelection({})}>
              Clear choice
            </button>
            {selectedIds.length > MAX_LABELS ? <span className="text-sm text-bad">At most {MAX_LABELS} labels per sheet.</span> : null}
          </>
        ) : (
          <>
            <a
              className={buttonClass("secondary", "text-sm")}
              href={`/api/v1/sites/${siteId}/labels${filterQs ? `?${filterQs}` : ""}`}
              aria-disabled={total !== undefined && (total === 0 || total > MAX_LABELS)}
              onClick={(e) => {
                if (total !== undefined && (total === 0 || total > MAX_LABELS)) e.preventDefault();
              }}
            >
              Labels for all {total !== undefined ? total.toLocaleString("en-GB") : ""} shown
            </a>
            <span className="text-sm text-ink-soft">
              {total !== undefined && total > MAX_LABELS ? `Narrow the filters to ${MAX_LABELS} or fewer, or choose members.` : "Or choose members with the check boxes."}
            </span>
          </>
        )}
        {labelError ? (
          <p role="alert" className="w-full font-semibold text-bad">
            {labelError}
          </p>
        ) : null}
      </div>

      {error ? (
        <div role="alert" className="flex items-start gap-3 rounded-lg border-2 border-bad bg-bad-soft p-3">
          <Icon name="bad" className="h-6 w-6 shrink-0 text-bad" />
          <div>
            <p className="font-bold">{error.message}</p>
            {Object.entries(error.fields).map(([k, v]) => (
              <p key={k}>{v}</p>
            ))}
            {error.status === 422 ? (
              <button type="button" className="mt-1 font-semibold text-brand underline" onClick={clear}>
                Clear filters and start again
              </button>
            ) : null}
          </div>
        </div>
      ) : null}

      {/* Phone: sort as a menu, members as cards. */}
      <label className="flex flex-col gap-1 md:hidden">
        <span className="text-sm font-semibold">Sort</span>
        <select
          className="min-h-touch rounded-lg border-2 border-ink/40 bg-paper-raised px-3"
          value={`${sort}:${dir}`}
          onChange={(e) => {
            const [s, d] = e.target.value.split(":");
            update({ sort: s === "tag" ? undefined : s, dir: d === "desc" ? "desc" : undefined });
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

      <div aria-busy={isFetching} aria-live="polite" className={isFetching && !isPending ? "opacity-70 transition-opacity" : ""}>
        {isPending ? <p className="p-4 text-ink-soft">Loading members…</p> : null}
        {data && data.items.length === 0 ? (
          <p className="rounded-lg border-2 border-dashed border-ink/20 p-6 text-center text-ink-soft">
            {Object.keys(query).some((k) => !["sort", "dir", "limit", "cursor"].includes(k))
              ? "No member matches these filters."
              : "No members on this site's register yet."}
          </p>
        ) : null}

        <ul className="flex flex-col gap-2 md:hidden" aria-label="Members">
          {table.getRowModel().rows.map((row) => {
            const m = row.original;
            const failing = m.pass === false;
            return (
              <li
                key={row.id}
                className={`relative rounded-xl border-2 bg-paper-raised p-3 ${failing ? "border-bad bg-bad-soft/60" : "border-ink/15"}`}
                data-testid="member-card"
              >
                <div className="flex items-start justify-between gap-2">
                  <Link href={memberHref(m.id)} className="text-lg font-bold text-brand underline-offset-2 after:absolute after:inset-0 hover:underline">
                    {m.tag}
                  </Link>
                  <label className="relative z-10 -m-2 flex min-h-touch min-w-touch items-center justify-center">
                    <input type="checkbox" className="h-5 w-5" aria-label={`Choose ${m.tag} for labels`} checked={row.getIsSelected()} onChange={row.getToggleSelectedHandler()} />
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
                    <dd className="inline">{formatForceShort(m.loadN, unitSystem)}</dd>
                  </div>
                  <div>
                    <dt className="inline text-ink-soft">Capacity </dt>
                    <dd className="inline">{formatForceShort(m.capacityN, unitSystem)}</dd>
                  </div>
                  <div>
                    <dt className="inline text-ink-soft">Extension </dt>
                    <dd className="inline">{formatExtension(m.extensionMm, unitSystem)}</dd>
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

        <div className="hidden overflow-x-auto rounded-xl border-2 border-ink/10 bg-paper-raised md:block">
          <table className="tabular w-full border-collapse text-sm">
            <caption className="sr-only">Members of {siteName}, sorted by {sort} {dir === "asc" ? "ascending" : "descending"}</caption>
            <thead className="bg-paper-sunk">
              {table.getHeaderGroups().map((hg) => (
                <tr key={hg.id}>
                  {hg.headers.map((h) => {
                    const meta = h.column.columnDef.meta as { numeric?: boolean; className?: string } | undefined;
                    const numeric = meta?.numeric;
                    const sorted = h.column.getIsSorted();
                    return (
                      <th
                        key={h.id}
                        scope="col"
                        aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined}
                        className={`whitespace-nowrap px-2 py-1 font-semibold ${numeric ? "text-right" : "text-left"} ${meta?.className ?? ""}`}
                      >
                        {h.column.getCanSort() ? (
                          <button
                            type="button"
                            className={`inline-flex min-h-9 items-center gap-1 hover:underline ${numeric ? "flex-row-reverse" : ""}`}
                            onClick={h.column.getToggleSortingHandler()}
                          >
                            {flexRender(h.column.columnDef.header, h.getContext())}
                            <SortIcon dir={sorted} />
                          </button>
                        ) : (
                          flexRender(h.column.columnDef.header, h.getContext())
                        )}
                      </th>
                    );
                  })}
                </tr>
              ))}
            </thead>
            <tbody>
              {table.getRowModel().rows.map((row) => {
                const failing = row.original.pass === false;
                return (
                  <tr
                    key={row.id}
                    data-testid="member-row"
                    className={`border-t border-ink/10 ${failing ? "bg-bad-soft/70 shadow-[inset_4px_0_0_var(--color-bad,#b3261e)]" : row.getIsSelected() ? "bg-brand-soft/50" : "hover:bg-paper-sunk/60"}`}
                  >
                    {row.getVisibleCells().map((cell) => {
                      const meta = cell.column.columnDef.meta as { numeric?: boolean; className?: string } | undefined;
                      return (
                        <td key={cell.id} className={`whitespace-nowrap px-2 py-1 align-middle ${meta?.numeric ? "text-right" : ""} ${meta?.className ?? ""}`}>
                          {flexRender(cell.column.columnDef.cell, cell.getContext())}
                        </td>
                      );
                    })}
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      </div>

      {data && data.items.length > 0 ? pageLinks : null}
    </div>
  );
}
