"use client";
// The site register: filters, sort, page and columns in the address; data from /api/v1 with
// TanStack Query; a dense sortable table on a desk and a card list on a phone, both from one
// TanStack Table model over the server's row type. The parts: register-filters (filters),
// register-table (desk table and its columns), register-cards (phone), register-selection
// (what to do with chosen members) and register-labels (QR label sheets).
import { keepPreviousData, QueryClient, QueryClientProvider, useQuery, useQueryClient } from "@tanstack/react-query";
import { getCoreRowModel, useReactTable, type RowSelectionState, type SortingState, type VisibilityState } from "@tanstack/react-table";
import Link from "next/link";
import { useState } from "react";
import { Icon } from "@/components/icons";
import { PrintButton } from "@/components/print-button";
import { buttonClass } from "@/components/ui/button";
import type { MemberListPage } from "@/db/queries/member-list";
import { apiJson, type ApiError } from "@/lib/client/api";
import type { UnitSystem } from "@/lib/client/format";
import { MEMBER_SORTS, type MemberSort } from "@/lib/validations/member-list";
import { PhoneSort, RegisterCards } from "./register-cards";
import { ColumnChooser } from "./register-column-chooser";
import { columnsParam, OPTIONAL_COLUMNS, parseColumns } from "./register-columns";
import { RegisterFilters, type FilterOptions } from "./register-filters";
import { RegisterSelection } from "./register-selection";
import { RegisterTable, useRegisterColumns } from "./register-table";
import { filterQueryString, useRegisterUrl } from "./use-register-url";

async function fetchPage(siteId: string, qs: string): Promise<MemberListPage> {
  const r = await apiJson<MemberListPage>(`/api/v1/sites/${siteId}/members${qs ? `?${qs}` : ""}`);
  if (!r.ok) throw r.error;
  return r.data;
}

type Props = {
  siteId: string;
  siteName: string;
  unitSystem: UnitSystem;
  timeZone: string;
  options: FilterOptions;
  canImport: boolean;
  canLog: boolean;
  canRequestPermit: boolean;
  canInspect: boolean;
};

export function RegisterView(props: Props) {
  const [client] = useState(() => new QueryClient({ defaultOptions: { queries: { staleTime: 10_000, retry: 1, refetchOnWindowFocus: false } } }));
  return (
    <QueryClientProvider client={client}>
      <Register {...props} />
    </QueryClientProvider>
  );
}

const isFiltered = (query: Record<string, string>) => Object.keys(query).some((k) => !["sort", "dir", "limit", "cursor"].includes(k));

function Register({ siteId, siteName, unitSystem, timeZone, options, canImport, canLog, canRequestPermit, canInspect }: Props) {
  const { query, cols, update, clear } = useRegisterUrl();
  const qs = new URLSearchParams(query).toString();
  const queryClient = useQueryClient();
  // The API counts the matches on the first page only; the count is kept per filter set (sort
  // does not change it) so paging on shows it without counting again.
  const countQs = filterQueryString(query, { withSort: false });
  const totalKey = (filters: string) => ["members-total", siteId, filters];
  const { data, error, isFetching, isPending, isPlaceholderData } = useQuery<MemberListPage, ApiError>({
    queryKey: ["members", siteId, qs],
    queryFn: async () => {
      const page = await fetchPage(siteId, qs);
      if (page.total !== undefined) queryClient.setQueryData(totalKey(countQs), page.total);
      return page;
    },
    placeholderData: keepPreviousData,
  });
  // Opened straight on a later page (a kept address, Back): ask once for the count.
  const counted = useQuery<number, ApiError>({
    queryKey: totalKey(countQs),
    queryFn: async () => (await fetchPage(siteId, [countQs, "limit=1"].filter(Boolean).join("&"))).total ?? 0,
    enabled: !!data && !isPlaceholderData && data.total === undefined,
    staleTime: 60_000,
  });
  const [selection, setSelection] = useState<RowSelectionState>({});

  const sort = (MEMBER_SORTS as readonly string[]).includes(query.sort ?? "") ? (query.sort as MemberSort) : "tag";
  const dir = query.dir === "desc" ? "desc" : "asc";
  const sorting: SortingState = [{ id: sort, desc: dir === "desc" }];
  const setSort = (s: string, d: "asc" | "desc") => update({ sort: s === "tag" ? undefined : s, dir: d === "desc" ? "desc" : undefined });

  const shownColumns = parseColumns(cols);
  const columnVisibility: VisibilityState = Object.fromEntries(OPTIONAL_COLUMNS.map((c) => [c.id, shownColumns.includes(c.id)]));
  const columns = useRegisterColumns({ siteId, unitSystem, timeZone });

  const table = useReactTable({
    data: data?.items ?? [],
    columns,
    getRowId: (r) => r.id,
    getCoreRowModel: getCoreRowModel(),
    manualSorting: true,
    manualPagination: true,
    enableSortingRemoval: false,
    // A header's first click sorts ascending, the next descending (the phone menu offers both).
    sortDescFirst: false,
    state: { sorting, rowSelection: selection, columnVisibility },
    onRowSelectionChange: setSelection,
    onSortingChange: (updater) => {
      const s = (typeof updater === "function" ? updater(sorting) : updater)[0];
      if (s) setSort(s.id, s.desc ? "desc" : "asc");
    },
  });

  const selectedIds = Object.keys(selection).filter((k) => selection[k]);
  const filterQs = filterQueryString(query);
  const total = data?.total ?? (isPlaceholderData ? undefined : counted.data);
  const fieldErrors = error?.status === 422 ? error.fields : {};

  const pageLinks = (
    <nav aria-label="Pages" className="flex items-center justify-between gap-2 print:hidden">
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
                {isFiltered(query) ? "members match" : "members"}
              </>
            ) : null}
          </p>
        </div>
        <div className="flex flex-wrap gap-2 print:hidden">
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
          <PrintButton label="Print this page" />
        </div>
      </div>

      <div className="print:hidden">
        <RegisterFilters query={query} update={update} clear={clear} options={options} errors={fieldErrors} />
      </div>

      <div className="flex flex-wrap items-start gap-2 md:flex-nowrap">
        <div className="min-w-0 flex-1">
          <RegisterSelection
            siteId={siteId}
            selectedIds={selectedIds}
            onClear={() => setSelection({})}
            filterQs={filterQs}
            total={total}
            canRequestPermit={canRequestPermit}
            canInspect={canInspect}
          />
        </div>
        <ColumnChooser shown={shownColumns} onChange={(next) => update({ cols: columnsParam(next) })} />
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

      <PhoneSort sort={sort} dir={dir} onSort={setSort} />

      <div aria-busy={isFetching} aria-live="polite" className={isFetching && !isPending ? "opacity-70 transition-opacity" : ""}>
        {isPending ? <p className="p-4 text-ink-soft">Loading members…</p> : null}
        {data && data.items.length === 0 ? (
          <p className="rounded-lg border-2 border-dashed border-ink/20 p-6 text-center text-ink-soft">
            {isFiltered(query) ? "No member matches these filters." : "No members on this site's register yet."}
          </p>
        ) : null}
        <RegisterCards table={table} siteId={siteId} unitSystem={unitSystem} />
        <RegisterTable table={table} caption={`Members of ${siteName}, sorted by ${sort} ${dir === "asc" ? "ascending" : "descending"}`} />
      </div>

      {data && data.items.length > 0 ? pageLinks : null}
    </div>
  );
}
