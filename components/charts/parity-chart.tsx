"use client";
// Predicted against reported recovery, one point per workup with the predicted 95 % interval as a horizontal error
// bar, the identity line and a ±10-point band (workup-practice §6 view 1). Each point is a link to its record.
import { CartesianGrid, ErrorBar, ReferenceLine, Scatter, ScatterChart, Tooltip, XAxis, YAxis, Legend } from "recharts";
import { PRINT_WIDTH, seriesColor } from "./palette";

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

export function ParityChart({ points, seriesLabel }: { points: ParityPoint[]; seriesLabel: (series: string) => string }) {
  const series = [...new Set(points.map((p) => p.series))].sort();
  const plotted: PlotPoint[] = points.map((p) => ({
    ...p,
    reported: Math.min(LIMIT, Math.max(0, p.reported)),
    error: [p.low === null ? 0 : Math.max(0, p.predicted - p.low), p.high === null ? 0 : Math.max(0, p.high - p.predicted)],
  }));
  return (
    <ScatterChart width={PRINT_WIDTH} height={440} margin={{ top: 10, right: 20, bottom: 30, left: 10 }} accessibilityLayer>
      <CartesianGrid strokeDasharray="3 3" stroke="#e7e5e4" />
      <XAxis type="number" dataKey="predicted" name="Predicted" domain={[0, LIMIT]} ticks={[0, 20, 40, 60, 80, 100]}
        label={{ value: "Predicted recovery (%)", position: "insideBottom", offset: -15 }} />
      <YAxis type="number" dataKey="reported" name="Reported" domain={[0, LIMIT]} ticks={[0, 20, 40, 60, 80, 100]} width={50}
        label={{ value: "Reported recovery (%)", angle: -90, position: "insideLeft", style: { textAnchor: "middle" }, dy: 0, dx: 5 }} />
      <ReferenceLine segment={[{ x: 0, y: 0 }, { x: LIMIT, y: LIMIT }]} stroke="#57534e" ifOverflow="hidden" />
      <ReferenceLine segment={[{ x: 0, y: 10 }, { x: LIMIT - 10, y: LIMIT }]} stroke="#a8a29e" strokeDasharray="4 4" ifOverflow="hidden" />
      <ReferenceLine segment={[{ x: 10, y: 0 }, { x: LIMIT, y: LIMIT - 10 }]} stroke="#a8a29e" strokeDasharray="4 4" ifOverflow="hidden" />
      <Tooltip cursor={{ strokeDasharray: "3 3" }} formatter={(value) => (typeof value === "number" ? `${value.toFixed(1)} %` : String(value))}
        labelFormatter={() => ""} />
      <Legend verticalAlign="top" height={28} />
      {series.map((s, i) => (
        <Scatter key={s} name={seriesLabel(s)} data={plotted.filter((p) => p.series === s)} fill={seriesColor(i)} shape={PointLink} isAnimationActive={false}>
          <ErrorBar dataKey="error" direction="x" width={3} stroke={seriesColor(i)} strokeOpacity={0.6} isAnimationActive={false} />
        </Scatter>
      ))}
    </ScatterChart>
  );
}
