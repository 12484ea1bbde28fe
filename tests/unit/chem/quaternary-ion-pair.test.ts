/**
 * Quaternary ammonium salts extract into a chlorinated solvent as ion pairs, Q⁺(aq) + X⁻(aq) ⇌ QX(org), with
 * E_QX = [QX]org/([Q⁺]aq·[X⁻]aq). Check values, water/chloroform at 25 °C, L/mol: Bu₄N⁺ Cl⁻ 0.78, Br⁻ 19.5,
 * I⁻ 1023; picrates Me₄N⁺ 0.22 and Bu₄N⁺ 8.1·10⁵ (UCLA phase-transfer-catalysis notes, chem.ucla.edu/~bacher/
 * General/30BL, "Phase Transfer catalysis"; the values of K. Gustavii, Acta Pharm. Suec. 1967, attribution from
 * memory). Expected fractions are worked out here from those constants by mass action: a salt QX alone in the
 * water (n mmol in V_aq mL) against V_org mL of solvent leaves q mol/L of Q⁺ and of X⁻ in the water, with
 *   n = q·V_aq + E·q²·V_org,
 * so the fraction extracted, 1 − q·V_aq/n, grows with the concentration.
 */
import { describe, expect, it } from "vitest";
import { predictWorkup, validateWorkup } from "@/lib/chem/predict";
import { workupInputSchema, type WorkupInputRaw } from "@/lib/chem/schema";
import { propagateUncertainty } from "@/lib/chem/uncertainty";
import { simulateWorkup } from "@/lib/chem/predict";

type ComponentRaw = WorkupInputRaw["components"][number];

/** Fraction of a salt QX extracted into V_org from V_aq by one contact, from its extraction constant E (L/mol). */
function fractionExtracted(e: number, mmol: number, aqueousMl: number, organicMl: number): number {
  // E·V_org·q² + V_aq·q − n = 0, the positive root (written without the cancellation of −b + √…).
  const a = e * organicMl, b = aqueousMl;
  const q = (2 * mmol) / (b + Math.sqrt(b * b + 4 * a * mmol));
  return 1 - (q * aqueousMl) / mmol;
}

const salt = (smiles: string, molarMass: number, mmol: number, extra: Partial<ComponentRaw> = {}): ComponentRaw =>
  ({ key: "q", name: "quaternary salt", role: "product", molarMass, amount: { value: mmol, unit: "mmol" }, smiles, ...extra });

/** The salt dissolved in water, one extraction with solvent, organic layer kept; the phases taken as mutually
 * insoluble so that the volumes are the stated ones. */
const extraction = (component: ComponentRaw, waterMl: number, solventMl: number, solvent = "chcl3"): WorkupInputRaw => ({
  components: [component],
  mixture: { solvents: [{ solvent: "water", volume: { value: waterMl, unit: "mL" } }] },
  operations: [{ type: "extract", solvent, volume: { value: solventMl, unit: "mL" }, portions: 1, keep: "organic" }],
  options: { idealPhases: true },
});

const extracted = (w: WorkupInputRaw): number => predictWorkup(w, { flags: false }).recovery.q as number;

/** Tetrabutylammonium bromide, C₁₆H₃₆BrN, 322.37 g/mol (IUPAC standard atomic weights). */
const TBAB = "CCCC[N+](CCCC)(CCCC)CCCC.[Br-]";

