/**
 * Aqueous reagents for washes, quenches and pH adjustment, each defined by its composition in mol/L of species
 * the pH solver knows: strong ions (fully dissociated) and weak acid–base systems (carbonate, phosphate, …).
 * Strong-ion composition follows the charge-balance view: NaOH is Na⁺ alone, HCl is Cl⁻ alone; the solver
 * supplies OH⁻ and H⁺. Solids (for add_salt) give the species per formula unit. JSON-serializable; the app stores
 * a group-editable copy and predictWorkup accepts overrides.
 */
import { type Sourced, type Confidence } from "./sources";

export const STRONG_ION_CHARGE = { Na: 1, K: 1, Li: 1, Cl: -1, Br: -1, NO3: -1, S2O3: -2 } as const;
export type StrongIon = keyof typeof STRONG_ION_CHARGE;

export interface AcidSystemProps {
  name: string;
  /** Successive pKa values at 25 °C, infinite dilution. */
  pKas: Sourced[];
  /** Charge of the fully protonated form (H₂CO₃ 0, NH₄⁺ +1, HSO₄⁻ −1, Cu(H₂O)₆²⁺ +2). */
  z0: number;
}

const k = (value: number, source: string, confidence: Confidence): Sourced => ({ value, source, confidence, tempC: 25 });

export const ACID_SYSTEMS = {
  carbonate: { name: "Carbonic acid / bicarbonate / carbonate", z0: 0, pKas: [k(6.35, "acid-table", "confirmed"), k(10.33, "acid-table", "confirmed")] },
  phosphate: { name: "Phosphoric acid", z0: 0, pKas: [k(2.148, "K&L", "confirmed"), k(7.198, "K&L", "confirmed"), k(12.375, "K&L", "confirmed")] },
  citrate: { name: "Citric acid", z0: 0, pKas: [k(3.13, "acid-table", "confirmed"), k(4.76, "acid-table", "confirmed"), k(6.4, "acid-table", "confirmed")] },
  ammonium: { name: "Ammonium / ammonia", z0: 1, pKas: [k(9.244, "LT-E5", "confirmed")] },
  sulfate: { name: "Hydrogen sulfate / sulfate", z0: -1, pKas: [k(1.99, "memory", "memory")] },
  acetate: { name: "Acetic acid", z0: 0, pKas: [k(4.757, "LT-E5", "confirmed")] },
  fluoride: { name: "Hydrofluoric acid", z0: 0, pKas: [k(3.17, "memory", "memory")] },
  tartrate: { name: "Tartaric acid", z0: 0, pKas: [k(3.04, "memory", "memory"), k(4.37, "memory", "memory")] },
  // First hydrolysis constant of Cu(H₂O)₆²⁺ (memory, ~7.5); gives the acidity of copper sulfate washes.
  copper: { name: "Hexaaquacopper(II)", z0: 2, pKas: [k(7.5, "memory", "memory")] },
} as const satisfies Record<string, AcidSystemProps>;
export type AcidSystem = keyof typeof ACID_SYSTEMS;

export type ReagentPurpose = "acid" | "base" | "buffer" | "neutral" | "salt" | "reducing" | "complexing";

export interface ReagentProps {
  key: string;
  name: string;
  kind: "solution" | "solid";
  purpose: ReagentPurpose;
  /** Solutions: density of the solution, g/mL. */
  density: Sourced | null;
  /** Solutions: the defining concentration (mol/L of the named solute) with its source. Solids: molar mass (g/mol). */
  basis: Sourced;
  /** mol/L in a solution, or mol per mol of solid. */
  ions: Partial<Record<StrongIon, number>>;
  systems: Partial<Record<AcidSystem, number>>;
  /** Solids: solubility in g per 100 g water (for "saturate"). */
  solubilityGPer100g?: Sourced;
  note?: string;
}

const src = (value: number, source: string, confidence: Confidence, tempC = 20): Sourced => ({ value, source, confidence, tempC });

function solution(key: string, name: string, purpose: ReagentPurpose, c: Sourced, density: Sourced,
  per: { ions?: Partial<Record<StrongIon, number>>; systems?: Partial<Record<AcidSystem, number>> }, note?: string): ReagentProps {
  const scale = <T extends string>(o: Partial<Record<T, number>> | undefined) =>
    Object.fromEntries(Object.entries(o ?? {}).map(([kk, v]) => [kk, (v as number) * c.value])) as Partial<Record<T, number>>;
  return { key, name, kind: "solution", purpose, density, basis: c, ions: scale(per.ions), systems: scale(per.systems), ...(note ? { note } : {}) };
}

