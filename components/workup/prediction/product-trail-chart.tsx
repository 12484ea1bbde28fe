// Where the product is after each step: carried forward, set aside in a saved layer, or lost (by where it went).
// A picture of the mass balance; the same numbers are in the table for screen readers.
import { LOSS_KINDS, type LossKind, type TrailPoint } from "@/lib/workups-client/product-trail";
import { pct } from "./format";

const LOSS_STYLE: Record<LossKind, { fill: string; label: string }> = {
  aqueous: { fill: "#38bdf8", label: "aqueous layers" },
  organic: { fill: "#f59e0b", label: "organic waste" },
  drying_agent: { fill: "#a8a29e", label: "drying agent" },
  filter_cake: { fill: "#78716c", label: "filter cake" },
  evaporated: { fill: "#c4b5fd", label: "evaporation" },
};
const KINDS = LOSS_KINDS;
const H = 110;

export function ProductTrailChart({ trail, productName }: { trail: TrailPoint[]; productName: string }) {
  if (trail.length === 0) return null;
  const bar = Math.min(28, Math.floor(260 / trail.length) - 4);
  const width = trail.length * (bar + 4) + 30;
  const used = KINDS.filter((k) => trail.some((t) => t.lost[k] > 0.0005));
  const last = trail[trail.length - 1];
  const worst = last ? [...KINDS].sort((a, b) => last.lost[b] - last.lost[a])[0] : undefined;
  const summary = last
    ? `${productName}: ${pct(last.kept)} carried forward after step ${last.step}` +
      (last.saved > 0.0005 ? `, ${pct(last.saved)} in saved layers` : "") +
      (worst && last.lost[worst] > 0.0005 ? `; largest loss to ${LOSS_STYLE[worst].label} (${pct(last.lost[worst])}).` : ".")
    : "";
  const summaryId = `trail-summary-${productName.replace(/[^A-Za-z0-9]+/g, "-")}`;
  return (
    <figure aria-label={`Where ${productName} goes, step by step`} aria-describedby={summaryId}>
      <svg viewBox={`0 0 ${width} ${H + 18}`} className="h-36 w-auto max-w-full" aria-hidden>
        {[0, 0.5, 1].map((t) => (
          <g key={t}>
            <line x1="24" x2={width} y1={H * (1 - t) + 2} y2={H * (1 - t) + 2} stroke="#e7e5e4" />
            <text x="20" y={H * (1 - t) + 5} textAnchor="end" fontSize="8" fill="#78716c">{t * 100}</text>
          </g>
        ))}
        {trail.map((t, i) => {
          const x0 = 28 + i * (bar + 4);
          const segments: { h: number; fill: string }[] = [
            { h: t.kept, fill: "#0f766e" }, { h: t.saved, fill: "#5eead4" }, ...KINDS.map((k) => ({ h: t.lost[k], fill: LOSS_STYLE[k].fill })),
          ];
          let y = H + 2;
          return (
            <g key={t.step}>
              {segments.map((s, j) => {
                const h = Math.max(0, s.h) * H;
                y -= h;
                return h > 0 ? <rect key={j} x={x0} y={y} width={bar} height={h} fill={s.fill} /> : null;
              })}
              <text x={x0 + bar / 2} y={H + 14} textAnchor="middle" fontSize="8" fill="#57534e">{t.step}</text>
            </g>
          );
        })}
      </svg>
      <figcaption className="mt-1 flex flex-wrap gap-x-3 gap-y-1 text-xs text-stone-600">
        <Legend fill="#0f766e" label={`${productName} carried forward`} />
        {trail.some((t) => t.saved > 0.0005) ? <Legend fill="#5eead4" label="in a saved layer" /> : null}
        {used.map((k) => <Legend key={k} fill={LOSS_STYLE[k].fill} label={`lost: ${LOSS_STYLE[k].label}`} />)}
      </figcaption>
      <p id={summaryId} className="mt-1 text-xs text-stone-700">{summary}</p>
      <div className="sr-only">
      <table>
        <caption>Share of the product after each step</caption>
        <thead><tr><th scope="col">Step</th><th scope="col">Carried forward</th><th scope="col">Saved</th>{KINDS.map((k) => <th key={k} scope="col">Lost to {LOSS_STYLE[k].label}</th>)}</tr></thead>
        <tbody>
          {trail.map((t) => (
            <tr key={t.step}><th scope="row">{t.step} {t.label}</th><td>{pct(t.kept)}</td><td>{pct(t.saved)}</td>{KINDS.map((k) => <td key={k}>{pct(t.lost[k])}</td>)}</tr>
          ))}
        </tbody>
      </table>
      </div>
    </figure>
  );
}

function Legend({ fill, label }: { fill: string; label: string }) {
  return <span className="flex items-center gap-1"><span aria-hidden className="inline-block h-2.5 w-2.5 rounded-sm" style={{ background: fill }} />{label}</span>;
}
