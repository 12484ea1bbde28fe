/** Layer and separation failure modes: F10, F11, F12, F22. */
import { MARGINAL_DENSITY_DIFFERENCE } from "../phases";
import { type ComponentTag } from "../schema";
import { flag, operationOf, pct, productInfo, stepName, type Rule } from "./context";

const FINE_SOLIDS: ComponentTag[] = ["aluminium", "titanium", "zinc", "copper", "palladium", "tin"];

/**
 * F10: emulsion or slow separation risk. Every contact is read for each cause, so layers closer than 0.03 g/mL
 * in density are reported whatever brings them there (salt, a solvent mixture, dissolved material) and even when
 * an earlier contact already raised another cause.
 */
export const emulsionRisk: Rule = (ctx) => {
  const reasons: string[] = [];
  let step: number | undefined;
  const note = (s: number, r: string) => { step ??= s; reasons.push(r); };
  let marginal = false, basicChlorinated = false, observed = false;
  for (const t of ctx.contacts) {
    if (!t.twoPhase) continue;
    const d = Math.abs(t.organicDensity - t.aqueousDensity);
    if (!marginal && d < MARGINAL_DENSITY_DIFFERENCE) {
      marginal = true;
      note(t.step, `in ${stepName(ctx, t.step)} the layers differ in density by only ${d.toFixed(3)} g/mL (${t.organicDensity.toFixed(3)} against ${t.aqueousDensity.toFixed(3)}) and may not separate`);
    }
    if (!basicChlorinated && t.chlorinatedOrganic && t.pH > 10) {
      basicChlorinated = true;
      note(t.step, `a basic aqueous layer (pH ${t.pH.toFixed(1)}) meets a chlorinated solvent in ${stepName(ctx, t.step)}`);
    }
    const obs = operationOf(ctx, t.step)?.observed?.interface;
    if (!observed && (obs === "emulsion" || obs === "rag")) {
      observed = true;
      note(t.step, `an ${obs === "rag" ? "rag layer" : "emulsion"} was observed in ${stepName(ctx, t.step)}`);
    }
  }
  const tags = new Set(ctx.input.components.flatMap((c) => c.tags));
  const fines = FINE_SOLIDS.filter((x) => tags.has(x));
  if (fines.length > 0) reasons.push(`fine inorganic solids are expected (${fines.join(", ")} salts)`);
  const soaps = ctx.input.components.filter((c) => c.surfactant).map((c) => c.name);
  if (soaps.length > 0) reasons.push(`surfactant-like components are present (${soaps.join(", ")})`);
  if (reasons.length === 0) return [];
  return [flag("F10", "warning", marginal ? "Layers may not separate (emulsion or slow-separation risk)" : "Emulsion or slow-separation risk", `Risk of an emulsion or a slow split: ${reasons.join("; ")}.`,
    "Wait, swirl gently rather than shake hard; add brine or a little solid NaCl; filter through Celite if solids hold it; centrifuge; add more solvent; acidify soap emulsions.",
    step === undefined ? {} : { step })];
};

/** F11: predicted layer order differs from the solvent family's usual order, or is marginal. */
export const layerMisidentified: Rule = (ctx) => {
  for (const t of ctx.contacts) {
    if (!t.twoPhase) continue;
    const usualTop = !t.chlorinatedOrganic;
    const d = t.organicDensity - t.aqueousDensity;
    if (t.organicOnTop !== usualTop || Math.abs(d) < MARGINAL_DENSITY_DIFFERENCE) {
      const where = t.organicOnTop ? "on top" : "at the bottom";
      return [flag("F11", Math.abs(d) < MARGINAL_DENSITY_DIFFERENCE ? "warning" : "danger", "Layer order may be misidentified",
        `In ${stepName(ctx, t.step)} the organic layer (${t.organicDensity.toFixed(3)} g/mL) is predicted ${where} of the aqueous layer (${t.aqueousDensity.toFixed(3)} g/mL)` +
        `${t.organicOnTop !== usualTop ? ", the opposite of the usual order for this solvent" : "; the densities are too close to be sure which is which"}.`,
        "Do a drop test (a few drops of a layer into water), label every flask, and keep all layers until the product is in hand.", { step: t.step })];
    }
  }
  return [];
};

/** F12: a layer holding product is discarded. */
export const discardedProduct: Rule = (ctx) => {
  const p = productInfo(ctx);
  if (!p || p.startMmol <= 0) return [];
  const s = ctx.side.find((x) => x.fate === "waste" && (x.stream.comp[p.index] as number) / p.startMmol > 0.02);
  if (!s) return [];
  const f = (s.stream.comp[p.index] as number) / p.startMmol;
  return [flag("F12", f > 0.2 ? "danger" : "warning", "Layer with product sent to waste",
    `The ${s.name} from ${stepName(ctx, s.step)} is discarded but is predicted to hold ${pct(f)} of ${p.component.name}.`,
    "Keep, label and check (TLC/LC) every aqueous layer until the product is confirmed; record what happened to it.",
    { step: s.step, component: p.component.key })];
};

/** F22: poor phase cut: hazy interface, short settling, organic volume below prediction. */
export const poorCut: Rule = (ctx) => {
  for (const t of ctx.contacts) {
    const o = operationOf(ctx, t.step)?.observed;
    if (!o || !t.twoPhase) continue;
    const reasons: string[] = [];
    if (o.interface === "hazy" || o.interface === "solids") reasons.push(`the interface was ${o.interface === "hazy" ? "hazy" : "full of solids"}`);
    if (o.settleMinutes !== undefined && o.settleMinutes < 1) reasons.push(`settling took under a minute`);
    if (o.volumeOrganicMl !== undefined && o.volumeOrganicMl < 0.9 * t.organicVolume) {
      reasons.push(`the measured organic volume (${o.volumeOrganicMl.toFixed(0)} mL) is over 10% below the predicted ${t.organicVolume.toFixed(0)} mL`);
    }
    if (reasons.length === 0) continue;
    return [flag("F22", "warning", "Poor phase cut or entrainment", `In ${stepName(ctx, t.step)} ${reasons.join("; ")}: droplets go with the wrong layer (1–5% per separation is common).`,
      "Use a right-sized funnel, let the layers settle longer, back-extract, or centrifuge small volumes.", { step: t.step })];
  }
  return [];
};
