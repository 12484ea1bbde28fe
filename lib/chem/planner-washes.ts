/**
 * Acid and base washes of an organic solution: the pH window that removes a group of ionizable impurities
 * while keeping the product, the mildest stock reagent inside it, and the smallest wash that does the job
 * with enough capacity (the two-unit pH rule and the wash-loss formula, common practice; capacity from stoichiometry; F4).
 */
import { reagentPh } from "./aqueous";
import { type CompiledReagent } from "./library";
import { fractionCharged, fractionKeptAfterWashes, niceVolume, reagentCapacity } from "./planner-math";
import { type Component } from "./schema";

export interface PhWindow { low: number; high: number }

export interface WashGroupPlan {
  purpose: "remove_acids" | "remove_bases";
  impurities: string[];
  /** pH range where the reference wash (2 × half the organic volume) meets both targets; null if none. */
  window: PhWindow | null;
  reagent: { key: string; name: string; pH: number } | null;
  volumeMl: number;
  portions: number;
  /** Acid or base one portion takes up before its pH reaches `edgePh`, mmol (0 and NaN without a reagent). */
  capacityMmol: number;
  edgePh: number;
  /** Closed-form estimate at the fresh reagent's pH: fraction of each impurity left in the organic layer. */
  impurityLeft: Record<string, number>;
  /** Fraction of the product the wash keeps in the organic layer (closed form). */
  productKept: number;
  reasons: string[];
}

export interface WashContext {
  product: Component;
  productD: (pH: number) => number;
  organicMl: number;
  maxImpurityLeft: number;
  /** Least fraction of the product this wash may keep. */
  productKeepMin: number;
  maxPortions: number;
  reagents: ReadonlyMap<string, CompiledReagent>;
  /** Temperature the washes run at, °C (a planned wash takes the work-up's): CO₂ solubility sets a carbonate
   * wash's capacity. */
  temperatureC: number;
}

export interface Impurity { component: Component; d: (pH: number) => number }

const pct = (x: number): string => `${(100 * x).toPrecision(x < 0.001 ? 1 : 3)} %`;
const ph = (x: number): string => x.toFixed(1);

/** Stock solutions whose job is to set a pH: acids, bases, buffers, and ammonia/ammonium mixtures. */
function phReagents(reagents: ReadonlyMap<string, CompiledReagent>): PhReagent[] {
  const out: PhReagent[] = [];
  for (const [key, r] of reagents) {
    if (r.solid) continue;
    const systems = Object.keys(r.props.systems);
    const setsPh = ["acid", "base", "buffer"].includes(r.props.purpose) || (systems.length > 0 && systems.every((s) => s === "ammonium"));
    if (setsPh) out.push({ key, r, pH: reagentPh(r) });
  }
  return out;
}

function findWindow(ctx: WashContext, impurities: Impurity[]): PhWindow | null {
  const refMl = ctx.organicMl / 2;
  const kept = (pH: number): number => fractionKeptAfterWashes(ctx.productD(pH), ctx.organicMl, refMl, 2);
  // The product criterion is relative to its best pH: a wash loses some of a neutral product at any pH, and
  // the window is about where ionization makes that loss larger than the allowance.
  let keptBest = 0;
  for (let i = 0; i <= 280; i++) keptBest = Math.max(keptBest, kept(i * 0.05));
  const allowance = 1 - ctx.productKeepMin;
  let best: PhWindow | null = null;
  let start: number | null = null;
  for (let i = 0; i <= 280; i++) {
    const pH = i * 0.05;
    const ok = impurities.every((imp) => fractionKeptAfterWashes(imp.d(pH), ctx.organicMl, refMl, 2) <= ctx.maxImpurityLeft)
      && kept(pH) >= keptBest - allowance;
    if (ok && start === null) start = pH;
    if ((!ok || i === 280) && start !== null) {
      const end = ok ? pH : pH - 0.05;
      if (!best || end - start > best.high - best.low) best = { low: start, high: end };
      start = null;
    }
  }
  return best;
}

