"use client";

import { CartesianGrid, Legend, Line, LineChart, ReferenceDot, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";

type Props = {
  pts: { length: number; capacity: number; euler?: number }[];
  operating: { length: number; load: number } | null;
  lengthUnit: string;
  forceUnit: string;
};

/** Capacity against length, with the Euler curve and the member's operating point. */
export function CapacityChart({ pts, operating, lengthUnit, forceUnit }: Props) {
  const maxCap = Math.max(...pts.map((p) => p.capacity), operating?.load ?? 0);
  const data = pts.map((p) => ({ ...p, euler: p.euler !== undefined && p.euler <= maxCap * 2.5 ? p.euler : undefined }));
  return (
    <figure className="rounded-xl border-2 border-ink/15 bg-paper-raised p-4">
      <figcaption className="mb-2 font-bold">Capacity against length</figcaption>
      <div className="h-72 w-full" role="img" aria-label={`Chart of capacity in ${forceUnit} against length in ${lengthUnit}`}>
        <ResponsiveContainer width="100%" height="100%">
          <LineChart data={data} margin={{ top: 8, right: 16, bottom: 24, left: 8 }}>
            <CartesianGrid stroke="#d6d3ca" />
            <XAxis
              dataKey="length"
              type="number"
              domain={["dataMin", "dataMax"]}
              tickFormatter={(v: number) => v.toFixed(2)}
              label={{ value: `Length (${lengthUnit})`, position: "insideBottom", offset: -12 }}
            />
            <YAxis tickFormatter={(v: number) => v.toFixed(0)} label={{ value: forceUnit, angle: -90, position: "insideLeft" }} />
            <Tooltip formatter={(v) => (typeof v === "number" ? `${v.toFixed(1)} ${forceUnit}` : String(v))} labelFormatter={(v) => `${Number(v).toFixed(3)} ${lengthUnit}`} />
            <Legend verticalAlign="top" />
            <Line type="monotone" dataKey="capacity" name="Capacity" stroke="#1d4f91" strokeWidth={3} dot={false} isAnimationActive={false} />
            <Line type="monotone" dataKey="euler" name="Euler (elastic critical)" stroke="#6b7280" strokeDasharray="6 4" dot={false} isAnimationActive={false} connectNulls />
            {operating ? (
              <ReferenceDot x={operating.length} y={operating.load} r={7} fill="#f2b300" stroke="#14161a" strokeWidth={2} label={{ value: "This member", position: "top" }} />
            ) : null}
          </LineChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}
