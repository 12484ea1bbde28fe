/** pH-driven failure modes: F1, F2, F3, F4, F16, F18. */
import { logDistributionRatio, isZwitterionic, type IonizableSite } from "../speciation";
import { solventLogK } from "../partition";
import { describeWindow, effectivePh, flag, insideWindow, isoelectricWindow, pct, ph, productInfo, stepName, type Rule } from "./context";

/** F1/F2: a wash on the wrong side of the product's pKa, with > 5 % cumulative predicted loss. */
export const washNearPka: Rule = (ctx) => {
  const p = productInfo(ctx);
  if (!p || p.startMmol <= 0) return [];
  const out = [];
  const window = isoelectricWindow(p);
  for (const [code, pKa, acid] of [["F1", p.acidPka, true], ["F2", p.basePka, false]] as const) {
    if (pKa === null) continue;
    const hits = ctx.contacts.filter((t) => t.keep === "organic" && t.twoPhase && t.opType !== "extract"
      && (acid ? effectivePh(ctx, t) >= pKa - 1.5 : effectivePh(ctx, t) <= pKa + 1.5));
    const loss = hits.reduce((s, t) => s + (t.lost[p.index] as number), 0) / p.startMmol;
    const first = hits[0];
    if (!first || loss <= 0.05) continue;
    out.push(flag(code, loss > 0.3 ? "danger" : "warning",
      acid ? "Basic wash too close to the product's acidic pKa" : "Acidic wash too close to the product's basic pKa",
      `In ${stepName(ctx, first.step)} the aqueous layer is at pH ${ph(effectivePh(ctx, first))}, ${acid ? "above" : "below"} ${pKa - (acid ? 1.5 : -1.5)} ` +
      `(pKa${acid ? "" : "H"} ${pKa.toFixed(1)}), so part of ${p.component.name} is ${acid ? "deprotonated" : "protonated"} and leaves with the washes: about ${pct(loss)} predicted lost.`,
      // An ampholyte is recovered in its isoelectric window: acidifying it far below its acidic pKa, or basifying far
      // above its basic pKaH, only charges its other site.
      window ? `Use a milder wash (its pH nearer ${describeWindow(window)}), fewer or smaller washes, or bring the combined washes to ${describeWindow(window)} and back-extract them.`
        : acid ? "Use a weaker or buffered base (bicarbonate rather than hydroxide), fewer or smaller washes, or acidify the combined washes and back-extract them."
        : "Skip the strong-acid wash or use a milder one; basify the combined acid washes to pH ≥ pKaH + 2 and re-extract them.",
      { step: first.step, component: p.component.key }));
  }
  return out;
};

/** F3: extraction of the product into the organic layer at a pH where it is ionized. */
export const extractionWrongPh: Rule = (ctx) => {
  const p = productInfo(ctx);
  if (!p) return [];
  const window = isoelectricWindow(p);
  const wrong = (pH: number) => (window ? !insideWindow(window, pH)
    : (p.acidPka !== null && pH > p.acidPka - 2) || (p.basePka !== null && pH < p.basePka + 2));
  const t = ctx.contacts.find((c) => c.opType === "extract" && c.keep === "organic" && c.twoPhase && wrong(effectivePh(ctx, c)));
  if (!t) return [];
  const pH = effectivePh(ctx, t);
  const acid = p.acidPka !== null && pH > p.acidPka - 2;
  const neutral = t.fractionNeutral[p.index] as number;
  const sites = window ? `pKa ${(p.acidPka ?? 0).toFixed(1)} and pKaH ${(p.basePka ?? 0).toFixed(1)}` : `pKa${acid ? "" : "H"} ${(acid ? p.acidPka : p.basePka)?.toFixed(1)}`;
  const target = window ? describeWindow(window) : `pH ${acid ? `≤ ${((p.acidPka ?? 0) - 2).toFixed(1)}` : `≥ ${((p.basePka ?? 0) + 2).toFixed(1)}`}`;
  return [flag("F3", neutral < 0.5 ? "danger" : "warning", "Extraction at the wrong pH",
    `In ${stepName(ctx, t.step)} the aqueous layer is at pH ${ph(pH)}; ${p.component.name} (${sites}) is only ${pct(neutral)} neutral there, so it stays in water.`,
    `Bring the aqueous layer to ${target} and check it with paper or a meter after mixing (reaction salts buffer), then re-extract.` +
      (window ? " Further from that window either site charges: acid makes it a cation, base an anion." : ""),
    { step: t.step, component: p.component.key })];
};

