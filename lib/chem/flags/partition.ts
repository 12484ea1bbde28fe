/** Partition and solvent failure modes: F5, F6, F7, F8, F24, F25. */
import { solventLogK } from "../partition";
import { flag, pct, productInfo, stepName, type Rule } from "./context";

/** F5: low intrinsic K and too few extractions (recovery < 95 % or a stage with E < 3). */
export const tooFewExtractions: Rule = (ctx) => {
  const p = productInfo(ctx);
  if (!p) return [];
  for (const s of ctx.steps) {
    if (s.type !== "extract" || s.contactCount === 0) continue;
    const ts = ctx.contacts.slice(s.firstContact, s.firstContact + s.contactCount);
    if (ts[0]?.keep !== "organic") continue;
    let left = 1, minE = Infinity;
    for (const t of ts) {
      left *= t.fractionAqueous[p.index] as number;
      minE = Math.min(minE, ((t.distribution[p.index] as number) * t.organicVolume) / Math.max(t.aqueousVolume, 1e-12));
    }
    const neutral = (ts[0]?.fractionNeutral[p.index] as number) >= 0.5;
    if (neutral && (left > 0.05 || minE < 3)) {
      return [flag("F5", left > 0.2 ? "danger" : "warning", "Too few extractions for a low partition coefficient",
        `In ${stepName(ctx, s.index)} the extraction factor E = D·V_org/V_aq is ${minE.toFixed(1)} per portion and ${pct(left)} of ${p.component.name} is predicted to stay in the aqueous layer.`,
        "Use more portions, a smaller aqueous volume, salting out (brine or solid NaCl), or a more polar solvent (EtOAc, 2-MeTHF, n-BuOH).",
        { step: s.index, component: p.component.key })];
    }
  }
  return [];
};

/** F6: washes remove > 5 % of a neutral, moderately polar product. */
export const overWashing: Rule = (ctx) => {
  const p = productInfo(ctx);
  if (!p || p.startMmol <= 0) return [];
  const hits = ctx.contacts.filter((t) => t.keep === "organic" && t.opType !== "extract" && t.twoPhase
    && (t.fractionNeutral[p.index] as number) >= 0.5);
  const loss = hits.reduce((s, t) => s + (t.lost[p.index] as number), 0) / p.startMmol;
  const first = hits.find((t) => (t.lost[p.index] as number) > 0);
  if (loss <= 0.05 || !first) return [];
  return [flag("F6", loss > 0.2 ? "danger" : "warning", "Over-washing a moderately polar product",
    `The aqueous washes are predicted to take ${pct(loss)} of ${p.component.name} with them (D ≈ ${(first.distribution[p.index] as number).toPrecision(2)} in ${stepName(ctx, first.step)}).`,
    "Use fewer or smaller washes, brine instead of water, or back-extract the combined washes with fresh solvent.",
    { step: first.step, component: p.component.key })];
};

/** Water-miscible solvents counted by F7 (dipolar aprotic solvents are F8's). */
export const F7_THRESHOLD = 0.15;

export const cosolventNotRemoved: Rule = (ctx) => {
  const t = ctx.contacts.find((c) => c.keep !== null);
  if (!t || t.cosolventShare <= F7_THRESHOLD) return [];
  return [flag("F7", t.cosolventShare > 0.4 ? "danger" : "warning", "Water-miscible reaction solvent not removed",
    `At the first separation (${stepName(ctx, t.step)}) water-miscible solvent is ${pct(t.cosolventShare)} of the liquid: it lowers partition coefficients, drags product and extraction solvent into water and invites emulsions${t.cosolventShare > 0.4 ? "; the layers may not separate at all" : ""}.`,
    "Evaporate it first (not practical for dioxane), dilute heavily, or add brine or solid salt to force a clean split.", { step: t.step })];
};

/** F8: DMF/DMSO/NMP/DMAc left in the crude above 5 % of the expected product mass. */
export const dipolarCarried: Rule = (ctx) => {
  const p = productInfo(ctx);
  const expectedMg = p ? p.startMmol * p.component.molarMass : 0;
  let mg = 0;
  const names: string[] = [];
  for (const [k, v] of Object.entries(ctx.residualSolventsMg)) {
    if (ctx.library.solvents[k]?.dipolarAprotic) { mg += v; names.push(ctx.library.solvents[k]?.name ?? k); }
  }
  if (mg <= 0 || mg <= 0.05 * expectedMg) return [];
  return [flag("F8", "warning", "High-boiling polar solvent carried into the crude",
    `About ${mg.toFixed(0)} mg of ${names.join(" and ")} is predicted in the crude (${expectedMg > 0 ? pct(mg / expectedMg) : "large"} of the expected product mass), inflating crude mass and apparent yield.`,
    "Use more or larger water washes (5% LiCl washes are common for DMF), a less polar extraction solvent, or remove it azeotropically.")];
};

/** F24: 2-MeTHF separated cold (inverse solubility), or ether/DCM separated warm. */
export const temperatureSensitive: Rule = (ctx) => {
  for (const t of ctx.contacts) {
    if (!t.twoPhase) continue;
    const warm = t.temperatureC + t.temperatureRiseK;
    if (t.organicSolvents.includes("2-methf") && t.temperatureC < 15) {
      return [flag("F24", "warning", "2-MeTHF separated cold",
        `${stepName(ctx, t.step)} runs at ${t.temperatureC.toFixed(0)} °C; 2-MeTHF dissolves more in cold water (about 21 wt% at 0 °C against 11 wt% at 30 °C), taking product with it.`,
        "Separate at room temperature, or add salt to the aqueous layer.", { step: t.step })];
    }
    const low = t.organicSolvents.find((k) => (ctx.library.solvents[k]?.bpC.value ?? 999) < 45);
    if (low && warm > 30) {
      return [flag("F24", "warning", "Warm separation with a low-boiling solvent",
        `${stepName(ctx, t.step)} reaches about ${warm.toFixed(0)} °C with ${ctx.library.solvents[low]?.name ?? low} in the funnel: vapour pressure builds up and more solvent is lost.`,
        "Cool the mixture before stoppering and shaking, and vent often.", { step: t.step })];
    }
  }
  return [];
};

const ALTERNATIVES = ["etoac", "2-methf", "dcm", "nbuoh"];

/** F25: extraction solvent too non-polar: K < 3 while a common alternative is predicted > 10. */
export const solventTooNonPolar: Rule = (ctx) => {
  const p = productInfo(ctx);
  if (!p) return [];
  for (const op of ctx.input.operations) {
    if (op.type !== "extract" || op.keep !== "organic") continue;
    const s = ctx.library.solvents[op.solvent];
    const k = s ? solventLogK(p.component, s, ctx.library.solvents) : null;
    if (!s || !k || k.value >= Math.log10(3)) continue;
    const better = ALTERNATIVES.map((a) => ({ a, s: ctx.library.solvents[a] }))
      .map(({ a, s: alt }) => ({ a, name: alt?.name ?? a, k: alt ? solventLogK(p.component, alt, ctx.library.solvents)?.value ?? -Infinity : -Infinity }))
      .filter((x) => x.a !== op.solvent && x.k > 1);
    if (better.length === 0) continue;
    return [flag("F25", "warning", "Extraction solvent too non-polar for the product",
      `${p.component.name} is predicted at K ≈ ${(10 ** k.value).toPrecision(2)} in ${s.name}, but above 10 in ${better.map((b) => b.name).join(", ")}.`,
      "Change the extraction solvent, weighing the health, safety and environmental rankings of solvent selection guides.",
      { component: p.component.key })];
  }
  return [];
};
