"use client";
// Filter controls of the register. Every change goes into the address (see use-register-url.ts).
import { useEffect, useId, useRef, useState } from "react";
import { Field, describedBy, inputClass } from "@/components/ui/field";
import { Icon } from "@/components/icons";
import { MEMBER_STATUS_LABELS } from "@/lib/labels";
import { MEMBER_STATUSES } from "@/lib/validations/member-list";
import type { RegisterQuery } from "./use-register-url";

export type FilterOptions = {
  zones: { id: string; name: string }[];
  schemes: { id: string; reference: string; title: string }[];
  types: { id: string; name: string }[];
};

const FILTER_KEYS = ["status", "zoneId", "schemeId", "typeId", "pass", "utilMin", "utilMax", "q"] as const;

/** "0.85" (the API's ratio) ↔ "85" (what a person types, in per cent). */
function ratioToPercent(r: string | undefined) {
  if (!r) return "";
  const n = Number(r);
  return Number.isFinite(n) ? String(+(n * 100).toFixed(4)) : r;
}
function percentToRatio(p: string): { ok: true; value: string | undefined } | { ok: false; message: string } {
  const t = p.trim();
  if (t === "") return { ok: true, value: undefined };
  if (!/^(?:\d+(?:\.\d*)?|\.\d+)$/.test(t)) return { ok: false, message: "Enter a number of per cent, e.g. 85." };
  return { ok: true, value: String(+(Number(t) / 100).toFixed(6)) };
}

function PercentInput({
  id, label, placeholder, value, error, onCommit,
}: { id: string; label: React.ReactNode; placeholder: string; value: string | undefined; error?: string; onCommit: (ratio: string | undefined) => void }) {
  const [text, setText] = useState(ratioToPercent(value));
  const [localError, setLocalError] = useState<string>();
  useEffect(() => setText(ratioToPercent(value)), [value]);
  const commit = () => {
    const r = percentToRatio(text);
    if (!r.ok) return setLocalError(r.message);
    setLocalError(undefined);
    if (r.value !== value) onCommit(r.value);
  };
  const err = localError ?? error;
  return (
    <Field id={id} label={label} error={err}>
      <div className="flex items-center gap-1">
        <input
          id={id}
          className={`${inputClass} tabular`}
          inputMode="decimal"
          value={text}
          placeholder={placeholder}
          aria-invalid={err ? true : undefined}
          aria-describedby={describedBy(id, err)}
          onChange={(e) => setText(e.target.value)}
          onBlur={commit}
          onKeyDown={(e) => e.key === "Enter" && commit()}
        />
        <span aria-hidden className="text-ink-soft">
          %
        </span>
      </div>
    </Field>
  );
}

