/**
 * Solvent-specific partition against measured solvent/water partition coefficients, through the engine's own path
 * (solventLogK with the compound's octanol log P given, as a registered compound carries it).
 * Check values: bench/data/partition-measured.csv, every row with its published source — the heptane set of
 * Chiou & Block 1986 (C. T. Chiou, Partition and Adsorption of Organic Contaminants in Environmental Systems, Wiley
 * 2002, Table 5.2) and the Minnesota Solvation Database 2012 (Marenich et al.), log K = (ΔG°w − ΔG°s)/(RT ln 10).
 */
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { ABRAHAM_SOLVENTS } from "@/lib/chem/data/abraham-solvents";
import { SOLVENTS } from "@/lib/chem/data/solvents";
import { collanderLogK, solventLogK } from "@/lib/chem/partition";
import { componentSchema } from "@/lib/chem/schema";

interface Row { solvent: string; compound: string; smiles: string; logK: number; logPoct: number; donor: boolean }

function rows(): Row[] {
  const text = readFileSync(new URL("../../../bench/data/partition-measured.csv", import.meta.url), "utf8");
  return text.split("\n").filter((l) => l.trim() && !l.startsWith("#")).slice(1).map((line) => {
    const f = [...line.matchAll(/("([^"]*)"|[^,]*)(,|$)/g)].map((m) => m[2] ?? m[1] ?? "");
    return { solvent: f[0] ?? "", compound: f[1] ?? "", smiles: f[2] ?? "", logK: Number(f[3]), logPoct: f[4] ? Number(f[4]) : Number.NaN, donor: f[5] === "1" };
  });
}

const component = (r: Row) => componentSchema.parse({ key: "x", name: r.compound, role: "product", molarMass: 100, amount: { value: 1, unit: "mmol" },
  smiles: r.smiles, logP: { value: r.logPoct, provenance: "literature" }, ...(r.donor ? { pKas: [{ value: 4.5, kind: "acid", provenance: "literature" }] } : {}) });

const rmse = (e: number[]) => Math.sqrt(e.reduce((s, x) => s + x * x, 0) / e.length);

/** Model and old-line errors on the rows with an octanol log P that the model covers by measured descriptors. */
function errors(solvent: string): { model: number[]; old: number[] } {
  const s = SOLVENTS[solvent]!;
  const model: number[] = [], old: number[] = [];
  for (const r of rows()) {
    if (r.solvent !== solvent || !Number.isFinite(r.logPoct)) continue;
    const k = solventLogK(component(r), s, SOLVENTS);
    if (k?.origin !== "abraham") continue;
    model.push(k.value - r.logK);
    if (s.partition) old.push(collanderLogK(r.logPoct, s, r.donor) - r.logK);
  }
  return { model, old };
}

describe("partition of neutral solutes by solvent, against measured values", () => {
  // [solvent, least number of rows, RMSE bound]. Bounds: 0.25 log units (0.3 for heptane, whose Chiou set has
  // the larger scatter); the target is ≤ 0.4 and never worse than the old line.
  const cases: [string, number, number][] = [
    ["etoac", 14, 0.25], ["dcm", 7, 0.25], ["chcl3", 50, 0.25], ["et2o", 35, 0.25], ["toluene", 30, 0.25], ["hexane", 30, 0.25], ["heptane", 55, 0.3],
  ];
  it.each(cases)("%s: RMSE within the bound and below the old line's on the same rows", (solvent, nMin, bound) => {
    const { model, old } = errors(solvent);
    expect(model.length).toBeGreaterThanOrEqual(nMin);
    expect(rmse(model)).toBeLessThan(bound);
    expect(rmse(model)).toBeLessThan(rmse(old));
  });
  it.each(cases)("%s: the engine's stated standard error is not smaller than the validation RMSE", (solvent) => {
    const { model } = errors(solvent);
    expect(ABRAHAM_SOLVENTS[solvent]!.se).toBeGreaterThanOrEqual(Math.floor(rmse(model) * 100) / 100);
  });
});

describe("a measured octanol log P does not move an estimate made from measured descriptors", () => {
  it("toluene in chloroform: the same log K with log P 2.73 or 3.73 (anchoring raised the validation RMSE)", () => {
    const at = (logP: number) => solventLogK(componentSchema.parse({ key: "t", name: "toluene", role: "product", molarMass: 92.14,
      amount: { value: 1, unit: "mmol" }, smiles: "Cc1ccccc1", logP: { value: logP, provenance: "measured" } }), SOLVENTS.chcl3!, SOLVENTS)?.value;
    expect(at(3.73)).toBeCloseTo(at(2.73) ?? Number.NaN, 10);
  });
});

describe("standard error of a log K from group-contribution descriptors", () => {
  // Validation of estimated descriptors (bench:partition): RMSE 0.64 anchored on the measured octanol log P, 0.99
  // without, over 98 measured values (MNSol, seven solvents) of compounds without measured descriptors.
  const estimated = (logP?: number) => componentSchema.parse({ key: "e", name: "e", role: "product", molarMass: 100, amount: { value: 1, unit: "mmol" },
    abraham: { E: 0.8, S: 1.0, A: 0, B: 0.5, V: 1.2, provenance: "estimated" }, ...(logP === undefined ? {} : { logP: { value: logP, provenance: "literature" } }) });
  it("is the validated figure, larger without a measured log P to anchor on", () => {
    expect(solventLogK(estimated(), SOLVENTS.toluene!, SOLVENTS)?.se).toBeCloseTo(0.99, 6);
    expect(solventLogK(estimated(2), SOLVENTS.toluene!, SOLVENTS)?.se).toBeCloseTo(0.64, 6);
  });
});
