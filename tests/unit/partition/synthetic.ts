// Synthetic workups for the partition tests: a neutral product extracted from water into EtOAc, dried and
// concentrated, simulated by the engine at a known log K. The product is invented (molar mass and log P are
// placeholders; the stated log K is what the tests control).
import { withLogK } from "@/lib/chem/fit";
import { simulateWorkup, validateWorkup } from "@/lib/chem/predict";
import { type WorkupInput } from "@/lib/chem/schema";

export const PRODUCT = "product";

/** Aqueous volume, EtOAc volume per portion, portions: designs whose recoveries fall in the informative range. */
export const DESIGNS: readonly (readonly [number, number, number])[] = [[60, 10, 2], [40, 8, 1], [80, 15, 2], [50, 6, 3]];

export function extraction(aqueousMl: number, organicMl: number, portions: number): WorkupInput {
  const checked = validateWorkup({
    components: [{ key: PRODUCT, name: "Test product", role: "product", molarMass: 180, amount: { value: 5, unit: "mmol" }, logP: { value: 1.2, provenance: "literature" } }],
    mixture: { solvents: [{ solvent: "water", volume: { value: aqueousMl, unit: "mL" } }] },
    operations: [
      { type: "extract", solvent: "etoac", volume: { value: organicMl, unit: "mL" }, portions, keep: "organic" },
      { type: "dry", agent: "na2so4", mass: { value: 3, unit: "g" } },
      { type: "concentrate", method: "rotavap" },
    ],
  });
  if (!checked.success) throw new Error(JSON.stringify(checked.issues));
  return checked.data;
}

/** The engine's recovery of the product from `spec` if its log K in EtOAc were `logK`. */
export function recoveryAt(spec: WorkupInput, logK: number): number {
  return simulateWorkup(withLogK(spec, PRODUCT, "etoac", logK), { steps: false, flags: false }).recovery[PRODUCT] ?? NaN;
}