const list: ReagentProps[] = [
  solution("water", "Water", "neutral", src(0, "derived", "derived"), src(0.9982, "water-dens", "secondary"), {}),
  // Saturated NaCl: 6.136 mol/kg at 20 °C (CRC-salts) → 26.40 wt%; density and molarity extrapolated from the
  // 25 and 26 wt% rows of the CRC concentrative table (derived): 1.200 g/mL, 5.42 mol/L.
  solution("brine", "Brine (saturated NaCl)", "salt", src(5.42, "CRC-salts", "derived"), src(1.2, "CRC-conc", "derived"), { ions: { Na: 1, Cl: 1 } }),
  solution("brine_half", "Half-saturated brine", "salt", src(2.71, "derived", "derived"), src(1.099, "derived", "derived"), { ions: { Na: 1, Cl: 1 } }),
  // NaHCO₃ 9.6 g/100 g water at 20 °C (chemister) → 8.8 wt%; density ≈1.06 extrapolated from CRC 6 wt% 1.0408 (derived) → 1.11 M.
  solution("nahco3_sat", "Saturated NaHCO₃", "base", src(1.11, "chemister", "derived"), src(1.06, "CRC-conc", "derived"), { ions: { Na: 1 }, systems: { carbonate: 1 } }),
  solution("nahco3_5pct", "5% NaHCO₃", "base", src(0.62, "derived", "derived"), src(1.035, "memory", "memory"), { ions: { Na: 1 }, systems: { carbonate: 1 } }),
  // Na₂CO₃ 21.8 g/100 g water at 20 °C (chemister) → 17.9 wt%; density ≈1.19 extrapolated from CRC 15 wt% 1.1574 → 2.0 M (derived).
  solution("na2co3_sat", "Saturated Na₂CO₃", "base", src(2.0, "chemister", "derived"), src(1.19, "CRC-conc", "derived"), { ions: { Na: 2 }, systems: { carbonate: 1 } }),
  solution("na2co3_1m", "1 M Na₂CO₃", "base", src(1.0, "derived", "derived"), src(1.10, "memory", "memory"), { ions: { Na: 2 }, systems: { carbonate: 1 } }),
  // Saturated K₂CO₃: 7.948 mol/kg at 20 °C (CRC-salts) → 52.3 wt%; density from the CRC concentrative table
  // extended past its last row (50 wt%, 1.5404) at constant apparent molar volume: 1.58 g/mL, 5.99 mol/L (derived;
  // salt-solutions.ts).
  solution("k2co3_sat", "Saturated K₂CO₃", "base", src(5.99, "CRC-salts", "derived"), src(1.58, "CRC-conc", "derived"), { ions: { K: 2 }, systems: { carbonate: 1 } }),
  // 1 M NaOH ≈ 4 wt%: CRC lists 4 wt% = 1.043 M, 1.0428 g/mL (CRC-conc).
  solution("naoh_1m", "1 M NaOH", "base", src(1.0, "CRC-conc", "confirmed"), src(1.041, "CRC-conc", "derived"), { ions: { Na: 1 } }),
  solution("naoh_10pct", "10% NaOH", "base", src(2.77, "memory", "memory"), src(1.109, "memory", "memory"), { ions: { Na: 1 } }),
  solution("koh_1m", "1 M KOH", "base", src(1.0, "derived", "derived"), src(1.05, "memory", "memory"), { ions: { K: 1 } }),
  solution("lioh_1m", "1 M LiOH", "base", src(1.0, "derived", "derived"), src(1.03, "memory", "memory"), { ions: { Li: 1 } }),
  // 1 M HCl ≈ 3.6 wt% (CRC lists 3 wt% = 0.833 M and 4 wt% = 1.117 M); density 1.02 (from memory).
  solution("hcl_1m", "1 M HCl", "acid", src(1.0, "CRC-conc", "confirmed"), src(1.017, "memory", "memory"), { ions: { Cl: 1 } }),
  solution("hcl_2m", "2 M HCl", "acid", src(2.0, "derived", "derived"), src(1.034, "memory", "memory"), { ions: { Cl: 1 } }),
  solution("hcl_3m", "3 M HCl", "acid", src(3.0, "derived", "derived"), src(1.043, "S3b", "confirmed"), { ions: { Cl: 1 } }),
  solution("hcl_6m", "6 M HCl", "acid", src(6.0, "derived", "derived"), src(1.10, "memory", "memory"), { ions: { Cl: 1 } }),
  // H₂SO₄'s first proton is strong; KHSO₄ is K⁺ + HSO₄⁻ (pKa 1.99, memory).
  solution("khso4_1m", "1 M KHSO₄", "acid", src(1.0, "derived", "derived"), src(1.07, "memory", "memory"), { ions: { K: 1 }, systems: { sulfate: 1 } }),
  solution("nahso4_1m", "1 M NaHSO₄", "acid", src(1.0, "derived", "derived"), src(1.07, "memory", "memory"), { ions: { Na: 1 }, systems: { sulfate: 1 } }),
  // 10 wt% citric acid: 0.541 M, 1.0402 g/mL at 20 °C (CRC-conc).
  solution("citric_10pct", "10% citric acid", "acid", src(0.541, "CRC-conc", "confirmed"), src(1.0402, "CRC-conc", "confirmed"), { systems: { citrate: 1 } }),
  // Saturated NH₄Cl: 6.943 mol/kg at 20 °C (CRC-salts) → 27.1 wt%, 1.076 g/mL, 5.45 M (derived, CRC-conc).
  solution("nh4cl_sat", "Saturated NH₄Cl", "acid", src(5.45, "CRC-salts", "derived"), src(1.076, "CRC-conc", "derived"), { ions: { Cl: 1 }, systems: { ammonium: 1 } }),
  solution("nh4cl_nh3_ph9", "NH₄Cl/NH₃ buffer (1 M/1 M)", "complexing", src(1.0, "derived", "derived"), src(1.01, "memory", "memory"), { ions: { Cl: 1 }, systems: { ammonium: 2 } },
    "Pulls copper into water as the blue ammine complex (complexation not modelled)."),
  // 0.1 M sodium phosphate; Na⁺ chosen so the ideal (activity = 1) pH is 7.00 with pKa2 7.198 (derived):
  // [HPO₄²⁻]/[H₂PO₄⁻] = 10^(7.00 − 7.198) = 0.634 → Na = 0.1·(1 + 0.634/1.634) = 0.1388 M.
  solution("phosphate_ph7", "0.1 M sodium phosphate buffer, pH 7", "buffer", src(0.1, "derived", "derived"), src(1.01, "memory", "memory"), { ions: { Na: 1.388 }, systems: { phosphate: 1 } }),
  // 5 wt% LiCl: 1.211 M, 1.0272 g/mL at 20 °C (CRC-conc).
  solution("licl_5pct", "5% LiCl", "salt", src(1.211, "CRC-conc", "confirmed"), src(1.0272, "CRC-conc", "confirmed"), { ions: { Li: 1, Cl: 1 } }),
  // 10 wt% CuSO₄ (anhydrous basis), density 1.107 (memory) → 0.69 M.
  solution("cuso4_10pct", "10% CuSO₄", "complexing", src(0.69, "memory", "memory"), src(1.107, "memory", "memory"), { systems: { copper: 1, sulfate: 1 } },
    "Removes pyridine as its copper complex (complexation not modelled)."),
  solution("na2s2o3_10pct", "10% Na₂S₂O₃", "reducing", src(0.687, "memory", "memory"), src(1.087, "memory", "memory"), { ions: { Na: 2, S2O3: 1 } }),
  solution("kf_1m", "1 M KF", "complexing", src(1.0, "derived", "derived"), src(1.04, "memory", "memory"), { ions: { K: 1 }, systems: { fluoride: 1 } }),
  solution("rochelle_sat", "Saturated Rochelle salt (K/Na tartrate)", "complexing", src(1.5, "memory", "memory"), src(1.2, "memory", "memory"), { ions: { K: 1, Na: 1 }, systems: { tartrate: 1 } }),
  solution("acoh_1m", "1 M acetic acid", "acid", src(1.0, "derived", "derived"), src(1.007, "memory", "memory"), { systems: { acetate: 1 } }),
  // Solids for add_salt; basis = molar mass (g/mol).
  { key: "nacl", name: "Sodium chloride (solid)", kind: "solid", purpose: "salt", density: null, basis: src(58.44, "derived", "derived"),
    ions: { Na: 1, Cl: 1 }, systems: {}, solubilityGPer100g: src(35.9, "CRC-salts", "derived") },
  { key: "na2so4", name: "Sodium sulfate (solid, for salting out)", kind: "solid", purpose: "salt", density: null, basis: src(142.04, "derived", "derived"),
    ions: { Na: 2 }, systems: { sulfate: 1 }, solubilityGPer100g: src(19.5, "memory", "memory") },
  // 7.948 mol/kg at 20 °C (CRC-salts) → 109.8 g per 100 g water (derived).
  { key: "k2co3", name: "Potassium carbonate (solid)", kind: "solid", purpose: "base", density: null, basis: src(138.2, "derived", "derived"),
    ions: { K: 2 }, systems: { carbonate: 1 }, solubilityGPer100g: src(109.8, "CRC-salts", "derived") },
  // 19.67 mol/kg at 20 °C (CRC-salts) → 83.4 g per 100 g water (derived).
  { key: "licl", name: "Lithium chloride (solid)", kind: "solid", purpose: "salt", density: null, basis: src(42.394, "derived", "derived"),
    ions: { Li: 1, Cl: 1 }, systems: {}, solubilityGPer100g: src(83.4, "CRC-salts", "derived") },
  { key: "nahco3", name: "Sodium bicarbonate (solid)", kind: "solid", purpose: "base", density: null, basis: src(84.01, "derived", "derived"),
    ions: { Na: 1 }, systems: { carbonate: 1 }, solubilityGPer100g: src(9.6, "chemister", "confirmed") },
];

export const REAGENTS: Readonly<Record<string, ReagentProps>> = Object.fromEntries(list.map((r) => [r.key, r]));
