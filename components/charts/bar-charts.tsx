"use client";
// The distribution of deviations, and the mean deviation of each group of a factor with its n beside it
// (workup-practice §6 view 3: "always show n per group").
import { Bar, BarChart, CartesianGrid, Cell, ReferenceLine, Tooltip, XAxis, YAxis } from "recharts";
import { type LegendItem } from "./legend";
import { ABOVE_COLOR, BELOW_COLOR, MUTED_COLOR, PRINT_WIDTH } from "./palette";

export const HISTOGRAM_LEGEND: LegendItem[] = [
  { label: "Below the prediction", color: BELOW_COLOR, mark: "bar" },
  { label: "Above the prediction", color: ABOVE_COLOR, mark: "bar" },
  { label: "Bin straddles zero", color: MUTED_COLOR, mark: "bar" },
];

export const GROUP_LEGEND: LegendItem[] = [
  { label: "Mean below the prediction", color: BELOW_COLOR, mark: "bar" },
  { label: "Mean above the prediction", color: ABOVE_COLOR, mark: "bar" },
  { label: "Fewer than three workups", color: MUTED_COLOR, mark: "bar" },
];
import { niceStep } from "./scale";

export interface Bin {
  from: number;
  to: number;
  label: string;
  count: number;
}

export function DeviationHistogram({ bins }: { bins: Bin[] }) {
  return (
    <BarChart width={PRINT_WIDTH} height={300} data={bins} margin={{ top: 10, right: 20, bottom: 40, left: 10 }} barCategoryGap={1}
      role="img" aria-label="Histogram of reported minus predicted recovery, in 5-point bins">
      <CartesianGrid strokeDasharray="3 3" stroke="#e7e5e4" vertical={false} />
      <XAxis dataKey="label" angle={-35} textAnchor="end" interval={0} height={50} tick={{ fontSize: 11 }}
        label={{ value: "Reported − predicted recovery (percentage points)", position: "insideBottom", offset: -30 }} />
      <YAxis allowDecimals={false} label={{ value: "Workups", angle: -90, position: "insideLeft", offset: 15 }} />
      <Tooltip formatter={(value) => [String(value), "workups"]} />
      <Bar dataKey="count" isAnimationActive={false}>
        {bins.map((b) => <Cell key={b.label} fill={b.to <= 0 ? BELOW_COLOR : b.from >= 0 ? ABOVE_COLOR : MUTED_COLOR} />)}
      </Bar>
    </BarChart>
  );
}

/** A category label on one line (Recharts wraps long labels at the axis width). */
function CategoryTick(props: unknown) {
  const { x, y, payload } = props as { x?: number; y?: number; payload?: { value?: string | number } };
  return <text x={x} y={y} dx={-6} textAnchor="end" dominantBaseline="middle" fontSize={12} fill="#44403c">{payload?.value ?? ""}</text>;
}

export interface GroupBar {
  label: string;
  mean: number;
  n: number;
  few: boolean;
}

export function GroupMeanChart({ groups }: { groups: GroupBar[] }) {
  const data = groups.map((g) => ({ ...g, name: `${g.label} (n = ${g.n})` }));
  // A symmetric axis on round numbers, so that zero sits in the middle and the ticks read easily.
  const step = niceStep(Math.max(10, ...data.map((d) => Math.abs(d.mean))) / 2);
  const extent = 2 * step * Math.ceil(Math.max(10, ...data.map((d) => Math.abs(d.mean))) / (2 * step) + 0.05);
  const ticks = Array.from({ length: Math.round((2 * extent) / step) + 1 }, (_, i) => -extent + i * step);
  return (
    <BarChart width={PRINT_WIDTH} height={Math.max(120, 34 * data.length + 60)} data={data} layout="vertical" margin={{ top: 10, right: 50, bottom: 25, left: 10 }}
      role="img" aria-label="Mean deviation of each group, in percentage points">
      <CartesianGrid strokeDasharray="3 3" stroke="#e7e5e4" horizontal={false} />
      <XAxis type="number" domain={[-extent, extent]} ticks={ticks} tickFormatter={(v: number) => v.toFixed(0)}
        label={{ value: "Mean deviation (percentage points)", position: "insideBottom", offset: -15 }} />
      <YAxis type="category" dataKey="name" width={250} tick={CategoryTick} />
      <ReferenceLine x={0} stroke="#57534e" />
      <Tooltip formatter={(value) => [typeof value === "number" ? `${value.toFixed(1)} points` : String(value), "mean deviation"]} />
      <Bar dataKey="mean" isAnimationActive={false}>
        {data.map((d) => <Cell key={d.name} fill={d.few ? MUTED_COLOR : d.mean < 0 ? BELOW_COLOR : ABOVE_COLOR} />)}
      </Bar>
    </BarChart>
  );
}