/** F4: the wash or pH adjustment ran out of acid or base. */
export const capacity: Rule = (ctx) => {
  const out = [];
  const t = ctx.contacts.find((c) => c.capacityExceeded);
  if (t) {
    out.push(flag("F4", "warning", "Not enough acid or base in the wash",
      `The reagent in ${stepName(ctx, t.step)} starts at pH ${ph(t.reagentPh)} but ends at pH ${ph(t.pH)} after meeting the mixture: its capacity is used up, so acids or bases it was meant to remove are only partly removed.`,
      "Use more portions, a larger volume or a stronger reagent, and check the pH of every aqueous output.", { step: t.step }));
  }
  for (const s of ctx.steps) {
    if (s.type === "adjust_ph" && s.details.wrongDirection === true) out.push(wrongDirection(ctx, s.index, s.details));
    if (s.type === "adjust_ph" && s.details.targetReached === false) {
      out.push(flag("F4", "warning", "Target pH not reached",
        `The reagent in ${stepName(ctx, s.index)} cannot bring the aqueous layer to the target pH, even in large volume.`,
        "Choose a stronger acid or base for the adjustment.", { step: s.index }));
    }
  }
  return out;
};

/** An adjust_ph whose reagent moves the pH away from its target: nothing is added, and the chemist is told why. */
function wrongDirection(ctx: Parameters<Rule>[0], step: number, details: Record<string, number | string | boolean>) {
  const op = ctx.input.operations[step - 1];
  const start = Number(details.startPh);
  const target = op?.type === "adjust_ph" ? (op.targetPh ?? Number.NaN) : Number.NaN;
  const above = start > target;
  return flag("F4", "warning", "pH adjustment goes the wrong way",
    `In ${stepName(ctx, step)} the aqueous layer is at pH ${ph(start)}, ${above ? "above" : "below"} the target pH ${ph(target)}, and the reagent ${above ? "raises" : "lowers"} the pH further: ` +
      "it cannot reach the target, so none was added in the prediction.",
    `To bring the layer to pH ${ph(target)} use ${above ? "an acid (e.g. 1 M HCl or 10% citric acid)" : "a base (e.g. saturated NaHCO₃ or 1 M NaOH)"}; ` +
      `if the target was meant as a bound (pH ${above ? "≥" : "≤"} ${ph(target)}), the layer already meets it and the step can go.`,
    { step });
}

/** F16: acid- or base-labile product meeting pH ≤ 2 or ≥ 12. */
export const degradation: Rule = (ctx) => {
  const p = productInfo(ctx);
  if (!p || p.component.labile.length === 0) return [];
  const t = ctx.contacts.find((c) => (p.component.labile.includes("base") && effectivePh(ctx, c) >= 12)
    || (p.component.labile.includes("acid") && effectivePh(ctx, c) <= 2));
  if (!t) return [];
  const base = effectivePh(ctx, t) >= 12;
  return [flag("F16", "warning", "Product may degrade under the wash conditions",
    `${p.component.name} is marked ${base ? "base" : "acid"}-labile and meets pH ${ph(effectivePh(ctx, t))} in ${stepName(ctx, t.step)}.`,
    "Use buffered or milder washes (bicarbonate, citric acid, NH₄Cl, phosphate), keep them cold and the contact short.",
    { step: t.step, component: p.component.key })];
};

/** F18: zwitterionic or very polar product: log D < 0.5 at every pH in the extraction solvent. */
export const polarProduct: Rule = (ctx) => {
  const p = productInfo(ctx);
  if (!p) return [];
  const sites: IonizableSite[] = p.component.pKas.map((x) => ({ pKa: x.value, kind: x.kind }));
  const solventKey = ctx.input.operations.find((o) => o.type === "extract")?.type === "extract"
    ? (ctx.input.operations.find((o) => o.type === "extract") as { solvent: string }).solvent
    : ctx.input.mixture.solvents.find((s) => !ctx.library.solvents[s.solvent]?.waterMiscible && s.solvent !== "water")?.solvent;
  const solvent = solventKey ? ctx.library.solvents[solventKey] : undefined;
  if (!solvent || solvent.waterMiscible) return [];
  const k = solventLogK(p.component, solvent, ctx.library.solvents);
  if (!k) return [];
  let best = -Infinity;
  for (let x = 0; x <= 14; x += 0.25) best = Math.max(best, logDistributionRatio(x, sites, k.value, undefined, p.component.fixedCharge));
  const zwitterion = isZwitterionic(sites);
  if (best >= 0.5 && !zwitterion) return [];
  return [flag("F18", "warning", zwitterion ? "Zwitterionic product" : "Very polar product",
    `${p.component.name} ${zwitterion ? "is a zwitterion (its acidic pKa lies below its basic pKaH), so it is charged at every pH" : "is polar"}; ` +
    `the best predicted log D into ${solvent.name} at any pH is ${best.toFixed(1)}. Adjusting the pH will not extract it well.`,
    "Use n-butanol or 2-MeTHF with strong salting out (sulfate, carbonate), evaporate the water, capture on a resin, or isolate by isoelectric precipitation.",
    { component: p.component.key })];
};
