"use client";
// The plan for every role: pins over the plan (icon, word and colour), a filter like the
// register's, a legend with counts, the chosen pin's check, and the members not on the plan.
import { useMemo, useState } from "react";
import { Icon } from "@/components/icons";
import { PinGlyph, PlanCanvas, type CanvasPin } from "@/components/plan/plan-canvas";
import { formatUtilisation } from "@/lib/client/format";
import { MEMBER_STATUS_LABELS } from "@/lib/labels";
import { lookOf, PIN_STATES, pinState, type PinState } from "@/lib/zone-plans/pin-look";

type Status = keyof typeof MEMBER_STATUS_LABELS;
type Item = { memberId: string; tag: string; status: Status; pass: boolean | null; utilisation: number | null; typeName: string; word: string };
type Plan = {
  imageUrl: string | null;
  width: number | null;
  height: number | null;
  zoneName: string;
  pins: (Item & { x: number; y: number })[];
  unpinned: Item[];
};

const selectCls = "min-h-touch rounded-lg border-2 border-ink/30 bg-paper px-2";

export function PlanView({ siteId, zoneId, plan, canPlace }: { siteId: string; zoneId: string; plan: Plan; canPlace: boolean }) {
  const [status, setStatus] = useState<"" | Status>("");
  const [check, setCheck] = useState<"" | "pass" | "fail" | "none">("");
  const [q, setQ] = useState("");
  const [selected, setSelected] = useState<string | null>(null);

  const keep = useMemo(() => {
    const needle = q.trim().toLowerCase();
    return (m: Item) =>
      (!status || m.status === status) &&
      (!check || (check === "pass" ? m.pass === true : check === "fail" ? m.pass === false : m.pass == null)) &&
      (!needle || m.tag.toLowerCase().includes(needle));
  }, [status, check, q]);

  const pins = useMemo(() => plan.pins.filter(keep), [plan.pins, keep]);
  const unpinned = useMemo(() => plan.unpinned.filter(keep), [plan.unpinned, keep]);
  const canvasPins: CanvasPin[] = useMemo(
    () => pins.map((p) => ({ id: p.memberId, x: p.x, y: p.y, state: pinState(p), label: `${p.tag} ${p.word}` })),
    [pins],
  );
  const counts = useMemo(() => {
    const c: Partial<Record<PinState, number>> = {};
    for (const p of pins) c[pinState(p)] = (c[pinState(p)] ?? 0) + 1;
    return c;
  }, [pins]);
  const chosen = pins.find((p) => p.memberId === selected) ?? null;
  const filterQuery = new URLSearchParams({ ...(status ? { status } : {}), ...(check ? { check } : {}), ...(q.trim() ? { q: q.trim() } : {}) }).toString();
  const pdf = (paper: "a3" | "a4") => `/api/v1/sites/${siteId}/zones/${zoneId}/plan/pdf?paper=${paper}${filterQuery ? `&${filterQuery}` : ""}`;

  return (
    <div className="flex flex-col gap-4">
      <form className="flex flex-wrap items-end gap-3" role="search" aria-label="Filter the plan" onSubmit={(e) => e.preventDefault()}>
        <label className="flex flex-col text-sm font-semibold">
          Status
          <select className={selectCls} value={status} onChange={(e) => setStatus(e.target.value as Status | "")}>
            <option value="">Any status</option>
            {(Object.keys(MEMBER_STATUS_LABELS) as Status[]).map((s) => (
              <option key={s} value={s}>{MEMBER_STATUS_LABELS[s]}</option>
            ))}
          </select>
        </label>
        <label className="flex flex-col text-sm font-semibold">
          Check
          <select className={selectCls} value={check} onChange={(e) => setCheck(e.target.value as typeof check)}>
            <option value="">Any result</option>
            <option value="fail">Failing</option>
            <option value="pass">Passing</option>
            <option value="none">Not checked</option>
          </select>
        </label>
        <label className="flex flex-col text-sm font-semibold">
          Tag contains
          <input className={selectCls} value={q} onChange={(e) => setQ(e.target.value)} placeholder="e.g. P-2" />
        </label>
        <p className="text-sm text-ink-soft" aria-live="polite">
          {pins.length} on the plan, {unpinned.length} not placed
        </p>
      </form>

      <div className="grid gap-4 lg:grid-cols-[minmax(0,1fr)_20rem]">
        <div className="flex min-w-0 flex-col gap-3">
          {plan.imageUrl && plan.width && plan.height ? (
            <PlanCanvas
              imageUrl={plan.imageUrl}
              width={plan.width}
              height={plan.height}
              pins={canvasPins}
              selectedId={selected}
              onPinTap={setSelected}
              label={`${plan.zoneName} plan`}
            />
          ) : (
            <p className="flex items-center gap-2 rounded-lg border-2 border-warn p-4 text-warn">
              <Icon name="warn" /> This zone has no plan yet. A designer or coordinator can upload one below.
            </p>
          )}
          {chosen ? (
            <section aria-label="Chosen member" className="flex flex-col gap-1 rounded-lg border-2 border-ink/30 bg-paper-raised p-3" data-testid="pin-detail">
              <p className="flex items-center gap-2 text-lg font-bold">
                <PinGlyph state={pinState(chosen)} /> {chosen.tag} — {chosen.word}
              </p>
              <p>
                Utilisation <strong>{formatUtilisation(chosen.utilisation)}</strong> · {MEMBER_STATUS_LABELS[chosen.status]} · {chosen.typeName}
              </p>
              <a href={`/sites/${siteId}/members/${chosen.memberId}`} className="inline-flex min-h-touch w-fit items-center gap-2 font-semibold text-brand underline">
                Open {chosen.tag}
              </a>
            </section>
          ) : plan.imageUrl ? (
            <p className="text-sm text-ink-soft">Tap a pin for its utilisation and a link to the member.</p>
          ) : null}
          <div className="flex flex-wrap gap-3 print:hidden">
            <a href={pdf("a3")} className="inline-flex min-h-touch items-center gap-2 rounded-lg border-2 border-ink/60 px-3 font-semibold" target="_blank" rel="noreferrer">
              <Icon name="permit" className="h-5 w-5" /> Print (A3 PDF)
            </a>
            <a href={pdf("a4")} className="inline-flex min-h-touch items-center gap-2 rounded-lg border-2 border-ink/60 px-3 font-semibold" target="_blank" rel="noreferrer">
              A4 PDF
            </a>
          </div>
        </div>

        <aside className="flex flex-col gap-4">
          <section aria-labelledby="legend-h" className="rounded-lg border-2 border-ink/15 p-3">
            <h2 id="legend-h" className="mb-2 font-bold">Legend</h2>
            <ul className="flex flex-col gap-2 text-sm">
              {PIN_STATES.map((s) => (
                <li key={s} className="flex items-start gap-2">
                  <PinGlyph state={s} />
                  <span>
                    <strong>{lookOf(s).word}</strong> ({counts[s] ?? 0}): {lookOf(s).legend}
                  </span>
                </li>
              ))}
            </ul>
          </section>
          <section aria-labelledby="unpinned-h" className="rounded-lg border-2 border-ink/15 p-3">
            <h2 id="unpinned-h" className="mb-2 font-bold">Not on the plan ({unpinned.length})</h2>
            {unpinned.length === 0 ? <p className="text-sm text-ink-soft">Every member shown is placed on the plan.</p> : null}
            <ul className="flex max-h-96 flex-col gap-1 overflow-auto text-sm" aria-label="Members not on the plan">
              {unpinned.map((m) => (
                <li key={m.memberId} className="flex items-center gap-2">
                  <PinGlyph state={pinState(m)} size={16} />
                  <a href={`/sites/${siteId}/members/${m.memberId}`} className="font-semibold underline">{m.tag}</a>
                  <span>{m.word}, {formatUtilisation(m.utilisation)}</span>
                </li>
              ))}
            </ul>
            {unpinned.length && canPlace ? <p className="mt-2 text-sm text-ink-soft">Place one by editing it and tapping its spot on the plan.</p> : null}
          </section>
        </aside>
      </div>
    </div>
  );
}
