/**
 * Washing an aqueous solution of an ionized product with organic solvent (the middle leg of a pH swing): how many
 * portions carry the neutral impurities away while the product stays in the water. Uses the distribution ratios
 * the simulator computed at that contact, so co-solvent and salt effects are included.
 */
import { SOLVENTS } from "./data/solvents";
import { type Operation } from "./schema";
import { type StepResult } from "./types";

export interface AqueousWashPlan {
  /** 1-based step of the input. */
  step: number;
  solvent: string;
  volumeMl: number;
  portions: number;
  procedurePortions: number;
  /** Fraction of each impurity the plan leaves in the water. */
  impurityLeft: Record<string, number>;
  /** Fraction of the product the plan keeps in the water. */
  productKept: number;
  reasons: string[];
}

const pct = (x: number): string => `${(100 * x).toFixed(x < 0.01 ? 2 : 1)} %`;

export function planAqueousWash(op: Extract<Operation, { type: "extract" }>, step: StepResult, product: string,
  impurities: string[], maxLeft: number, productKeepMin: number, maxPortions: number): AqueousWashPlan | null {
  const contact = step.contacts[0];
  const aqueous = contact?.phases.find((p) => p.kind === "aqueous");
  const d = contact?.phases.find((p) => p.distributionRatio)?.distributionRatio;
  if (!aqueous || !d) return null;
  const ratio = op.volumeMl / aqueous.volumeMl;
  const leftPerPortion = (key: string): number => 1 / (1 + (d[key] ?? 0) * ratio);
  const movable = impurities.filter((k) => (d[k] ?? 0) * ratio > 0.05);
  if (movable.length === 0) return null;
  const productPer = leftPerPortion(product);
  let portions = op.portions;
  for (let n = 1; n <= maxPortions; n++) {
    if (productPer ** n < productKeepMin) break;
    portions = n;
    if (movable.every((k) => leftPerPortion(k) ** n <= maxLeft)) break;
  }
  portions = Math.max(portions, op.portions);
  const impurityLeft = Object.fromEntries(movable.map((k) => [k, leftPerPortion(k) ** portions]));
  const reasons = [
    `At pH ${aqueous.pH?.toFixed(1) ?? "?"} ${product} stays in the water (D = ${(d[product] ?? 0).toPrecision(2)}), while ${movable.map((k) => `${k} (D = ${(d[k] ?? 0).toPrecision(2)})`).join(", ")} ${movable.length > 1 ? "move" : "moves"} into ${op.solvent}: each ${op.volumeMl} mL portion leaves 1/(1 + D·V/V_aq) of ${movable.length > 1 ? "them" : "it"} behind (§2.3).`,
    `${portions} portion${portions > 1 ? "s" : ""} leave ${movable.map((k) => `${pct(impurityLeft[k] ?? 0)} of ${k}`).join(", ")}, keeping ${pct(productPer ** portions)} of the product in the water.`,
  ];
  const cosolvent = Object.entries(aqueous.solventsMl).find(([k, ml]) => SOLVENTS[k]?.waterMiscible && k !== "water" && ml / aqueous.volumeMl > 0.05);
  if (cosolvent) {
    reasons.push(`${SOLVENTS[cosolvent[0]]?.name ?? cosolvent[0]} left in the water (${pct(cosolvent[1] / aqueous.volumeMl)} by volume) lowers every D here (cosolvency, F7); evaporating it first would need fewer portions.`);
  }
  return { step: step.index, solvent: op.solvent, volumeMl: op.volumeMl, portions, procedurePortions: op.portions, impurityLeft, productKept: productPer ** portions, reasons };
}
