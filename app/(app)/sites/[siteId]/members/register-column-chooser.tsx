"use client";
// "Columns": which of the optional columns the desk table shows (kept in the address as ?cols=).
import { useState } from "react";
import { OPTIONAL_COLUMNS, type OptionalColumn } from "./register-columns";

export function ColumnChooser({ shown: fromUrl, onChange }: { shown: readonly OptionalColumn[]; onChange: (next: OptionalColumn[]) => void }) {
  // A tick shows at once; the address catches up a moment later and then wins again.
  const [pending, setPending] = useState<OptionalColumn[] | null>(null);
  const urlKey = fromUrl.join(",");
  const [seenUrl, setSeenUrl] = useState(urlKey);
  if (seenUrl !== urlKey) {
    setSeenUrl(urlKey);
    setPending(null);
  }
  const shown = pending ?? fromUrl;
  const choose = (next: OptionalColumn[]) => {
    setPending(next);
    onChange(next);
  };
  return (
    <details className="relative hidden md:block print:hidden" data-testid="column-chooser">
      <summary className="flex min-h-touch cursor-pointer list-none items-center gap-1 rounded-lg border-2 border-ink/40 bg-paper-raised px-3 text-sm font-semibold hover:bg-paper-sunk">
        Columns ({shown.length} of {OPTIONAL_COLUMNS.length} more)
      </summary>
      <fieldset className="absolute right-0 z-20 mt-1 flex w-56 flex-col gap-1 rounded-lg border-2 border-ink/20 bg-paper-raised p-3 shadow-lg">
        <legend className="sr-only">Columns to show</legend>
        <p className="text-sm text-ink-soft">Tag, status, check, utilisation and extension always show.</p>
        {OPTIONAL_COLUMNS.map((c) => (
          <label key={c.id} className="flex min-h-9 items-center gap-2">
            <input
              type="checkbox"
              className="h-5 w-5"
              checked={shown.includes(c.id)}
              onChange={(e) => choose(e.target.checked ? [...shown, c.id] : shown.filter((s) => s !== c.id))}
            />
            {c.label}
          </label>
        ))}
      </fieldset>
    </details>
  );
}
