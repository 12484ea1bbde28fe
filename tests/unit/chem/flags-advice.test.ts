/**
 * Flags that never advise harm: an ampholyte is sent to its isoelectric window, not to a pH that charges its other
 * site; a pH adjustment whose reagent moves the wrong way is flagged instead of reported as "already at target";
 * the ion-pair flag needs an ion.
 */
import { describe, expect, it } from "vitest";
import { predictWorkup } from "@/lib/chem/predict";
import { type WorkupInputRaw } from "@/lib/chem/schema";
import { type Flag } from "@/lib/chem/types";
import { benzoicAcid, extract, glycine, mL, mmol, naphthalene, neutral, wash, workup } from "./fixtures";

const flag = (raw: WorkupInputRaw, code: string): Flag | undefined => predictWorkup(raw).flags.find((f) => f.code === code);

describe("ampholytes are sent to their isoelectric window", () => {
  // Glycine: pKa 2.35 (COOH) and 9.78 (NH₃⁺) (IUPAC digitized pKa dataset, see fixtures.ts); isoelectric point 5.97
  // (Nelson & Cox, Lehninger Principles of Biochemistry, table "Properties and conventions associated with the
  // common amino acids", with pK1 2.34 and pK2 9.60).
  const fromAcid: WorkupInputRaw = {
    components: [glycine("product")],
    mixture: { solvents: [{ solvent: "water", volume: mL(40) }], reagents: [{ reagent: "hcl_1m", volume: mL(10) }] },
    operations: [extract("nbuoh", 30, 2)],
  };

  it("F3 on glycine extracted from acid names its isoelectric point, not pH ≤ 0.3", () => {
    const f = flag(fromAcid, "F3");
    expect(f, "F3 expected").toBeDefined();
    // The old remedy: "Bring the aqueous layer to pH ≤ 0.3", which makes glycine fully cationic.
    expect(f?.remedy).not.toMatch(/≤ 0\.3/);
    expect(f?.remedy).toMatch(/isoelectric point/);
    const pI = Number(/pH ≈ (\d+\.\d)/.exec(f?.remedy ?? "")?.[1]);
    expect(pI).toBeGreaterThan(5.97 - 0.15);
    expect(pI).toBeLessThan(5.97 + 0.15);
  });

  it("F2 on an ampholyte washed with acid: bring the washes to the window, not to pH ≥ pKaH + 2", () => {
    // 4-Aminobenzoic acid: pKaH 2.38 (anilinium) and pKa 4.85 (COOH) (CRC Handbook of Chemistry and Physics,
    // "Dissociation constants of organic acids and bases"; from memory); log P 0.83 (Hansch, Leo & Hoekman,
    // Exploring QSAR: Hydrophobic, Electronic and Steric Constants, 1995; from memory).
    const paba = {
      key: "paba", name: "4-Aminobenzoic acid", role: "product" as const, molarMass: 137.14, amount: mmol(5),
      logP: { value: 0.83, provenance: "literature" as const },
      pKas: [{ value: 4.85, kind: "acid" as const, provenance: "literature" as const }, { value: 2.38, kind: "base" as const, provenance: "literature" as const }],
    };
    const f = flag(workup([paba], [["etoac", 50]], [wash("hcl_1m", 50, 2)]), "F2");
    expect(f, "F2 expected").toBeDefined();
    expect(f?.remedy).not.toMatch(/pKaH \+ 2/);
    // pI = (2.38 + 4.85)/2 = 3.6: the sites are 2.5 units apart, so no range is two units clear of both.
    expect(f?.remedy).toMatch(/pH ≈ 3\.6, its isoelectric point/);
  });

  it("an acid alone keeps the usual advice (pH ≤ pKa − 2; two-unit rule, common practice)", () => {
    const raw: WorkupInputRaw = { components: [benzoicAcid("product")], mixture: { solvents: [], reagents: [{ reagent: "phosphate_ph7", volume: mL(50) }] }, operations: [extract("etoac", 30, 3)] };
    // benzoic acid pKa 4.204 (fixtures.ts) → pH ≤ 2.2
    expect(flag(raw, "F3")?.remedy).toMatch(/pH ≤ 2\.2/);
  });
});

describe("a pH adjustment in the wrong direction is flagged", () => {
  // Benzoic acid in water is acidic (pH ≈ 3 at this concentration); an acid lowers the pH and a base raises it
  // (common practice).
  const adjust = (reagent: string, targetPh: number): WorkupInputRaw =>
    workup([benzoicAcid("product"), naphthalene("impurity")], [["water", 50], ["etoac", 30]], [{ type: "adjust_ph", reagent, targetPh }]);

  it("1 M HCl to reach pH 9 from an acidic layer: flagged, nothing added", () => {
    const p = predictWorkup(adjust("hcl_1m", 9));
    const details = p.steps[0]?.details ?? {};
    // Before: details.alreadyAtTarget = true and no flag.
    expect(details.alreadyAtTarget).toBeUndefined();
    expect(details.wrongDirection).toBe(true);
    expect(details.reagentVolumeMl).toBe(0);
    expect(Number(details.startPh)).toBeLessThan(5);
    const f = p.flags.find((x) => x.title === "pH adjustment goes the wrong way");
    expect(f?.code).toBe("F4");
    expect(f?.step).toBe(1);
    expect(f?.cause).toMatch(/below the target pH 9\.0, and the reagent lowers the pH further/);
    expect(f?.remedy).toMatch(/use a base/);
  });

  it("1 M NaOH to reach pH 2 from the same layer is flagged too", () => {
    const f = predictWorkup(adjust("naoh_1m", 2)).flags.find((x) => x.title === "pH adjustment goes the wrong way");
    expect(f?.remedy).toMatch(/use an acid/);
  });

  it("a reachable target, and one the reagent cannot reach, keep their own outcomes", () => {
    const reached = predictWorkup(adjust("naoh_1m", 9));
    expect(reached.steps[0]?.details.targetReached).toBe(true);
    expect(reached.flags.filter((f) => f.code === "F4")).toEqual([]);
    // Saturated bicarbonate buffers near pH 8 and cannot reach pH 11 (common practice).
    const short = predictWorkup(adjust("nahco3_sat", 11));
    expect(short.steps[0]?.details.targetReached).toBe(false);
    expect(short.flags.map((f) => f.title)).toContain("Target pH not reached");
  });
});

describe("the ion-pair flag needs an ion", () => {
  // Benzylamine: pKaH 9.34 (CRC Handbook, "Dissociation constants of organic acids and bases"); log P 1.09
  // (Hansch, Leo & Hoekman 1995; from memory). Marked as having a lipophilic counter-ion (its TFA salt).
  const amine = { ...neutral("bna", 1.09), name: "Benzylamine", role: "impurity" as const, counterIon: "lipophilic" as const,
    pKas: [{ value: 9.34, kind: "base" as const, provenance: "literature" as const }] };

  it("stays quiet for the free amine under a 1 M NaOH wash (pH ≈ 14, 1e-4.7 protonated)", () => {
    // Before: F19 fired whenever the amine met DCM, whatever the pH.
    expect(flag(workup([naphthalene(), amine], [["dcm", 50]], [wash("naoh_1m", 30)]), "F19")).toBeUndefined();
  });

  it("fires when the amine is protonated by a 1 M HCl wash in DCM", () => {
    expect(flag(workup([naphthalene(), amine], [["dcm", 50]], [wash("hcl_1m", 30)]), "F19")?.component).toBe("bna");
  });
});
