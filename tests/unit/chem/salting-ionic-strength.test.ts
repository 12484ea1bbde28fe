/**
 * The salt concentration that drives salting out is the ionic strength I = ½·Σcᵢzᵢ² of the aqueous layer. A strong
 * acid or base brings its own counter-ion: 1 M HCl is 1 M H⁺ + 1 M Cl⁻, I = 1 M (definition of ionic strength;
 * e.g. Harris, Quantitative Chemical Analysis, ch. 8), not 0.5 M from the chloride alone.
 */
import { describe, expect, it } from "vitest";
import { compileLibrary, DEFAULT_LIBRARY, N_SYSTEMS, SYSTEM_KEYS, SYSTEM_Z0 } from "@/lib/chem/library";
import { PhaseSplit } from "@/lib/chem/phases";
import { Stream } from "@/lib/chem/stream";

const lib = compileLibrary(DEFAULT_LIBRARY, ["etoac"]);

/** Salt concentration the phase split uses for 50 mL EtOAc over 50 mL of the reagent solution. */
function saltM(reagent: string): number {
  const r = lib.reagents.get(reagent);
  if (!r) throw new Error(reagent);
  const s = new Stream(lib.solventKeys.length, 0);
  s.solv[lib.solventIndex.get("etoac") as number] = 50;
  s.addReagent(r, 50, 1);
  // The equilibrator's weighting of the weak acid–base systems, max(1, z₀²) (lib/chem/equilibrium.ts).
  let sysZ2 = 0;
  for (let i = 0; i < N_SYSTEMS; i++) sysZ2 += (s.sys[i] as number) * Math.max(1, (SYSTEM_Z0[i] as number) ** 2);
  const p = new PhaseSplit(lib);
  p.split(s, sysZ2);
  return p.saltM;
}

describe("ionic strength used for salting out", () => {
  it("1 M HCl counts its H⁺: I = 1.0 M (it was 0.5 M)", () => {
    expect(saltM("hcl_1m")).toBeCloseTo(1.0, 6);
  });
  it("1 M NaOH counts its OH⁻: I = 1.0 M", () => {
    expect(saltM("naoh_1m")).toBeCloseTo(1.0, 6);
  });
  it("3 M HCl: I = 3.0 M", () => {
    expect(saltM("hcl_3m")).toBeCloseTo(3.0, 6);
  });
  it("a neutral salt is unchanged: brine's I equals its molarity", () => {
    const brine = DEFAULT_LIBRARY.reagents.brine?.basis.value as number;
    expect(saltM("brine")).toBeCloseTo(brine, 6);
  });
  it("a salt of a weak acid is not counted twice: saturated NaHCO₃ (Na⁺ + HCO₃⁻) gives I = its molarity", () => {
    const c = DEFAULT_LIBRARY.reagents.nahco3_sat?.basis.value as number;
    expect(SYSTEM_KEYS).toContain("carbonate");
    expect(saltM("nahco3_sat")).toBeCloseTo(c, 6);
  });
});
