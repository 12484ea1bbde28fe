"use client";
// Predicted against reported recovery, one point per workup with the predicted 95 % interval as a horizontal error
// bar, the identity line and a ±10-point band (workup-practice §6 view 1). Each point is a link to its record.
import { CartesianGrid, ErrorBar, ReferenceLine, Scatter, ScatterChart, Tooltip, XAxis, YAxis } from "recharts";
import { type LegendItem } from "./legend";
import { BAND_COLOR, IDENTITY_COLOR, PRINT_WIDTH, seriesColor } from "./palette";

export interface ParityPoint {
  id: string;
  title: string;
  performedOn: string;
  /** Percent. */
  predicted: number;
  reported: number;
  low: number | null;
  high: number | null;
  series: string;
}

interface PlotPoint extends ParityPoint {
  error: [number, number];
}

const LIMIT = 110;

function PointLink(props: unknown) {
  const { cx, cy, fill, payload } = props as { cx?: number; cy?: number; fill?: string; payload?: PlotPoint };
  if (cx === undefined || cy === undefined || !payload) return <g />;
  const label = `${payload.title}, ${payload.performedOn}: predicted ${payload.predicted.toFixed(0)} %, reported ${payload.reported.toFixed(0)} %`;
  return (
    <a href={`/workups/${payload.id}`} aria-label={label} data-workup={payload.id} className="parity-point">
      <title>{label}</title>
      <circle cx={cx} cy={cy} r={5} fill={fill} fillOpacity={0.85} stroke="#fff" strokeWidth={1} />
    </a>
  );
}

/** The series in the order the chart colours them. */
export function paritySeries(points: readonly ParityPoint[]): string[] {
  return [...new Set(points.map((p) => p.series))].sort();
}

/** The parity plot's legend: one dot per solvent system, then the two reference lines. */
export function parityLegend(points: readonly ParityPoint[], seriesLabel: (series: string) => string): LegendItem[] {
  return [
    ...paritySeries(points).map((s, i) => ({ label: seriesLabel(s), color: seriesColor(i), mark: "dot" as const })),
    { label: "Perfect agreement", color: IDENTITY_COLOR, mark: "line" },
    { label: "±10 points", color: BAND_COLOR, mark: "dash" },
  ];
}

export function ParityChart({ points, seriesLabel }: { points: ParityPoint[]; seriesLabel: (series: string) => string }) {
  const series = paritySeries(points);
  const plotted: PlotPoint[] = points.map((p) => ({
    ...p,
    reported: Math.min(LIMIT, Math.max(0, p.reported)),
    error: [p.low === null ? 0 : Math.max(0, p.predicted - p.low), p.high === null ? 0 : Math.max(0, p.high - p.predicted)],
  }));
  return (
    <ScatterChart width={PRINT_WIDTH} height={440} margin={{ top: 10, right: 20, bottom: 30, left: 10 }}
      // A group, not an image: each point inside is a link to its record. The legend is the frame's (drawn in dark text).
      role="group" aria-label="Reported against predicted recovery, one point per workup">
      <CartesianGrid strokeDasharray="3 3" stroke="#e7e5e4" />
      <XAxis type="number" dataKey="predicted" name="Predicted" domain={[0, LIMIT]} ticks={[0, 20, 40, 60, 80, 100]}
        label={{ value: "Predicted recovery (%)", position: "insideBottom", offset: -15 }} />
      <YAxis type="number" dataKey="reported" name="Reported" domain={[0, LIMIT]} ticks={[0, 20, 40, 60, 80, 100]} width={50}
        label={{ value: "Reported recovery (%)", angle: -90, position: "insideLeft", style: { textAnchor: "middle" }, dy: 0, dx: 5 }} />
      <ReferenceLine segment={[{ x: 0, y: 0 }, { x: LIMIT, y: LIMIT }]} stroke={IDENTITY_COLOR} ifOverflow="hidden" />
      <ReferenceLine segment={[{ x: 0, y: 10 }, { x: LIMIT - 10, y: LIMIT }]} stroke={BAND_COLOR} strokeDasharray="4 4" ifOverflow="hidden" />
      <ReferenceLine segment={[{ x: 10, y: 0 }, { x: LIMIT, y: LIMIT - 10 }]} stroke={BAND_COLOR} strokeDasharray="4 4" ifOverflow="hidden" />
      <Tooltip cursor={{ strokeDasharray: "3 3" }} formatter={(value) => (typeof value === "number" ? `${value.toFixed(1)} %` : String(value))}
        labelFormatter={() => ""} />
      {series.map((s, i) => (
        <Scatter key={s} name={seriesLabel(s)} data={plotted.filter((p) => p.series === s)} fill={seriesColor(i)} shape={PointLink} isAnimationActive={false}>
          <ErrorBar dataKey="error" direction="x" width={3} stroke={seriesColor(i)} strokeOpacity={0.6} isAnimationActive={false} />
        </Scatter>
      ))}
    </ScatterChart>
  );
}
