import { Icon } from "@/components/icons";
import { StepSource } from "@/components/step-source";
import type { CalculationSuccess } from "@/lib/engineering";
import { formatUtilisation } from "@/lib/client/format";
import { fromN } from "@/lib/units";
import { stepInUnits } from "@/lib/calculator/units-speech";

const BASIS_WORDS: Record<string, string> = {
  "elastic-critical": "Elastic critical load (no safety margin)",
  "design-resistance": "Design resistance",
  "available-strength": "Available strength (LRFD)",
  "allowable-strength": "Allowable strength (ASD)",
  "safe-working-load": "Safe working load",
  "bearing-resistance": "Load at which the governing bearing check reaches 1",
  "brace-requirement": "Brace requirement",
  "load-ratio": "Load ratios",
};

function fmtValue(v: number | string) {
  if (typeof v === "string") return v;
  if (v === 0) return "0";
  const a = Math.abs(v);
  return a >= 1e6 || a < 1e-3 ? v.toExponential(3) : Number(v.toPrecision(4)).toLocaleString("en-GB", { maximumFractionDigits: 4 });
}

export function ResultView({ result, units }: { result: CalculationSuccess; units: "si" | "us" }) {
  const fu = units === "us" ? "kip" : "kN";
  const cap = result.capacityN !== undefined ? fromN(result.capacityN, fu) : undefined;
  return (
    <section aria-label="Result" className="flex flex-col gap-4">
      <div className="grid gap-3 sm:grid-cols-3">
        {cap !== undefined ? (
          <div className="rounded-xl border-2 border-ink/15 bg-paper-raised p-4">
            <p className="text-sm font-semibold text-ink-soft">{BASIS_WORDS[result.basis]}</p>
            <p className="tabular text-3xl font-bold" data-testid="capacity">
              {cap.toFixed(1)} {fu}
            </p>
          </div>
        ) : null}
        {result.utilisation !== undefined ? (
          <div className="rounded-xl border-2 border-ink/15 bg-paper-raised p-4">
            <p className="text-sm font-semibold text-ink-soft">Utilisation</p>
            <p className="tabular text-3xl font-bold" data-testid="utilisation">
              {formatUtilisation(result.utilisation)}
            </p>
          </div>
        ) : null}
        {result.pass !== undefined ? (
          <div
            data-testid="verdict"
            className={`flex items-center gap-3 rounded-xl border-2 p-4 ${result.pass ? "border-ok bg-ok-soft text-ok" : "border-bad bg-bad-soft text-bad"}`}
          >
            <Icon name={result.pass ? "ok" : "bad"} className="h-8 w-8" />
            <p className="text-2xl font-bold">{result.pass ? "PASS" : "FAIL"}</p>
          </div>
        ) : null}
      </div>
      <p className="text-sm">{result.loadBasis}</p>
      {result.checks?.length ? (
        <div className="overflow-x-auto rounded-xl border-2 border-ink/15 bg-paper-raised">
          <table className="w-full text-left text-sm" data-testid="checks">
            <caption className="p-3 text-left text-base font-bold">Checks</caption>
            <thead className="bg-paper-sunk">
              <tr>
                <th scope="col" className="p-2">Check</th>
                <th scope="col" className="p-2 text-right">Demand</th>
                <th scope="col" className="p-2 text-right">Resistance</th>
                <th scope="col" className="p-2">Unit</th>
                <th scope="col" className="p-2 text-right">Utilisation</th>
                <th scope="col" className="p-2">Source</th>
              </tr>
            </thead>
            <tbody>
              {result.checks.map((c) => {
                const demand = stepInUnits(c.demand, c.unit, units);
                const resistance = stepInUnits(c.resistance, c.unit, units);
                return (
                <tr key={c.name} className="border-t border-ink/10 align-top">
                  <td className="p-2">{c.name}</td>
                  <td className="tabular p-2 text-right">{fmtValue(demand.value)}</td>
                  <td className="tabular p-2 text-right">{fmtValue(resistance.value)}</td>
                  <td className="p-2">{demand.unit}</td>
                  <td className={`tabular p-2 text-right font-bold ${c.utilisation > 1 ? "text-bad" : ""}`}>{(c.utilisation * 100).toFixed(0)} %</td>
                  <td className="p-2 text-ink-soft">{c.source}</td>
                </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      ) : null}
      {result.stages?.length ? (
        <div className="overflow-x-auto rounded-xl border-2 border-ink/15 bg-paper-raised">
          <p className="p-3 text-base font-bold" data-testid="max-slab-ratio">
            Largest slab load {fmtValue(result.maxSlabLoadRatio ?? 0)} × self-weight · largest prop level load {fmtValue(result.maxPropLoadRatio ?? 0)} × self-weight
          </p>
          <table className="w-full text-left text-sm" data-testid="stages">
            <caption className="sr-only">Loads at each stage, newest slab first</caption>
            <thead className="bg-paper-sunk">
              <tr>
                <th scope="col" className="p-2">Stage</th>
                <th scope="col" className="p-2">Slab loads (newest first)</th>
                <th scope="col" className="p-2">Prop level loads (top first)</th>
              </tr>
            </thead>
            <tbody>
              {result.stages.map((st, i) => (
                <tr key={i} className="border-t border-ink/10 align-top">
                  <td className="p-2">{st.label}</td>
                  <td className="tabular p-2">{st.slabLoadRatios.map((x) => x.toFixed(2)).join(" · ") || "—"}</td>
                  <td className="tabular p-2">{st.propLoadRatios.map((x) => x.toFixed(2)).join(" · ") || "—"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
      {result.requiredStiffnessNPerMm !== undefined ? (
        <dl className="grid gap-2 rounded-xl border-2 border-ink/15 bg-paper-raised p-4 sm:grid-cols-3">
          <div>
            <dt className="text-sm text-ink-soft">Ideal brace stiffness</dt>
            <dd className="tabular font-bold">{fmtValue(result.idealStiffnessNPerMm ?? 0)} N/mm</dd>
          </div>
          <div>
            <dt className="text-sm text-ink-soft">Required brace stiffness</dt>
            <dd className="tabular font-bold">{fmtValue(result.requiredStiffnessNPerMm)} N/mm</dd>
          </div>
          <div>
            <dt className="text-sm text-ink-soft">Required brace force</dt>
            <dd className="tabular font-bold">{fmtValue(result.requiredForceN ?? 0)} N</dd>
          </div>
        </dl>
      ) : null}
      {result.warnings.length ? (
        <ul className="flex flex-col gap-2" aria-label="Warnings">
          {result.warnings.map((w) => (
            <li key={w} className="flex items-start gap-2 rounded-lg border-2 border-warn bg-warn-soft p-3">
              <Icon name="warn" className="h-5 w-5 shrink-0 text-warn" />
              {w}
            </li>
          ))}
        </ul>
      ) : null}
      <div className="overflow-x-auto rounded-xl border-2 border-ink/15 bg-paper-raised">
        <table className="w-full text-left text-sm">
          <caption className="p-3 text-left text-base font-bold">Working</caption>
          <thead className="bg-paper-sunk">
            <tr>
              <th scope="col" className="p-2">Step</th>
              <th scope="col" className="p-2">Symbol</th>
              <th scope="col" className="p-2 text-right">Value</th>
              <th scope="col" className="p-2">Unit</th>
              <th scope="col" className="p-2">Source</th>
            </tr>
          </thead>
          <tbody>
            {result.steps.map((s, i) => {
              const shown = stepInUnits(s.value, s.unit, units);
              return (
              <tr key={i} className="border-t border-ink/10 align-top">
                <td className="p-2">{s.label}</td>
                <td className="p-2 font-mono">{s.symbol}</td>
                <td className="tabular p-2 text-right">{fmtValue(shown.value)}</td>
                <td className="p-2">{shown.unit}</td>
                <td className="p-2 text-ink-soft"><StepSource step={s} /></td>
              </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <p className="text-xs text-ink-soft">Engine {result.engineVersion}. {units === "us" ? "Working shown in in, kip and ksi; the engine computes in N, mm and MPa." : "Working in N, mm and MPa."}</p>
    </section>
  );
}