function siteText(c: Component, purpose: WashGroupPlan["purpose"]): string {
  const kind = purpose === "remove_acids" ? "acid" : "base";
  const sites = c.pKas.filter((p) => p.kind === kind).map((p) => p.value);
  const key = purpose === "remove_acids" ? Math.max(...sites) : Math.min(...sites);
  return purpose === "remove_acids"
    ? `${c.key} (acid, pKa ${key.toFixed(2)}) is ≥ 99 % ionized at pH ≥ ${ph(key + 2)}, two units above its pKa`
    : `${c.key} (base, pKaH ${key.toFixed(2)}) is ≥ 99 % protonated at pH ≤ ${ph(key - 2)}, two units below its pKaH`;
}

export function planWashGroup(ctx: WashContext, purpose: WashGroupPlan["purpose"], impurities: Impurity[]): WashGroupPlan {
  const keys = impurities.map((i) => i.component.key);
  const reasons = impurities.map((i) => `${siteText(i.component, purpose)} (two pH units past the pKa, common practice).`);
  const window = findWindow(ctx, impurities);
  const empty = { purpose, impurities: keys, window, reagent: null, volumeMl: 0, portions: 0, capacityMmol: 0, edgePh: Number.NaN, impurityLeft: {}, productKept: 1 };
  if (!window) {
    reasons.push(`No pH removes ${keys.join(", ")} to ≤ ${pct(ctx.maxImpurityLeft)} without costing ${ctx.product.key} more than ${pct(1 - ctx.productKeepMin)} beyond what any wash costs: their ionization ranges overlap. Separate them by chromatography or crystallization, or measure their log K to refine this.`);
    return { ...empty, reasons };
  }
  const productLimit = purpose === "remove_acids" ? window.high < 13.95 : window.low > 0.05;
  reasons.push(`Window pH ${ph(window.low)}–${ph(window.high)}: ${purpose === "remove_acids" ? "below" : "above"} it the impurities stay in the organic layer${productLimit ? `; ${purpose === "remove_acids" ? "above" : "below"} it ${ctx.product.key} ionizes and more than ${pct(1 - ctx.productKeepMin)} of it would go into the washes` : `; ${ctx.product.key} stays neutral across it`}.`);

  const inside = phReagents(ctx.reagents).filter((x) => x.pH >= window.low && x.pH <= window.high);
  const sized = inside
    .map((candidate) => ({ candidate, size: sizeWash(ctx, purpose, impurities, window, candidate) }))
    .filter((x): x is { candidate: PhReagent; size: WashSize } => x.size !== null);
  if (sized.length === 0) {
    reasons.push(inside.length === 0
      ? `No stock reagent in the library has a pH inside the window; make a buffer near pH ${ph((window.low + window.high) / 2)} (phosphate near pH 7.2, carbonate near 10.3, ammonium near 9.2).`
      : `No wash of up to ${ctx.maxPortions} portions with a stock reagent in the window reaches both targets; consider a more concentrated reagent or a larger organic volume.`);
    return { ...empty, reasons };
  }
  // Ranking: a pH at least half a unit inside the window (it drifts as the wash is used); a reasonable volume
  // (at most 1.5 times the least any reagent needs); a plain acid, base or buffer before a
  // complexing mixture; then the mildest (pH nearest 7), then the least volume.
  const total = (x: WashSize): number => x.volumeMl * x.portions;
  const least = Math.min(...sized.map((x) => total(x.size)));
  const mildness = (x: PhReagent): number => Math.round(10 * Math.abs(x.pH - 7));
  const rank = (x: { candidate: PhReagent; size: WashSize }): number[] => [
    x.candidate.pH >= window.low + 0.5 && x.candidate.pH <= window.high - 0.5 ? 0 : 1,
    total(x.size) <= 1.5 * least ? 0 : 1,
    ["acid", "base", "buffer"].includes(x.candidate.r.props.purpose) ? 0 : 1,
    mildness(x.candidate),
    total(x.size),
  ];
  const byRank = (a: number[], b: number[]): number => a.reduce((d, v, i) => d || v - (b[i] ?? 0), 0);
  const pickEntry = [...sized].sort((a, b) => byRank(rank(a), rank(b)))[0];
  if (!pickEntry) return { ...empty, reasons };
  const { candidate: pick, size: choice } = pickEntry;
  const milder = sized.filter((x) => mildness(x.candidate) < mildness(pick) && x !== pickEntry);
  reasons.push(`${pick.r.props.name} (pH ${ph(pick.pH)}) is the mildest stock reagent well inside the window that does the job in a modest volume${milder.length > 0 ? ` (milder ones sit at the window's edge or need more: ${milder.map((x) => `${x.candidate.r.props.name} pH ${ph(x.candidate.pH)}, ${total(x.size)} mL`).join("; ")})` : ""}; a stronger one adds nothing and risks hydrolysing labile groups (F16).`);
  reasons.push(`Each ${choice.volumeMl} mL portion takes up ${choice.capacityMmol.toFixed(1)} mmol of ${purpose === "remove_acids" ? "acid" : "base"} before its pH passes ${ph(choice.edge)}${pick.r.hasSystems && (pick.r.props.systems.carbonate ?? 0) > 0 ? ` (CO₂ beyond its solubility at ${ctx.temperatureC} °C leaving the vented funnel)` : ""}, against the ${choice.needMmol.toFixed(2)} mmol the first portion meets (1.2 × the impurity, F4); ${choice.portions} × ${choice.volumeMl} mL is the smallest wash that reaches the target, so the product loses least.`);
  return { purpose, impurities: keys, window, reagent: { key: pick.key, name: pick.r.props.name, pH: pick.pH }, volumeMl: choice.volumeMl, portions: choice.portions, capacityMmol: choice.capacityMmol, edgePh: choice.edge, impurityLeft: choice.left, productKept: choice.kept, reasons };
}

interface PhReagent { key: string; r: CompiledReagent; pH: number }
interface WashSize { volumeMl: number; portions: number; left: Record<string, number>; kept: number; edge: number; capacityMmol: number; needMmol: number }

/** The smallest wash with this reagent that reaches both targets, or null. */
function sizeWash(ctx: WashContext, purpose: WashGroupPlan["purpose"], impurities: Impurity[], window: PhWindow, pick: PhReagent): WashSize | null {
  // Capacity: the first portion meets nearly all of the impurity, so each portion must take it up while its pH
  // stays within one unit of the fresh reagent and inside the window (a larger drift is flag F4).
  const edge = purpose === "remove_acids" ? Math.max(window.low, pick.pH - 1) : Math.min(window.high, pick.pH + 1);
  const perMl = Math.abs(reagentCapacity(pick.r, edge, ctx.temperatureC));
  const needMmol = 1.2 * impurities.reduce((s, i) => s + i.component.amountMmol * fractionCharged(i.component, pick.pH), 0);
  const minPortionMl = perMl > 0 ? needMmol / perMl : Infinity;
  let choice: WashSize | null = null;
  for (const f of [0.25, 0.5, 1]) {
    const volumeMl = niceVolume(Math.max(ctx.organicMl * f, minPortionMl));
    if (volumeMl > 2 * ctx.organicMl) continue;
    for (let portions = 1; portions <= ctx.maxPortions; portions++) {
      const left = Object.fromEntries(impurities.map((i) => [i.component.key, fractionKeptAfterWashes(i.d(pick.pH), ctx.organicMl, volumeMl, portions)]));
      const kept = fractionKeptAfterWashes(ctx.productD(pick.pH), ctx.organicMl, volumeMl, portions);
      if (Object.values(left).some((x) => x > ctx.maxImpurityLeft) || kept < ctx.productKeepMin) continue;
      const better = !choice || volumeMl * portions < choice.volumeMl * choice.portions
        || (volumeMl * portions === choice.volumeMl * choice.portions && portions > choice.portions);
      if (better) choice = { volumeMl, portions, left, kept, edge, capacityMmol: perMl * volumeMl, needMmol };
    }
  }
  return choice;
}
