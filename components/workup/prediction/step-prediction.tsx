"use client";
// One step as the engine sees it: the funnel (or flask) at a chosen portion, where each component is, the aqueous pH,
// gas and heat, and what left the main line in this step.
import { MARGINAL_DENSITY_DIFFERENCE } from "@/lib/chem/phases";
import { useId, useState } from "react";
import { type SideStream, type StepResult } from "@/lib/chem/types";
import { FlaskPicture, FunnelPicture } from "./vessel-picture";
import { PhaseBars, type ComponentName } from "./phase-bars";
import { ml, pct, pH, PHASE_COLORS } from "./format";
import { formatNumber } from "@/components/ui/format";

const FATE_WORDS: Record<SideStream["fate"], string> = {
  saved: "saved", waste: "to waste", drying_agent: "held on the drying agent", filter_cake: "held on the filter cake", evaporated: "evaporated", combined: "saved, combined later",
};

export function StepPrediction({ step, components, capacityMl, startMmol }: {
  step: StepResult; components: ComponentName[]; capacityMl: number; startMmol: Record<string, number>;
}) {
  const id = useId().replace(/:/g, "");
  const [portion, setPortion] = useState(0);
  const contact = step.contacts[Math.min(portion, step.contacts.length - 1)];
  const product = components.find((c) => c.isProduct);
  return (
    <div className="flex flex-wrap gap-3" data-testid="step-prediction">
      {contact ? <FunnelPicture contact={contact} capacityMl={capacityMl} id={id} /> : <FlaskPicture stream={step.kept} capacityMl={capacityMl} id={id} />}
      <div className="min-w-52 flex-1 space-y-2 text-xs text-stone-700">
        {step.contacts.length > 1 ? (
          <div role="group" aria-label="Portion shown" className="flex flex-wrap items-center gap-1">
            <span className="text-stone-500">Portion</span>
            {step.contacts.map((c, i) => (
              <button key={c.portion} type="button" aria-pressed={i === portion} onClick={() => setPortion(i)}
                className={`rounded px-1.5 py-0.5 tabular-nums ${i === portion ? "bg-stone-800 text-white" : "bg-stone-100 text-stone-700 hover:bg-stone-200"}`}>{c.portion}</button>
            ))}
          </div>
        ) : null}
        {contact ? (
          <>
            <ul className="space-y-0.5">
              {[...contact.phases].sort((a, b) => (a.position === "top" ? -1 : b.position === "top" ? 1 : 0)).map((p) => (
                <li key={p.kind + p.position}>
                  <span aria-hidden className={`mr-1.5 inline-block h-2.5 w-2.5 rounded-sm align-middle ${PHASE_COLORS[p.kind].swatch}`} />
                  <span className="font-medium capitalize">{p.position === "single" ? "One phase" : p.position}</span>: {p.kind}, {ml(p.volumeMl)}, ρ {formatNumber(p.densityGPerMl, 2)} g/mL
                  {p.pH !== null ? <span className="font-medium">, pH {pH(p.pH)}</span> : null}
                </li>
              ))}
            </ul>
            {contact.phases.length > 1 ? <PhaseBars contact={contact} components={components} /> : null}
            <ContactNumbers contact={contact} />
          </>
        ) : (
          <p>Carried forward: {step.kept.kind === "residue" ? "the residue (solvent removed)" : `${step.kept.kind}, ${ml(step.kept.volumeMl)}`}.</p>
        )}
        <SideStreams step={step} product={product} startMmol={startMmol} />
        <StepDetails details={step.details} />
      </div>
    </div>
  );
}

function ContactNumbers({ contact }: { contact: StepResult["contacts"][number] }) {
  const notes: string[] = [];
  if (contact.co2GasMl > 0.5) notes.push(`about ${ml(contact.co2GasMl)} of CO₂ released`);
  if (contact.temperatureRiseK > 1) notes.push(`warms by about ${formatNumber(contact.temperatureRiseK, 0)} K`);
  if (contact.capacityExceeded) notes.push(`the wash's acid/base is used up (pH moved from ${pH(contact.reagentPh)})`);
  if (contact.densityDifference !== null && Math.abs(contact.densityDifference) < MARGINAL_DENSITY_DIFFERENCE) notes.push(`densities within ${MARGINAL_DENSITY_DIFFERENCE} g/mL: the layers may not separate`);
  return notes.length > 0 ? <p className="text-stone-600">This portion: {notes.join("; ")}.</p> : null;
}

function SideStreams({ step, product, startMmol }: { step: StepResult; product: ComponentName | undefined; startMmol: Record<string, number> }) {
  if (step.sideStreams.length === 0) return null;
  const start = product ? (startMmol[product.key] ?? 0) : 0;
  return (
    <ul className="space-y-0.5 text-stone-600">
      {step.sideStreams.map((s, i) => (
        <li key={`${s.name}-${i}`}>
          {s.name} {FATE_WORDS[s.fate]}{s.wasteClass ? ` (${s.wasteClass.replace(/_/g, " ")})` : ""}{s.volumeMl > 0 ? `, ${ml(s.volumeMl)}` : ""}
          {product && start > 0 ? <>: <span className="font-medium text-stone-800">{pct((s.components[product.key] ?? 0) / start)} of the product</span></> : null}
        </li>
      ))}
    </ul>
  );
}

const DETAIL_WORDS: Record<string, (v: number) => string> = {
  reagentVolumeMl: (v) => `reagent added to reach the target pH: ${ml(v)}`,
  agentRecommendedG: (v) => `drying agent needed (with the usual excess): ${formatNumber(v, 2)} g`,
  agentUsedG: (v) => `drying agent used: ${formatNumber(v, 2)} g`,
  fractionHeldUp: (v) => `solution held on the solid: ${pct(v)}`,
  waterMl: (v) => (v > 0 ? `water left in the residue: ${ml(v)}` : ""),
};

function StepDetails({ details }: { details: StepResult["details"] }) {
  const lines = Object.entries(details).flatMap(([k, v]) => (typeof v === "number" && DETAIL_WORDS[k] ? [DETAIL_WORDS[k](v)] : [])).filter(Boolean);
  if (details.targetReached === false) lines.unshift("the target pH could not be reached with this reagent");
  if (details.wrongDirection === true) lines.unshift("this reagent moves the pH away from the target, so none was added");
  return lines.length > 0 ? <p className="text-stone-600">{lines.join("; ")}.</p> : null;
}
