"use client";
// The register as a dense table on a desk: one TanStack Table model (shared with the phone cards),
// sorted by clicking a column header (the server's keyset sorts), columns chosen in the address.
import { flexRender, type ColumnDef, type Table } from "@tanstack/react-table";
import Link from "next/link";
import { useMemo } from "react";
import type { MemberListItem } from "@/db/queries/member-list";
import { formatForceFor, formatLengthFor, formatUtilisation, type UnitSystem } from "@/lib/client/format";
import { CheckBadge, StatusBadge } from "./member-badges";
import { SortIcon, UtilBar, utilClass } from "./register-cells";
import { formatDate, formatDateTime, formatTime } from "@/lib/format-date";

type ColumnMeta = { numeric?: boolean; className?: string };

export function useRegisterColumns({ siteId, unitSystem, timeZone }: { siteId: string; unitSystem: UnitSystem; timeZone: string }) {
  return useMemo<ColumnDef<MemberListItem>[]>(
    () => [
      {
        id: "select",
        enableSorting: false,
        enableHiding: false,
        meta: { className: "print:hidden" },
        header: ({ table }) => (
          <input
            type="checkbox"
            className="h-5 w-5"
            aria-label="Choose every member on this page"
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
            aria-label={`Choose ${row.original.tag}`}
            checked={row.getIsSelected()}
            onChange={row.getToggleSelectedHandler()}
          />
        ),
      },
      {
        id: "tag",
        // TanStack sorts (here: asks the server to sort) only columns with an accessor.
        accessorFn: (r) => r.tag,
        header: "Tag",
        enableHiding: false,
        cell: ({ row }) => (
          <Link href={`/sites/${siteId}/members/${row.original.id}`} className="inline-block max-w-40 font-semibold text-brand underline-offset-2 [overflow-wrap:anywhere] hover:underline print:max-w-none">
            {row.original.tag}
          </Link>
        ),
      },
      { id: "status", accessorFn: (r) => r.status, header: "Status", enableHiding: false, cell: ({ row }) => <StatusBadge status={row.original.status} /> },
      {
        id: "check",
        header: "Check",
        enableSorting: false,
        enableHiding: false,
        cell: ({ row }) => <CheckBadge pass={row.original.pass} hasCapacity={row.original.capacityN !== null} />,
      },
      {
        id: "utilisation",
        accessorFn: (r) => r.utilisation,
        header: "Utilisation",
        enableHiding: false,
        meta: { numeric: true },
        cell: ({ row }) => (
          <span className={`whitespace-nowrap ${utilClass(row.original)}`}>
            {formatUtilisation(row.original.utilisation)}
            <UtilBar u={row.original.utilisation} />
          </span>
        ),
      },
      { id: "load", header: "Load", enableSorting: false, meta: { numeric: true }, cell: ({ row }) => formatForceFor(row.original.loadN, unitSystem) },
      { id: "capacity", header: "Capacity", enableSorting: false, meta: { numeric: true }, cell: ({ row }) => formatForceFor(row.original.capacityN, unitSystem) },
      { id: "extension", accessorFn: (r) => r.extensionMm, header: "Extension", enableHiding: false, meta: { numeric: true }, cell: ({ row }) => formatLengthFor(row.original.extensionMm, unitSystem) },
      {
        id: "type",
        header: "Type",
        enableSorting: false,
        cell: ({ row }) => (
          <span className="block max-w-24 truncate 2xl:max-w-36 print:max-w-none print:whitespace-normal" title={row.original.type.name}>
            {row.original.type.name}
          </span>
        ),
      },
      {
        id: "zone",
        header: "Zone",
        enableSorting: false,
        cell: ({ row }) => (
          <span className="block max-w-20 truncate 2xl:max-w-32 print:max-w-none print:whitespace-normal" title={row.original.zone?.name}>
            {row.original.zone?.name ?? "—"}
          </span>
        ),
      },
      { id: "scheme", header: "Scheme", enableSorting: false, cell: ({ row }) => (
          // Cut like the zone: a long reference must not push the desk's table sideways.
          <span className="block max-w-24 truncate 2xl:max-w-36 print:max-w-none print:whitespace-normal" title={row.original.scheme?.reference}>
            {row.original.scheme?.reference ?? "—"}
          </span>
        ) },
      { id: "photos", header: "Photos", enableSorting: false, meta: { numeric: true }, cell: ({ row }) => row.original.photoCount },
      { id: "updated", accessorFn: (r) => r.updatedAt, header: "Updated", cell: ({ row }) => (
          // The day over the time (the site's), so the full date fits the desk's 1366 px beside the other columns.
          <time dateTime={String(row.original.updatedAt)} title={formatDateTime(row.original.updatedAt, timeZone)}>
            <span className="block whitespace-nowrap">{formatDate(row.original.updatedAt, timeZone)}</span>
            <span className="block whitespace-nowrap text-ink-soft">{formatTime(row.original.updatedAt, timeZone)}</span>
          </time>
        ) },
    ],
    [siteId, unitSystem, timeZone],
  );
}

export function RegisterTable({ table, caption }: { table: Table<MemberListItem>; caption: string }) {
  return (
    <div className="hidden overflow-x-auto rounded-xl border-2 border-ink/10 bg-paper-raised md:block print:block print:overflow-visible print:border-0" data-testid="register-table">
      <table className="tabular w-full border-collapse text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-paper-sunk">
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => {
                const meta = h.column.columnDef.meta as ColumnMeta | undefined;
                const sorted = h.column.getIsSorted();
                return (
                  <th
                    key={h.id}
                    scope="col"
                    aria-sort={h.column.getCanSort() ? (sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none") : undefined}
                    className={`whitespace-nowrap px-1.5 py-1 font-semibold ${meta?.numeric ? "text-right" : "text-left"} ${meta?.className ?? ""}`}
                  >
                    {h.column.getCanSort() ? (
                      <button
                        type="button"
                        className={`inline-flex min-h-9 items-center gap-1 hover:underline ${meta?.numeric ? "flex-row-reverse" : ""}`}
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
                className={`border-t border-ink/10 break-inside-avoid ${failing ? "bg-bad-soft/70 shadow-[inset_4px_0_0_var(--color-bad,#b3261e)]" : row.getIsSelected() ? "bg-brand-soft/50" : "hover:bg-paper-sunk/60"}`}
              >
                {row.getVisibleCells().map((cell) => {
                  const meta = cell.column.columnDef.meta as ColumnMeta | undefined;
                  return (
                    <td key={cell.id} className={`whitespace-nowrap px-1.5 py-1 align-middle ${meta?.numeric ? "text-right" : ""} ${meta?.className ?? ""}`}>
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
  );
}
