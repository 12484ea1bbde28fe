/**
 * The planner sizes a bicarbonate wash with the CO₂ solubility at the wash's temperature, as the simulator's
 * contacts do. Check values by hand:
 *  - Henry's law solubility of CO₂ 0.034 mol L⁻¹ atm⁻¹ at 298.15 K, d ln k_H/d(1/T) = 2400 K (R. Sander, Atmos.
 *    Chem. Phys. 2015, 15, 4399, compilation): S(T) = 0.034·exp(2400·(1/T − 1/298.15));
 *  - carbonic acid pK₁ 6.352 (H. S. Harned, R. Davis, J. Am. Chem. Soc. 1943, 65, 2030) and pK₂ 10.329
 *    (H. S. Harned, S. R. Scholes, J. Am. Chem. Soc. 1941, 63, 1706), at 25 °C.
 * A wash that takes up acid at or above pH x keeps at most S/α₀ of carbonate (the rest leaves as CO₂), each
 * unit of which carries α₁ + 2α₂ of negative charge, so its capacity per litre at two temperatures differs by
 *   ΔS·(α₁ + 2α₂)/α₀ = ΔS·(K₁/h + 2K₁K₂/h²),  h = 10^−x,
 * whatever the sodium and total carbonate of the solution.
 */
import { describe, expect, it } from "vitest";
import { compileLibrary, DEFAULT_LIBRARY } from "@/lib/chem/library";
import { planWorkup } from "@/lib/chem/planner";
import { reagentCapacity } from "@/lib/chem/planner-math";
import { workupInputSchema, type WorkupInputRaw } from "@/lib/chem/schema";

const solubility = (celsius: number): number => 0.034 * Math.exp(2400 * (1 / (celsius + 273.15) - 1 / 298.15));
const K1 = 10 ** -6.352;
const K2 = 10 ** -10.329;
/** Difference in capacity (mmol per mL = mol/L) between a warm and a cold wash, at pH x. */
const capacityGain = (cold: number, warm: number, pH: number): number => {
  const h = 10 ** -pH;
  return (solubility(cold) - solubility(warm)) * (K1 / h + (2 * K1 * K2) / (h * h));
};

/** Naphthalene (log P 3.34, CRC log P table) with benzoic acid (log P 1.88, CRC; pKa 4.204, IUPAC dataset) in EtOAc. */
function mixture(celsius: number, acidMmol: number): WorkupInputRaw {
  return {
    temperature: { value: celsius, unit: "°C" },
    components: [
      { key: "naphthalene", name: "Naphthalene", role: "product", molarMass: 128.17, amount: { value: 10, unit: "mmol" }, logP: { value: 3.34, provenance: "literature" } },
      { key: "benzoic", name: "Benzoic acid", role: "impurity", molarMass: 122.12, amount: { value: acidMmol, unit: "mmol" },
        logP: { value: 1.88, provenance: "literature" }, pKas: [{ value: 4.204, kind: "acid", provenance: "literature" }] },
    ],
    mixture: { solvents: [{ solvent: "etoac", volume: { value: 50, unit: "mL" } }] },
    operations: [{ type: "wash", reagent: "brine", volume: { value: 20, unit: "mL" } }, { type: "dry", agent: "mgso4" }, { type: "concentrate", method: "rotavap" }],
  };
}

describe("planned bicarbonate washes and the temperature", () => {
  it("take up more acid per mL when warm, by the CO₂ solubility difference of the van 't Hoff expression (5 °C against 35 °C)", () => {
    const bicarbonate = compileLibrary(DEFAULT_LIBRARY).reagents.get("nahco3_sat");
    if (!bicarbonate) throw new Error("no saturated NaHCO₃ in the library");
    // pH where even cold water's S/α₀ stays below the solution's carbonate (about 1 mol/L), so the cap applies.
    for (const pH of [6.8, 7, 7.35]) {
      const gain = reagentCapacity(bicarbonate, pH, 35) - reagentCapacity(bicarbonate, pH, 5);
      expect(gain, `pH ${pH}`).toBeGreaterThan(0.05);
      // Within 1 %: the engine's carbonic-acid constants (pK 6.35, 10.33) round the published ones.
      expect(Math.abs(gain / capacityGain(5, 35, pH) - 1), `pH ${pH}`).toBeLessThan(0.01);
    }
  });

  it("plan a smaller bicarbonate wash for the same acid at 35 °C than at 20 °C, each portion's capacity as Henry's law says", () => {
    const plan = (celsius: number) => {
      const w = planWorkup(workupInputSchema.parse(mixture(celsius, 20))).washes.find((x) => x.purpose === "remove_acids");
      if (!w?.reagent) throw new Error(`no acid wash planned at ${celsius} °C`);
      return w;
    };
    const cool = plan(20), warm = plan(35);
    expect(cool.reagent?.key).toBe("nahco3_sat");
    expect(warm.reagent?.key).toBe("nahco3_sat");
    expect(warm.edgePh).toBe(cool.edgePh);
    const perMl = (w: ReturnType<typeof plan>) => w.capacityMmol / w.volumeMl;
    expect(Math.abs((perMl(warm) - perMl(cool)) / capacityGain(20, 35, cool.edgePh) - 1)).toBeLessThan(0.01);
    // 20 mmol of benzoic acid, 1.2-fold (the wash's allowance), needs more of the less capable cool wash.
    expect(cool.volumeMl * cool.portions).toBeGreaterThan(warm.volumeMl * warm.portions);
    expect(cool.reasons.join(" ")).toMatch(/solubility at 20 °C/);
  });
});
