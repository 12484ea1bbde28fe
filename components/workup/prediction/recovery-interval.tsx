// The predicted recovery on a 0–100 % axis: the point, the 95 % interval as a band, and (once reported) what was
// actually recovered, so "as expected / below / above" is visible at a glance.
import { pct } from "./format";

const W = 300;
const X0 = 10;
const X1 = 290;
const x = (fraction: number) => X0 + Math.max(0, Math.min(1.2, fraction)) / 1.2 * (X1 - X0);

export function RecoveryInterval({ predicted, low, high, reported }: { predicted: number; low: number | null; high: number | null; reported?: number | null }) {
  const label = `Predicted ${pct(predicted)}${low !== null && high !== null ? `, 95 % interval ${pct(low)} to ${pct(high)}` : ""}${reported != null ? `; reported ${pct(reported)}` : ""}`;
  return (
    <svg viewBox={`0 0 ${W} 52`} className="w-full max-w-sm" role="img" aria-label={label}>
      <g transform="translate(0 8)">
      <line x1={X0} x2={X1} y1="20" y2="20" stroke="#d6d3d1" strokeWidth="2" />
      {[0, 0.5, 1].map((t) => (
        <g key={t}>
          <line x1={x(t)} x2={x(t)} y1="15" y2="25" stroke="#a8a29e" />
          <text x={x(t)} y="40" textAnchor="middle" fontSize="10" fill="#78716c">{t * 100} %</text>
        </g>
      ))}
      {low !== null && high !== null ? <rect x={x(low)} y="13" width={Math.max(2, x(high) - x(low))} height="14" rx="3" fill="#99f6e4" stroke="#0f766e" strokeWidth="0.8" /> : null}
      <circle cx={x(predicted)} cy="20" r="5" fill="#0f766e" />
      {reported != null ? (
        <g>
          <path d={`M${x(reported)} 8 l6 12 l-6 12 l-6 -12 z`} fill="#b45309" stroke="white" strokeWidth="1" />
          <text x={x(reported)} y="1" textAnchor={reported < 0.1 ? "start" : reported > 1.1 ? "end" : "middle"} fontSize="9" fill="#92400e">reported</text>
        </g>
      ) : null}
      </g>
    </svg>
  );
}
