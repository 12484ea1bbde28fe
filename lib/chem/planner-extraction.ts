/**
 * Extraction of the product out of an aqueous phase: the pH to extract at, and how many portions of which
 * volume reach the recovery target (several small portions beat one large one; any textbook treatment of multiple extraction).
 */
import { reagentPh } from "./aqueous";
import { type CompiledReagent } from "./library";
import { fractionExtractedAfter, niceVolume, splitComparison, type SplitOption } from "./planner-math";
import { type Component } from "./schema";
import { isZwitterionic } from "./speciation";

export interface ExtractionPlan {
  solvent: string;
  aqueousMl: number;
  /** pH of the aqueous phase in the procedure as given (null when unknown). */
  procedurePh: number | null;
  /** pH the plan extracts at. */
  pH: number;
  /** Set when the procedure's pH is on the wrong side: adjust to this pH first. */
  adjust: { reagent: string; name: string; targetPh: number } | null;
  /** Distribution ratio of the product at `pH`. */
  distributionRatio: number;
  portions: number;
  volumeMl: number;
  recovery: number;
  /** The plan's total volume split into 1…maxPortions portions. */
  alternatives: SplitOption[];
  reasons: string[];
}

export interface ExtractionContext {
  product: Component;
  productD: (pH: number) => number;
  solvent: string;
  aqueousMl: number;
  procedurePh: number | null;
  /** Total solvent the procedure used for this extraction (portions × volume), mL, and its portions. */
  procedureTotalMl: number;
  procedurePortions: number;
  targetRecovery: number;
  maxPortions: number;
  reagents: ReadonlyMap<string, CompiledReagent>;
}

const pct = (x: number): string => `${(100 * x).toFixed(1)} %`;

/** The pH range in which the product is ≥ 99 % neutral (two units from every pKa), or null. */
export function neutralRange(c: Component): { low: number; high: number } | null {
  const acids = c.pKas.filter((p) => p.kind === "acid").map((p) => p.value);
  const bases = c.pKas.filter((p) => p.kind === "base").map((p) => p.value);
  const low = bases.length > 0 ? Math.max(...bases) + 2 : 0;
  const high = acids.length > 0 ? Math.min(...acids) - 2 : 14;
  return low <= high ? { low, high } : null;
}

function adjustingReagent(ctx: ExtractionContext, targetPh: number, raise: boolean): { key: string; name: string } | null {
  let best: { key: string; name: string; pH: number } | null = null;
  for (const [key, r] of ctx.reagents) {
    if (r.solid || !["acid", "base"].includes(r.props.purpose)) continue;
    const pH = reagentPh(r);
    const fits = raise ? pH > targetPh + 1 : pH < targetPh - 1;
    // The least extreme reagent that still overshoots the target by a unit, so the target is reachable.
    if (fits && (!best || Math.abs(pH - 7) < Math.abs(best.pH - 7))) best = { key, name: r.props.name, pH };
  }
  return best && { key: best.key, name: best.name };
}

