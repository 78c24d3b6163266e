"use client";
// The register's view lives in the address: filters, sort, page and columns survive a reload and can be shared.
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useCallback, useEffect, useMemo, useRef } from "react";
import { searchParamsToQuery } from "@/lib/validations/member-list";

export type RegisterQuery = Record<string, string>;

/** Keys of the view that the API does not read (the desk table's columns). */
const VIEW_KEYS = ["cols"] as const;

export function useRegisterUrl() {
  const sp = useSearchParams();
  const router = useRouter();
  const pathname = usePathname();
  const query = useMemo(() => searchParamsToQuery(new URLSearchParams(sp.toString())), [sp]);
  // The address last asked for: a second change (a search typed while a filter change is still
  // on its way into the URL) builds on it, so neither change is lost.
  const pending = useRef<string | null>(null);
  useEffect(() => {
    pending.current = null;
  }, [sp]);

  /**
   * Changes some keys. Filter and sort changes replace the history entry and go back to the
   * first page; moving between pages pushes, so the browser's Back returns to the page before.
   */
  const update = useCallback(
    (patch: Record<string, string | undefined>, opts: { page?: boolean } = {}) => {
      // Read the address now, not the one this callback was made with: a debounced search may
      // fire after a filter change has already landed.
      const next = new URLSearchParams(pending.current ?? window.location.search);
      for (const [k, v] of Object.entries(patch)) {
        if (v === undefined || v === "") next.delete(k);
        else next.set(k, v);
      }
      if (!opts.page) next.delete("cursor");
      const qs = next.toString();
      pending.current = qs;
      const url = qs ? `${pathname}?${qs}` : pathname;
      if (opts.page) router.push(url, { scroll: false });
      else router.replace(url, { scroll: false });
    },
    [router, pathname],
  );

  const clear = useCallback(() => {
    const keep = new URLSearchParams();
    for (const k of ["sort", "dir", "limit", ...VIEW_KEYS]) {
      const v = sp.get(k);
      if (v) keep.set(k, v);
    }
    const qs = keep.toString();
    pending.current = qs;
    router.replace(qs ? `${pathname}?${qs}` : pathname, { scroll: false });
  }, [sp, router, pathname]);

  return { query, cols: sp.get("cols"), update, clear };
}

/** The query string of the filters (and sort), without paging: for export and label links. */
export function filterQueryString(query: RegisterQuery, { withSort = true } = {}) {
  const out = new URLSearchParams();
  for (const [k, v] of Object.entries(query)) {
    if (k === "cursor" || k === "limit") continue;
    if (!withSort && (k === "sort" || k === "dir")) continue;
    out.set(k, v);
  }
  return out.toString();
}
