"use client";
// Capacity against length (or extension) for one member or section, drawn from SI points (mm, N)
// in the units chosen, with the elastic critical curve where it is given and the member's own
// operating point: a dot below the line passes.
import { CartesianGrid, Legend, Line, LineChart, ReferenceDot, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { fromMm, fromN, type ForceUnit, type LengthUnit } from "@/lib/units";

export type CurvePoint = { lengthMm: number; capacityN: number; eulerN?: number };

const LENGTH_DECIMALS: Record<LengthUnit, number> = { mm: 0, cm: 1, m: 2, in: 1, ft: 2 };

export function CapacityChart({
  points, operating, pass = null, axis = "Extension", title, basisLabel, forceUnit = "kN", lengthUnit = "mm",
}: {
  points: CurvePoint[];
  /** The member: its length and the load compared with the line. */
  operating: { lengthMm: number; loadN: number } | null;
  pass?: boolean | null;
  /** What the horizontal axis is: a prop's extension or a strut's length. */
  axis?: "Extension" | "Length";
  /** A heading inside the figure (omit when the page gives the section its own). */
  title?: string;
  /** What the line is, for the caption under the chart (e.g. "capacity as safe working load"). */
  basisLabel?: string;
  forceUnit?: ForceUnit;
  lengthUnit?: LengthUnit;
}) {
  const dx = LENGTH_DECIMALS[lengthUnit];
  const x = (mm: number) => fromMm(mm, lengthUnit);
  const y = (n: number) => fromN(n, forceUnit);
  const capacities = points.map((p) => y(p.capacityN));
  const op = operating ? { x: x(operating.lengthMm), y: y(operating.loadN) } : null;
  const top = Math.max(...capacities, op?.y ?? 0);
  // The elastic critical curve runs far above the capacity at short lengths; cut it off.
  const data = points.map((p, i) => {
    const euler = p.eulerN === undefined ? undefined : y(p.eulerN);
    return { x: x(p.lengthMm), capacity: capacities[i]!, euler: euler !== undefined && euler <= top * 2.5 ? euler : undefined };
  });
  const hasEuler = data.some((d) => d.euler !== undefined);
  const axisWord = axis.toLowerCase();
  if (data.length < 2) return <p className="text-ink-soft">No curve can be drawn for this type at these lengths.</p>;
  const label = op
    ? `Capacity against ${axisWord}; this member at ${op.x.toFixed(dx)} ${lengthUnit} carries ${op.y.toFixed(1)} ${forceUnit}`
    : `Capacity against ${axisWord}, in ${forceUnit} against ${lengthUnit}`;
  return (
    <figure className={title ? "rounded-xl border-2 border-ink/15 bg-paper-raised p-4" : undefined}>
      {title ? <figcaption className="mb-2 font-bold">{title}</figcaption> : null}
      <div className="h-64 w-full md:h-80" role="img" aria-label={label}>
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={data} margin={{ top: 10, right: 16, bottom: 24, left: 8 }}>
            <CartesianGrid strokeDasharray="3 3" stroke="#c9c6bd" />
            <XAxis
              dataKey="x"
              type="number"
              domain={["dataMin", "dataMax"]}
              tickCount={6}
              tickFormatter={(v: number) => v.toFixed(dx)}
              label={{ value: `${axis} (${lengthUnit})`, position: "insideBottom", offset: -12 }}
            />
            <YAxis type="number" tickCount={6} width={56} allowDecimals={false} domain={[0, Math.ceil(top * 1.1)]} label={{ value: forceUnit, angle: -90, position: "insideLeft" }} />
            <Tooltip
              formatter={(v, name) => [typeof v === "number" ? `${v.toFixed(1)} ${forceUnit}` : String(v), name]}
              labelFormatter={(v) => `${Number(v).toFixed(dx)} ${lengthUnit}`}
            />
            {hasEuler ? <Legend verticalAlign="top" /> : null}
            <Line type="monotone" dataKey="capacity" name="Capacity" stroke="#1d4f91" strokeWidth={3} dot={false} isAnimationActive={false} />
            {hasEuler ? (
              <Line type="monotone" dataKey="euler" name="Euler (elastic critical)" stroke="#6b7280" strokeDasharray="6 4" dot={false} isAnimationActive={false} connectNulls />
            ) : null}
            {op ? (
              <ReferenceDot
                x={op.x}
                y={op.y}
                r={8}
                fill={pass === null ? "#f2b300" : pass ? "#136c3a" : "#b3261e"}
                stroke="#14161a"
                strokeWidth={2}
                label={title ? { value: "This member", position: "top" } : undefined}
              />
            ) : null}
          </LineChart>
        </ResponsiveContainer>
      </div>
      {basisLabel && op ? (
        <p className="mt-1 text-sm">
          Line: {basisLabel}. Dot: this member — {op.x.toFixed(dx)} {lengthUnit}, {op.y.toFixed(1)} {forceUnit} compared load (
          {pass ? "below the line: PASS" : "above the line or outside the range: FAIL"}).
        </p>
      ) : null}
    </figure>
  );
}
