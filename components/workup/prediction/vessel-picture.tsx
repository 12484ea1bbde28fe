// Inline SVG of the separatory funnel (two phases, the one on top drawn on top, heights to scale) or of the flask
// (one stream, or a residue after concentration). Every step is drawn against the same capacity.
import { type ContactResult, type StreamSummary } from "@/lib/chem/types";
import { layerBoxes } from "@/lib/workups-client/funnel-geometry";
import { ml, pH, PHASE_COLORS } from "./format";

const FUNNEL_BODY = "M50 6 h20 v14 c26 6 36 22 36 46 v46 c0 18 -22 34 -36 46 h-20 c-14 -12 -36 -28 -36 -46 v-46 c0 -24 10 -40 36 -46 z";
const LIQUID_TOP = 26;
const LIQUID_BOTTOM = 158;

function describeContact(contact: ContactResult): string {
  return contact.phases.map((p) => `${p.position === "single" ? "one phase" : p.position}: ${p.kind}, ${ml(p.volumeMl)}${p.pH !== null ? `, pH ${pH(p.pH)}` : ""}`).join("; ");
}

export function FunnelPicture({ contact, capacityMl, id }: { contact: ContactResult; capacityMl: number; id: string }) {
  const boxes = layerBoxes(contact.phases, capacityMl, LIQUID_TOP, LIQUID_BOTTOM);
  return (
    <svg viewBox="0 0 120 200" className="h-44 w-28 shrink-0" role="img" aria-label={`Separatory funnel: ${describeContact(contact)}`}>
      <defs>
        <clipPath id={`${id}-clip`}><path d={FUNNEL_BODY} /></clipPath>
      </defs>
      <g clipPath={`url(#${id}-clip)`}>
        {boxes.map((b) => (
          <rect key={b.kind + b.position} x="0" y={b.y} width="120" height={b.height} fill={PHASE_COLORS[b.kind].fill} stroke={PHASE_COLORS[b.kind].stroke} strokeWidth="0.6" />
        ))}
      </g>
      <path d={FUNNEL_BODY} fill="none" stroke="#57534e" strokeWidth="2" />
      <path d="M56 164 v30 M64 164 v30" stroke="#57534e" strokeWidth="2" />
      <rect x="48" y="172" width="24" height="6" rx="2" fill="#78716c" />
    </svg>
  );
}

export function FlaskPicture({ stream, capacityMl, id }: { stream: StreamSummary; capacityMl: number; id: string }) {
  const liquid = stream.kind === "organic" || stream.kind === "aqueous" || stream.kind === "mixture";
  const height = liquid ? Math.min(96, Math.max(stream.volumeMl > 0 ? 3 : 0, (stream.volumeMl / capacityMl) * 96)) : 0;
  const colors = stream.kind === "aqueous" ? PHASE_COLORS.aqueous : PHASE_COLORS.organic;
  const label = liquid ? `Flask: ${stream.kind}, ${ml(stream.volumeMl)}` : stream.kind === "residue" || stream.kind === "solid" ? `Flask: ${stream.kind} after removing the solvent` : "Flask: empty";
  return (
    <svg viewBox="0 0 120 200" className="h-44 w-28 shrink-0" role="img" aria-label={label}>
      <defs>
        <clipPath id={`${id}-clip`}><circle cx="60" cy="140" r="48" /></clipPath>
      </defs>
      {liquid ? <rect x="0" y={188 - height} width="120" height={height} fill={colors.fill} stroke={colors.stroke} strokeWidth="0.6" clipPath={`url(#${id}-clip)`} /> : null}
      {stream.kind === "residue" || stream.kind === "solid" ? <ellipse cx="60" cy="182" rx="16" ry="4" fill="#a8a29e" /> : null}
      <path d="M52 20 v72 a48 48 0 1 0 16 0 v-72" fill="none" stroke="#57534e" strokeWidth="2" />
      <path d="M48 20 h24" stroke="#57534e" strokeWidth="2" />
    </svg>
  );
}
