/** Small builders for work-up inputs used across the chem tests. Literature values carry their source. */
import { type WorkupInputRaw } from "@/lib/chem/schema";

type ComponentRaw = WorkupInputRaw["components"][number];
type OperationRaw = WorkupInputRaw["operations"][number];

export const mL = (value: number) => ({ value, unit: "mL" as const });
export const mmol = (value: number) => ({ value, unit: "mmol" as const });

export function neutral(key: string, logP: number, extra: Partial<ComponentRaw> = {}): ComponentRaw {
  return { key, name: key, role: "product", molarMass: 200, amount: mmol(5), logP: { value: logP, provenance: "literature" }, ...extra };
}

/** Naphthalene: log P 3.34 (CRC logP table), neutral. */
export const naphthalene = (role: ComponentRaw["role"] = "product"): ComponentRaw =>
  ({ key: "naphthalene", name: "Naphthalene", role, molarMass: 128.17, amount: mmol(5), logP: { value: 3.34, provenance: "literature", source: "CRC-logP" } });
/** Benzoic acid: log P 1.88 (CRC logP table), pKa 4.204 (IUPAC digitized dataset, Reliable). */
export const benzoicAcid = (role: ComponentRaw["role"] = "impurity"): ComponentRaw =>
  ({ key: "benzoic", name: "Benzoic acid", role, molarMass: 122.12, amount: mmol(5), logP: { value: 1.88, provenance: "literature" }, pKas: [{ value: 4.204, kind: "acid", provenance: "literature" }] });
/** Lidocaine: log P 2.44 (PhysProp), pKaH 7.9 (M. H. Bekhit, "Lidocaine for neural blockade", Cambridge University Press). */
export const lidocaine = (role: ComponentRaw["role"] = "impurity"): ComponentRaw =>
  ({ key: "lidocaine", name: "Lidocaine", role, molarMass: 234.34, amount: mmol(5), logP: { value: 2.44, provenance: "literature" }, pKas: [{ value: 7.9, kind: "base", provenance: "literature" }] });
/** Glycine: log P −3.21 (PhysProp), pKa 2.350 and 9.780 (IUPAC dataset). */
export const glycine = (role: ComponentRaw["role"] = "product"): ComponentRaw =>
  ({ key: "glycine", name: "Glycine", role, molarMass: 75.07, amount: mmol(2), logP: { value: -3.21, provenance: "literature" },
    pKas: [{ value: 2.35, kind: "acid", provenance: "literature" }, { value: 9.78, kind: "base", provenance: "literature" }] });
/** Trifluoroacetic acid: pKa ≈0.5 and log P ≈0.5 (from memory). */
export const tfa = (amount: number): ComponentRaw =>
  ({ key: "tfa", name: "Trifluoroacetic acid", role: "reagent", molarMass: 114.02, amount: mmol(amount), logP: { value: 0.5, provenance: "estimated" }, pKas: [{ value: 0.5, kind: "acid", provenance: "estimated" }] });

export function workup(components: ComponentRaw[], solvents: [string, number][], operations: OperationRaw[], extra: Partial<WorkupInputRaw> = {}): WorkupInputRaw {
  return { components, mixture: { solvents: solvents.map(([solvent, v]) => ({ solvent, volume: mL(v) })) }, operations, ...extra };
}

export const wash = (reagent: string, v: number, portions = 1, extra: Partial<Extract<OperationRaw, { type: "wash" }>> = {}): OperationRaw =>
  ({ type: "wash", reagent, volume: mL(v), portions, ...extra });
export const extract = (solvent: string, v: number, portions = 1, extra: Partial<Extract<OperationRaw, { type: "extract" }>> = {}): OperationRaw =>
  ({ type: "extract", solvent, volume: mL(v), portions, ...extra });
