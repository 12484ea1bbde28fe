/**
 * The uncertainty engine varies the solvents' ion-pair extraction constants by the standard uncertainty their
 * class value states (lib/chem/ion-pair.ts: 0.75 log units for esters, from memory), so a recovery that the ion pair decides
 * gets a wider interval than one the ion pair does not touch.
 */
import { describe, expect, it } from "vitest";
import { SOLVENTS } from "@/lib/chem/data/solvents";
import { ionPairOffset } from "@/lib/chem/ion-pair";
import { simulateWorkup, validateWorkup } from "@/lib/chem/predict";
import { type WorkupInput } from "@/lib/chem/schema";
import { compileWorkup } from "@/lib/chem/compiled";
import { planPerturbation, DEFAULT_UNCERTAINTY } from "@/lib/chem/perturb";
import { propagateUncertainty } from "@/lib/chem/uncertainty";
import { mmol, wash, workup } from "./fixtures";

function parse(raw: unknown): WorkupInput {
  const v = validateWorkup(raw);
  if (!v.success) throw new Error(JSON.stringify(v.issues));
  return v.data;
}

/**
 * A lipophilic amine (log K 4.5 in ethyl acetate, pKaH 10, both taken as measured so that they add little
 * spread) washed once with 1 M HCl: the protonated amine is fully charged, and how much of it stays in the
 * organic layer is set by the chloride ion pair, K_ion = K_N·10^δ·[Cl⁻] with δ(ester) = −4 (about 3 here).
 */
const lipophilicAmine = parse(workup(
  [{ key: "amine", name: "Lipophilic amine", role: "product", molarMass: 300, amount: mmol(2),
    logK: { etoac: { value: 4.5, provenance: "measured" } }, pKas: [{ value: 10, kind: "base", provenance: "measured" }] }],
  [["etoac", 30]],
  [wash("hcl_1m", 30)],
));

const width = (input: WorkupInput, ionPairScale: number): number => {
  const r = propagateUncertainty(input, simulateWorkup, { draws: 400, seed: 11, defaults: { ionPairScale } }).components.amine?.recovery;
  if (!r) throw new Error("no interval");
  return r.p975 - r.p025;
};

describe("ion-pair constants in the uncertainty engine", () => {
  it("lists one ion-pair site per water-immiscible solvent, with the class value's stated uncertainty", () => {
    const plan = planPerturbation(lipophilicAmine);
    const sites = plan.sites.filter((s) => s.path.startsWith("ionPair."));
    expect(sites).toEqual([{ path: "ionPair.etoac", sd: ionPairOffset(SOLVENTS.etoac as NonNullable<(typeof SOLVENTS)["etoac"]>).se, scale: "log" }]);
    expect(sites[0]?.sd).toBe(0.75);
    // A mixture with nothing that can carry a charge has no ion pair to vary.
    const neutral = parse(workup([{ key: "n", name: "n", role: "product", molarMass: 128, amount: mmol(1), logP: { value: 3.3, provenance: "literature" } }],
      [["etoac", 30]], [wash("water", 30)]));
    expect(planPerturbation(neutral).sites.some((s) => s.path.startsWith("ionPair."))).toBe(false);
    expect(planPerturbation(lipophilicAmine, { ...DEFAULT_UNCERTAINTY, ionPairScale: 0 }).sites.some((s) => s.path.startsWith("ionPair."))).toBe(false);
  });

  it("widens the interval of a recovery decided by the ion pair", () => {
    const nominal = simulateWorkup(lipophilicAmine).recovery.amine ?? Number.NaN;
    // The case is ion-pair dominated: neither all in the water nor all in the organic layer.
    expect(nominal).toBeGreaterThan(0.05);
    expect(nominal).toBeLessThan(0.95);
    const withPairs = width(lipophilicAmine, 1);
    const without = width(lipophilicAmine, 0);
    expect(withPairs).toBeGreaterThan(0.3);
    expect(withPairs).toBeGreaterThan(3 * without);
  });

  it("draws the same shift on the compiled path as on the perturbed copy", () => {
    const plan = planPerturbation(lipophilicAmine);
    const compiled = compileWorkup(lipophilicAmine, {}, { rememberPh: true });
    const drawInto = plan.parameterDrawer(compiled.nominal, compiled.params);
    for (const shift of [-2, -0.5, 1, 2.5]) {
      const z = Float64Array.from(plan.sites, (s) => (s.path.startsWith("ionPair.") ? shift : 0));
      drawInto(z);
      compiled.run();
      const copy = simulateWorkup(plan.draw(z), { steps: false, flags: false });
      expect(compiled.recovery[0]).toBeCloseTo(copy.recovery.amine ?? Number.NaN, 9);
    }
  });
});


