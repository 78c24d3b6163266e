// The outcome of a capacity check in words, an icon and colour: capacity, utilisation, pass or
// fail, and why (basis, load factor, warnings and any reason the check could not run).
import { Icon } from "@/components/icons";
import type { CheckView } from "@/lib/register/members";
import { formatUtilisation } from "@/lib/client/format";
import { formatForce } from "@/lib/units";

/** What the screen needs of the server's check (CheckView, as the API sends it). */
export type CheckSummary = Pick<CheckView, "capacityN" | "utilisation" | "pass" | "method" | "basis" | "loadFactor" | "loadFactorSource" | "warnings" | "errors"> & {
  loadBasis?: string | null;
};

export const BASIS_LABELS: Record<string, string> = {
  "safe-working-load": "safe working load (compared with the working load)",
  "design-resistance": "design resistance (compared with the factored load)",
  "available-strength": "LRFD available strength (compared with the factored load)",
  "allowable-strength": "allowable strength (compared with the working load)",
  "elastic-critical": "elastic critical load (no safety margin)",
};

export function PassBadge({ pass, large = false }: { pass: boolean | null; large?: boolean }) {
  const size = large ? "text-2xl px-4 py-2" : "text-sm px-2 py-1";
  if (pass === null) {
    return (
      <span className={`inline-flex items-center gap-1 rounded-lg border-2 border-ink/30 bg-paper-sunk font-bold ${size}`}>
        <Icon name="warn" className={large ? "h-7 w-7" : "h-4 w-4"} /> NOT CHECKED
      </span>
    );
  }
  return pass ? (
    <span className={`inline-flex items-center gap-1 rounded-lg border-2 border-ok bg-ok-soft font-bold text-ok ${size}`}>
      <Icon name="ok" className={large ? "h-7 w-7" : "h-4 w-4"} /> PASS
    </span>
  ) : (
    <span className={`inline-flex items-center gap-1 rounded-lg border-2 border-bad bg-bad-soft font-bold text-bad ${size}`}>
      <Icon name="bad" className={large ? "h-7 w-7" : "h-4 w-4"} /> FAIL
    </span>
  );
}

export function CheckResult({ check, loadN, forceUnit = "kN", title = "Capacity check" }: { check: CheckSummary; loadN: number; forceUnit?: "kN" | "kip"; title?: string }) {
  const factored = loadN * check.loadFactor;
  return (
    <section aria-label={title} data-testid="check-result" className={`rounded-xl border-2 p-4 ${check.pass ? "border-ok bg-paper-raised" : "border-bad bg-bad-soft"}`}>
      <div className="mb-3 flex flex-wrap items-center justify-between gap-2">
        <h2 className="text-lg font-bold">{title}</h2>
        <PassBadge pass={check.pass} large />
      </div>
      <p className="mb-3 font-semibold" data-testid="check-verdict">
        {check.errors
          ? "FAIL — the check could not be completed, so this member must not be loaded."
          : check.pass
            ? `PASS — the member is within its capacity at ${formatUtilisation(check.utilisation)} utilisation.`
            : `FAIL — the load is more than the member's capacity (${formatUtilisation(check.utilisation)} utilisation). Do not load it.`}
      </p>
      <dl className="grid grid-cols-2 gap-2 sm:grid-cols-4">
        <div className="rounded-lg bg-paper-sunk p-3">
          <dt className="text-sm">Capacity</dt>
          <dd className="tabular text-xl font-bold" data-testid="check-capacity">{check.capacityN == null ? "—" : formatForce(check.capacityN, forceUnit)}</dd>
        </div>
        <div className="rounded-lg bg-paper-sunk p-3">
          <dt className="text-sm">Utilisation</dt>
          <dd className="tabular text-xl font-bold" data-testid="check-utilisation">{formatUtilisation(check.utilisation)}</dd>
        </div>
        <div className="rounded-lg bg-paper-sunk p-3">
          <dt className="text-sm">Working load</dt>
          <dd className="tabular text-xl font-bold">{formatForce(loadN, forceUnit)}</dd>
        </div>
        <div className="rounded-lg bg-paper-sunk p-3">
          <dt className="text-sm">Load compared (× {check.loadFactor})</dt>
          <dd className="tabular text-xl font-bold">{formatForce(factored, forceUnit)}</dd>
        </div>
      </dl>
      <ul className="mt-3 space-y-1 text-sm">
        <li>
          <strong>Method:</strong> {check.method}; capacity is the {BASIS_LABELS[check.basis] ?? check.basis}.
        </li>
        <li>
          <strong>Load factor {check.loadFactor}:</strong> {check.loadFactorSource}
        </li>
        {check.loadBasis ? <li>{check.loadBasis}</li> : null}
      </ul>
      {check.errors?.length ? (
        <ul className="mt-3 space-y-1" aria-label="Why the check could not run">
          {check.errors.map((e, i) => (
            <li key={i} className="flex items-start gap-2 font-semibold text-bad">
              <Icon name="bad" className="mt-0.5 h-5 w-5 shrink-0" /> {e.message}
            </li>
          ))}
        </ul>
      ) : null}
      {check.warnings.length ? (
        <ul className="mt-3 space-y-1" aria-label="Warnings">
          {check.warnings.map((w, i) => (
            <li key={i} className="flex items-start gap-2 rounded-lg bg-warn-soft p-2 text-sm">
              <Icon name="warn" className="mt-0.5 h-5 w-5 shrink-0 text-warn" /> {w}
            </li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