export function planExtraction(ctx: ExtractionContext): ExtractionPlan {
  const { product } = ctx;
  const reasons: string[] = [];
  const range = neutralRange(product);
  let pH = ctx.procedurePh ?? (range ? (range.low + range.high) / 2 : 7);
  let adjust: ExtractionPlan["adjust"] = null;
  if (!range) {
    reasons.push(isZwitterionic(product.pKas.map((p) => ({ pKa: p.value, kind: p.kind })))
      ? `${product.key} is zwitterionic: no pH leaves it neutral, so no pH gives a useful D (F18). Consider n-butanol with strong salting out, evaporating the water, or isoelectric precipitation.`
      : `${product.key} has no pH at which every site is two units from its pKa; extract where D is largest.`);
  } else if (pH < range.low || pH > range.high) {
    const raise = pH < range.low;
    const targetPh = raise ? Math.min(13.5, range.low + 0.5) : Math.max(0.5, range.high - 0.5);
    const reagent = adjustingReagent(ctx, targetPh, raise);
    reasons.push(`At the procedure's pH ${ctx.procedurePh?.toFixed(1) ?? "?"} ${product.key} is ${pct(1 - ctx.productD(pH) / Math.max(ctx.productD(targetPh), 1e-300))} less extractable than when neutral; set pH ${raise ? "≥" : "≤"} ${(raise ? range.low : range.high).toFixed(1)} first (two units from its pKa, F3) and check it with paper after mixing.`);
    if (reagent) adjust = { reagent: reagent.key, name: reagent.name, targetPh };
    pH = targetPh;
  }
  const d = ctx.productD(pH);
  const baseTotal = ctx.procedureTotalMl > 0 ? ctx.procedureTotalMl : ctx.aqueousMl;
  let chosen: { total: number; option: SplitOption } | null = null;
  // A procedure that already reaches the target at the planned pH is kept as it is.
  const own = ctx.procedurePortions > 0 ? fractionExtractedAfter(d, ctx.aqueousMl, ctx.procedureTotalMl / ctx.procedurePortions, ctx.procedurePortions) : 0;
  if (own >= ctx.targetRecovery) {
    chosen = { total: ctx.procedureTotalMl, option: { portions: ctx.procedurePortions, volumeMl: ctx.procedureTotalMl / ctx.procedurePortions, recovery: own } };
  }
  for (const factor of [1, 1.5, 2, 3]) {
    if (chosen) break;
    const total = niceVolume(baseTotal * factor);
    const hit = splitComparison(d, ctx.aqueousMl, total, ctx.maxPortions).find((o) => o.recovery >= ctx.targetRecovery);
    if (hit) chosen = { total, option: hit };
  }
  const total = chosen?.total ?? niceVolume(baseTotal * 3);
  const option = chosen?.option ?? { portions: ctx.maxPortions, volumeMl: total / ctx.maxPortions, recovery: fractionExtractedAfter(d, ctx.aqueousMl, total / ctx.maxPortions, ctx.maxPortions) };
  const volumeMl = own >= ctx.targetRecovery ? option.volumeMl : niceVolume(option.volumeMl);
  const recovery = fractionExtractedAfter(d, ctx.aqueousMl, volumeMl, option.portions);
  const alternatives = splitComparison(d, ctx.aqueousMl, volumeMl * option.portions, ctx.maxPortions);
  const one = alternatives[0];
  if (own >= ctx.targetRecovery) reasons.push(`The procedure's ${ctx.procedurePortions} × ${option.volumeMl.toFixed(0)} mL already reaches the target at pH ${pH.toFixed(1)}; keep it.`);
  reasons.push(`Several small portions beat one large one: the fraction left is (1 + D·V/(n·V_aq))^−n, which falls toward exp(−D·V/V_aq) as n grows (§2.3). With D = ${d.toPrecision(3)} and ${ctx.aqueousMl.toFixed(0)} mL of aqueous phase, one portion of ${(volumeMl * option.portions).toFixed(0)} mL recovers ${pct(one?.recovery ?? 0)}${option.portions > 1 ? `; ${option.portions} × ${volumeMl} mL recover ${pct(recovery)}` : `; ${Math.min(3, ctx.maxPortions)} portions of a third of it would recover ${pct(alternatives[Math.min(3, ctx.maxPortions) - 1]?.recovery ?? recovery)}`}.`);
  if (!chosen) {
    reasons.push(`Even ${option.portions} portions of three times the procedure's volume fall short of ${pct(ctx.targetRecovery)} (F5): salt the aqueous phase out (brine or solid NaCl raises log K of neutral species), reduce its volume, or use a more polar solvent (EtOAc, 2-MeTHF, n-BuOH).`);
  }
  return {
    solvent: ctx.solvent, aqueousMl: ctx.aqueousMl, procedurePh: ctx.procedurePh, pH, adjust, distributionRatio: d,
    portions: option.portions, volumeMl, recovery, alternatives, reasons,
  };
}
