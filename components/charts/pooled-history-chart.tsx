"use client";
// The group's pooled log K as observations arrived: the estimate, its 95 % interval as a band, and the structure
// estimate the group value replaced (when known) as a dashed reference.
import { Area, CartesianGrid, ComposedChart, Line, ReferenceLine, Tooltip, XAxis, YAxis } from "recharts";
import { PRINT_WIDTH } from "./palette";

export interface PooledHistoryPoint {
  /** ms since the epoch. */
  at: number;
  estimate: number;
  low: number;
  high: number;
  n: number;
}

const dateFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "2-digit", timeZone: "UTC" });

export function PooledHistoryChart({ points, reference }: { points: PooledHistoryPoint[]; reference?: { value: number; label: string } }) {
  const data = points.map((p) => ({ ...p, band: [p.low, p.high] as [number, number] }));
  const values = data.flatMap((d) => [d.low, d.high]).concat(reference ? [reference.value] : []);
  const lo = Math.floor((Math.min(...values) - 0.2) * 2) / 2;
  const hi = Math.ceil((Math.max(...values) + 0.2) * 2) / 2;
  return (
    <ComposedChart width={PRINT_WIDTH} height={260} data={data} margin={{ top: 10, right: 30, bottom: 30, left: 10 }} accessibilityLayer>
      <CartesianGrid strokeDasharray="3 3" stroke="#e7e5e4" />
      <XAxis type="number" dataKey="at" scale="time" domain={["dataMin", "dataMax"]} tickFormatter={(v: number) => dateFormat.format(new Date(v))}
        padding={{ left: 20, right: 20 }} label={{ value: "Recorded", position: "insideBottom", offset: -18 }} />
      <YAxis domain={[lo, hi]} tickFormatter={(v: number) => v.toFixed(1)} label={{ value: "log K", angle: -90, position: "insideLeft", offset: 15 }} />
      <Tooltip labelFormatter={(v) => (typeof v === "number" ? dateFormat.format(new Date(v)) : "")}
        formatter={(value, name) => (Array.isArray(value) ? [`${Number(value[0]).toFixed(2)} to ${Number(value[1]).toFixed(2)}`, "95 % interval"] : [Number(value).toFixed(2), String(name)])} />
      {reference ? <ReferenceLine y={reference.value} stroke="#78716c" strokeDasharray="5 4" label={{ value: reference.label, position: "insideTopRight", fontSize: 11 }} /> : null}
      <Area dataKey="band" stroke="none" fill="#0072B2" fillOpacity={0.15} isAnimationActive={false} name="95 % interval" />
      <Line dataKey="estimate" stroke="#0072B2" strokeWidth={2} dot={{ r: 3 }} type="stepAfter" isAnimationActive={false} name="pooled log K" />
    </ComposedChart>
  );
}
