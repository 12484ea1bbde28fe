"use client";
// The group's pooled log K as observations arrived: the estimate after each one with its 95 % interval as an error
// bar, and the value predictions would use without group data (from log P or the structure) as a dashed reference.
import { CartesianGrid, ComposedChart, ErrorBar, Line, ReferenceLine, Tooltip, XAxis, YAxis } from "recharts";
import { type LegendItem } from "./legend";
import { PRINT_WIDTH } from "./palette";

/** The history chart's legend: the estimate with its interval, and the value used without group data. */
export function pooledLegend(reference: { label: string } | undefined): LegendItem[] {
  return [
    { label: "Pooled log K with its 95 % interval", color: "#0072B2", mark: "dot" },
    ...(reference ? [{ label: `Without group data (${reference.label})`, color: "#78716c", mark: "dash" as const }] : []),
  ];
}
import { niceTicks } from "./scale";

export interface PooledHistoryPoint {
  /** ms since the epoch. */
  at: number;
  estimate: number;
  low: number;
  high: number;
  n: number;
}

const dateFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "2-digit", timeZone: "UTC" });
const DAY_MS = 86_400_000;

export function PooledHistoryChart({ points, reference }: { points: PooledHistoryPoint[]; reference?: { value: number; label: string } }) {
  const data = points.map((p) => ({ ...p, interval: [p.estimate - p.low, p.high - p.estimate] as [number, number] }));
  const values = data.flatMap((d) => [d.low, d.high]).concat(reference ? [reference.value] : []);
  const ticks = niceTicks(Math.min(...values), Math.max(...values), 5);
  const first = Math.min(...data.map((d) => d.at));
  const last = Math.max(...data.map((d) => d.at));
  // A single day still gets a readable time axis: a week either side.
  const span = Math.max(last - first, 14 * DAY_MS);
  const domain: [number, number] = [first - span * 0.05 - (last === first ? 7 * DAY_MS : 0), last + span * 0.05 + (last === first ? 7 * DAY_MS : 0)];
  return (
    <ComposedChart width={PRINT_WIDTH} height={260} data={data} margin={{ top: 16, right: 30, bottom: 30, left: 10 }}
      role="img" aria-label="Pooled log K after each observation, with its 95 % interval">
      <CartesianGrid strokeDasharray="3 3" stroke="#e7e5e4" />
      <XAxis type="number" dataKey="at" scale="time" domain={domain} tickCount={5} tickFormatter={(v: number) => dateFormat.format(new Date(v))}
        label={{ value: "Recorded", position: "insideBottom", offset: -18 }} />
      <YAxis domain={[ticks[0] ?? 0, ticks[ticks.length - 1] ?? 1]} ticks={ticks} tickFormatter={(v: number) => v.toFixed(1)} width={60}
        label={{ value: "log K", angle: -90, position: "insideLeft", style: { textAnchor: "middle" }, dx: -2 }} />
      <Tooltip labelFormatter={(v) => (typeof v === "number" ? dateFormat.format(new Date(v)) : "")}
        formatter={(value, _name, item) => {
          const p = (item as { payload?: PooledHistoryPoint }).payload;
          return [p ? `${Number(value).toFixed(2)} (95 %: ${p.low.toFixed(2)} to ${p.high.toFixed(2)}, n = ${p.n})` : String(value), "pooled log K"];
        }} />
      {reference ? <ReferenceLine y={reference.value} stroke="#78716c" strokeDasharray="5 4" label={{ value: reference.label, position: "insideTopRight", fontSize: 11 }} /> : null}
      <Line dataKey="estimate" stroke="#0072B2" strokeWidth={2} dot={{ r: 4, fill: "#0072B2" }} type="stepAfter" isAnimationActive={false} name="pooled log K">
        <ErrorBar dataKey="interval" direction="y" width={6} stroke="#0072B2" strokeOpacity={0.7} isAnimationActive={false} />
      </Line>
    </ComposedChart>
  );
}