export function RegisterFilters({
  query, update, clear, options, errors,
}: {
  query: RegisterQuery;
  update: (patch: Record<string, string | undefined>) => void;
  clear: () => void;
  options: FilterOptions;
  errors: Record<string, string>;
}) {
  const uid = useId();
  const [open, setOpen] = useState(false);
  const [q, setQ] = useState(query.q ?? "");
  const typing = useRef<ReturnType<typeof setTimeout> | null>(null);
  const sent = useRef<string | undefined>(query.q);
  // Back/forward or "Clear filters" change the address: show what it says. The echo of what was
  // typed here is skipped, so a slow round trip never overwrites letters typed since.
  useEffect(() => {
    if (query.q === sent.current) return;
    sent.current = query.q;
    setQ(query.q ?? "");
  }, [query.q]);
  const onSearch = (v: string) => {
    setQ(v);
    if (typing.current) clearTimeout(typing.current);
    typing.current = setTimeout(() => {
      sent.current = v.trim() || undefined;
      update({ q: sent.current });
    }, 300);
  };
  const active = FILTER_KEYS.filter((k) => k !== "q" && query[k]).length;

  const select = (key: (typeof FILTER_KEYS)[number], label: string, children: React.ReactNode) => {
    const id = `${uid}-${key}`;
    return (
      <Field id={id} label={label} error={errors[key]}>
        <select
          id={id}
          className={inputClass}
          value={query[key] ?? ""}
          aria-invalid={errors[key] ? true : undefined}
          aria-describedby={describedBy(id, errors[key])}
          onChange={(e) => update({ [key]: e.target.value || undefined })}
        >
          {children}
        </select>
      </Field>
    );
  };

  return (
    <section aria-label="Filters" className="flex flex-col gap-3 rounded-xl border-2 border-ink/10 bg-paper-raised p-3">
      <div className="flex items-end gap-2">
        <div className="flex-1">
          <Field id={`${uid}-q`} label="Search by tag" error={errors.q}>
            <input
              id={`${uid}-q`}
              type="search"
              className={inputClass}
              value={q}
              placeholder="e.g. L03-P12"
              autoComplete="off"
              aria-invalid={errors.q ? true : undefined}
              aria-describedby={describedBy(`${uid}-q`, errors.q)}
              onChange={(e) => onSearch(e.target.value)}
            />
          </Field>
        </div>
        <button
          type="button"
          className="inline-flex min-h-touch items-center gap-1 rounded-lg border-2 border-ink/40 px-3 font-semibold md:hidden"
          aria-expanded={open}
          aria-controls={`${uid}-more`}
          onClick={() => setOpen((o) => !o)}
        >
          Filters{active ? ` (${active})` : ""}
        </button>
      </div>
      <div id={`${uid}-more`} className={`${open ? "grid" : "hidden"} grid-cols-2 gap-3 md:grid md:grid-cols-3 xl:grid-cols-6`}>
        {select(
          "status",
          "Status",
          <>
            <option value="">Any status</option>
            {MEMBER_STATUSES.map((s) => (
              <option key={s} value={s}>
                {MEMBER_STATUS_LABELS[s]}
              </option>
            ))}
          </>,
        )}
        {select(
          "pass",
          "Check",
          <>
            <option value="">Pass or fail</option>
            <option value="true">Passing</option>
            <option value="false">Failing</option>
          </>,
        )}
        {select(
          "zoneId",
          "Zone",
          <>
            <option value="">Any zone</option>
            {options.zones.map((z) => (
              <option key={z.id} value={z.id}>
                {z.name}
              </option>
            ))}
          </>,
        )}
        {select(
          "schemeId",
          "Scheme",
          <>
            <option value="">Any scheme</option>
            {options.schemes.map((s) => (
              <option key={s.id} value={s.id}>
                {s.reference} — {s.title}
              </option>
            ))}
          </>,
        )}
        <div className="col-span-2 md:col-span-1">
          {select(
            "typeId",
            "Member type",
            <>
              <option value="">Any type</option>
              {options.types.map((t) => (
                <option key={t.id} value={t.id}>
                  {t.name}
                </option>
              ))}
            </>,
          )}
        </div>
        <fieldset className="col-span-2 md:col-span-1">
          <legend className="text-sm font-semibold text-ink">Utilisation</legend>
          <div className="grid grid-cols-2 gap-2">
            <PercentInput placeholder="from" id={`${uid}-umin`} label={<span className="sr-only">Utilisation from (per cent)</span>} value={query.utilMin} error={errors.utilMin} onCommit={(v) => update({ utilMin: v })} />
            <PercentInput placeholder="to" id={`${uid}-umax`} label={<span className="sr-only">Utilisation to (per cent)</span>} value={query.utilMax} error={errors.utilMax} onCommit={(v) => update({ utilMax: v })} />
          </div>
        </fieldset>
      </div>
      {active || query.q ? (
        <div>
          <button type="button" className="inline-flex min-h-touch items-center gap-1 font-semibold text-brand underline-offset-4 hover:underline" onClick={clear}>
            <Icon name="bad" className="h-4 w-4" /> Clear filters
          </button>
        </div>
      ) : null}
    </section>
  );
}
