// The scheme page's table of back-propping loads per level of props (Grundy & Kabaila 1963): the
// largest load each level reaches through the casting cycle, per m² and as a multiple of the slab's
// self-weight. Phone first: three narrow columns, the stage under each row.
import { CautionNotice } from "@/components/caution-notice";
import { backpropTable, type BackpropScheme } from "@/lib/register/backprop-load";
import { formatPressure } from "@/lib/units";

export function BackpropLevels({ scheme, unitSystem }: { scheme: BackpropScheme; unitSystem: "si" | "us" }) {
  if (!scheme.backprop) return null;
  const r = backpropTable(scheme);
  const area = (kPa: number) => (unitSystem === "us" ? `${formatPressure(kPa, "psf")} (${formatPressure(kPa)})` : formatPressure(kPa));
  return (
    <section aria-labelledby="bp-h" className="flex flex-col gap-3 rounded-xl border-2 border-ink/15 bg-paper-raised p-4">
      <h2 id="bp-h" className="text-lg font-bold">Back-propping: load on each level of props</h2>
      {!r.ok ? (
        <p role="alert" className="font-semibold text-bad">{Object.values(r.fields)[0]}</p>
      ) : (
        <>
          <p className="text-sm text-ink-soft">
            {r.table.shoredLevels} level{r.table.shoredLevels === 1 ? "" : "s"} of props in use at once; slab self-weight w = {area(r.table.slabSelfWeightKPa)} (
            {r.table.slabThicknessMm} mm × {r.table.densityKnM3} kN/m³). Level 1 is the props right under the slab being cast, level {r.table.shoredLevels} the
            lowest. Simplified method of Grundy &amp; Kabaila (1963): props axially rigid, slabs of equal stiffness, ground rigid.
          </p>
          <table className="w-full table-fixed text-sm" data-testid="backprop-levels">
            <thead>
              <tr className="border-b-2 border-ink/20 text-left">
                <th scope="col" className="w-1/5 py-1">Level</th>
                <th scope="col" className="py-1">Largest load</th>
                <th scope="col" className="w-1/4 py-1 text-right">× w</th>
              </tr>
            </thead>
            <tbody>
              {r.table.levels.map((l) => (
                <tr key={l.level} className="border-b border-ink/10 align-top">
                  <th scope="row" className="py-1 font-semibold">{l.level}</th>
                  <td className="tabular break-words py-1">
                    {area(l.kPa)}
                    <span className="block text-xs text-ink-soft">{l.stage}</span>
                  </td>
                  <td className="tabular py-1 text-right">{l.ratio.toFixed(2)}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <p className="text-sm">
            The youngest slabs carry up to {r.table.maxSlabLoadRatio.toFixed(2)} × their own weight; their strength at that age is the designer&apos;s check.
            A member logged at a level gets that level&apos;s load × its tributary area.
          </p>
        </>
      )}
      <CautionNotice compact />
    </section>
  );
}