describe("quaternary ammonium ion pairs", () => {
  it("reads Bu₄N⁺Br⁻ from its two-fragment SMILES as a permanent cation weighed with bromide", () => {
    const c = workupInputSchema.parse(extraction(salt(TBAB, 322.37, 1), 50, 50)).components[0];
    expect(c?.fixedCharge).toBe(1);
    expect(c?.salt).toEqual({ counterIon: "bromide", perParent: 1 });
    // The cation's molar mass: the salt's less bromine, 79.904 (IUPAC).
    expect(c?.molarMass).toBeCloseTo(322.37 - 79.904, 1);
  });

  it("extracts Bu₄N⁺Br⁻ from water into chloroform as E = 19.5 L/mol says, more from a stronger solution", () => {
    const dilute = extracted(extraction(salt(TBAB, 322.37, 1), 50, 50));
    const strong = extracted(extraction(salt(TBAB, 322.37, 5), 20, 20));
    // 0.02 M and 0.25 M of the salt, equal volumes: 23.1 % and 63.8 % extracted by mass action.
    expect(dilute).toBeCloseTo(fractionExtracted(19.5, 1, 50, 50), 6);
    expect(strong).toBeCloseTo(fractionExtracted(19.5, 5, 20, 20), 6);
    expect(dilute).toBeGreaterThan(0.2);
    expect(strong).toBeGreaterThan(dilute + 0.3);
  });

  it("extracts the iodide far better than the bromide (E = 1023 against 19.5 L/mol)", () => {
    const iodide = extracted(extraction(salt("CCCC[N+](CCCC)(CCCC)CCCC.[I-]", 369.37, 1), 50, 50));
    expect(iodide).toBeCloseTo(fractionExtracted(1023, 1, 50, 50), 6);
    expect(iodide).toBeGreaterThan(0.75);
  });

  it("keeps tetramethylammonium chloride in the water", () => {
    // Additivity of cation and anion contributions: E(Me₄N⁺Cl⁻) = E(Bu₄N⁺Cl⁻)·E(Me₄N⁺Pic⁻)/E(Bu₄N⁺Pic⁻).
    const e = (0.78 * 0.22) / 8.1e5;
    const left = extracted(extraction(salt("C[N+](C)(C)C.[Cl-]", 109.6, 1), 50, 50));
    expect(left).toBeLessThan(1e-6);
    expect(left / fractionExtracted(e, 1, 50, 50)).toBeCloseTo(1, 4);
  });

  it("uses a component's own measured constant in place of the solvent's class value", () => {
    // A permanent cation weighed as its bromide, with log K_ex = 2.00 measured into dichloromethane.
    const measured = { solvent: "dcm", counterIon: "bromide" as const, value: 2, provenance: "measured" as const };
    const quat = (extra: Partial<ComponentRaw>): ComponentRaw => ({
      key: "q", name: "quaternary salt", role: "product", molarMass: 300, amount: { value: 1, unit: "mmol" },
      fixedCharge: 1, salt: { counterIon: "bromide" }, logP: { value: 1, provenance: "estimated" }, ...extra,
    });
    const own = extracted(extraction(quat({ ionPairLogKex: [measured] }), 50, 50, "dcm"));
    expect(own).toBeCloseTo(fractionExtracted(100, 1, 50, 50), 6);
    const classValue = extracted(extraction(quat({}), 50, 50, "dcm"));
    expect(Math.abs(own - classValue)).toBeGreaterThan(0.1);
  });

  it("refuses a constant with an unknown key, a counter-ion of the wrong sign, or a solvent that forms no layer, with a message", () => {
    const withConstant = (k: Record<string, unknown>) => validateWorkup(extraction(salt(TBAB, 322.37, 1, { ionPairLogKex: [k as never] }), 50, 50));
    const messages = (k: Record<string, unknown>) => {
      const v = withConstant(k);
      return v.success ? [] : v.issues.map((i) => `${i.path}: ${i.message}`);
    };
    const good = { solvent: "dcm", counterIon: "bromide", value: 1.5, provenance: "measured" };
    expect(withConstant(good).success).toBe(true);
    expect(messages({ ...good, vaule: 1 }).join(" ")).toMatch(/components\.0\.ionPairLogKex\.0.*vaule.*unknown key/);
    expect(messages({ ...good, counterIon: "sodium" }).join(" ")).toMatch(/components\.0\.ionPairLogKex\.0\.counterIon: sodium cannot pair with 'q'/);
    expect(messages({ ...good, solvent: "meoh" }).join(" ")).toMatch(/components\.0\.ionPairLogKex\.0\.solvent: 'meoh' is water-miscible/);
    expect(messages({ ...good, solvent: "dcmm" }).join(" ")).toMatch(/components\.0\.ionPairLogKex\.0\.solvent: unknown solvent 'dcmm'/);
  });

  it("lists the published constants among the uncertain inputs, with their stated uncertainty", () => {
    const input = workupInputSchema.parse(extraction(salt(TBAB, 322.37, 1), 50, 50));
    const u = propagateUncertainty(input, simulateWorkup, { draws: 50, seed: 3 });
    const bromide = input.components[0]?.ionPairLogKex.findIndex((k) => k.solvent === "chcl3" && k.counterIon === "bromide") ?? -1;
    expect(bromide).toBeGreaterThanOrEqual(0);
    expect(u.inputs.find((s) => s.path === `components.0.ionPairLogKex.${bromide}`)?.sd).toBe(0.1);
    const r = u.components.q?.recovery;
    expect(r?.p025).toBeLessThan(fractionExtracted(19.5, 1, 50, 50));
    expect(r?.p975).toBeGreaterThan(fractionExtracted(19.5, 1, 50, 50));
  });
});
