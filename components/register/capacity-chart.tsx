"use client";
// Capacity against extension for a member's type, with the member's own operating point.
import { CartesianGrid, Line, LineChart, ReferenceDot, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";

export type CurvePoint = { lengthMm: number; capacityN: number };

export function CapacityChart({
  points, operating, pass, basisLabel, forceUnit = "kN", lengthUnit = "mm",
}: {
  points: CurvePoint[];
  operating: { lengthMm: number; loadN: number };
  pass: boolean | null;
  basisLabel: string;
  forceUnit?: "kN" | "kip";
  lengthUnit?: "mm" | "in";
}) {
  const f = forceUnit === "kip" ? 1 / 4448.2216152605 : 1 / 1000;
  const l = lengthUnit === "in" ? 1 / 25.4 : 1;
  const data = points.map((p) => ({ x: Math.round(p.lengthMm * l * 10) / 10, y: Math.round(p.capacityN * f * 100) / 100 }));
  const op = { x: operating.lengthMm * l, y: operating.loadN * f };
  const yMax = Math.ceil(Math.max(...data.map((d) => d.y), op.y) * 1.1);
  if (data.length < 2) {
    return <p className="text-ink-soft">No curve can be drawn for this type at these lengths.</p>;
  }
  return (
    <figure>
      <div className="h-64 w-full md:h-80" role="img" aria-label={`Capacity against extension; this member at ${op.x.toFixed(0)} ${lengthUnit} carries ${op.y.toFixed(1)} ${forceUnit}`}>
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={data} margin={{ top: 10, right: 16, bottom: 24, left: 8 }}>
            <CartesianGrid strokeDasharray="3 3" stroke="#c9c6bd" />
            <XAxis dataKey="x" type="number" domain={["dataMin", "dataMax"]} tickCount={6} label={{ value: `Extension (${lengthUnit})`, position: "insideBottom", offset: -12 }} />
            <YAxis type="number" tickCount={6} width={56} allowDecimals={false} label={{ value: forceUnit, angle: -90, position: "insideLeft" }} domain={[0, yMax]} />
            <Tooltip formatter={(v) => [`${Number(v).toFixed(1)} ${forceUnit}`, "Capacity"]} labelFormatter={(v) => `${v} ${lengthUnit}`} />
            <Line type="monotone" dataKey="y" stroke="#1d4f91" strokeWidth={3} dot={false} isAnimationActive={false} />
            <ReferenceDot x={op.x} y={op.y} r={8} fill={pass ? "#136c3a" : "#b3261e"} stroke="#14161a" strokeWidth={2} />
          </LineChart>
        </ResponsiveContainer>
      </div>
      <figcaption className="mt-1 text-sm">
        Line: {basisLabel}. Dot: this member — {op.x.toFixed(0)} {lengthUnit}, {op.y.toFixed(1)} {forceUnit} compared load ({pass ? "below the line: PASS" : "above the line or outside the range: FAIL"}).
      </figcaption>
    </figure>
  );
}
