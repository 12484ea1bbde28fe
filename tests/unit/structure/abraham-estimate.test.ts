/**
 * Abraham descriptors by the Platts group contribution (Platts, Butina, Abraham & Hersey, J. Chem. Inf. Comput.
 * Sci. 1999, 39, 835; fragment values as published with RMG-database). Check values: measured descriptors from
 * the compilation of Bradley, Acree & Lang, "Compounds with known Abraham descriptors" (figshare 2014,
 * doi 10.6084/m9.figshare.1176994); tolerances are the method's typical errors (about 0.1–0.2 per descriptor).
 */
import { beforeAll, describe, expect, it } from "vitest";
import { MEASURED_DESCRIPTORS } from "@/lib/chem/data/abraham-solutes";
import { abrahamForStructure, estimateAbrahamDescriptors, loadRDKit, readSmiles, type RDKitModule, usingMol } from "@/lib/chem/structure";

let rdkit: RDKitModule;
beforeAll(async () => { rdkit = await loadRDKit(); });
const estimate = (smiles: string) => usingMol(readSmiles(rdkit, smiles), (mol) => estimateAbrahamDescriptors(rdkit, mol));

describe("Platts group-contribution descriptors", () => {
  // [name, SMILES, E, S, A, B] measured (Bradley 2014), tolerance per descriptor.
  const measured: [string, string, number, number, number, number][] = [
    ["nitrobenzene", "O=[N+]([O-])c1ccccc1", 0.871, 1.11, 0, 0.28],
    ["phenol", "Oc1ccccc1", 0.805, 0.89, 0.6, 0.3],
    ["acetic acid", "CC(=O)O", 0.265, 0.64, 0.62, 0.44],
    ["ethyl acetate", "CCOC(C)=O", 0.106, 0.62, 0, 0.45],
    ["benzene", "c1ccccc1", 0.61, 0.52, 0, 0.14],
  ];
  it.each(measured)("%s within 0.15 of the measured E, S, A, B", (_name, smiles, E, S, A, B) => {
    const d = estimate(smiles);
    expect(d).not.toBeNull();
    for (const [got, want] of [[d?.E, E], [d?.S, S], [d?.A, A], [d?.B, B]] as const) expect(Math.abs((got ?? Number.NaN) - want)).toBeLessThan(0.15);
    expect(d?.provenance).toBe("estimated");
  });
  it("over the measured table the root-mean-square errors stay at the method's level (S and B ≤ 0.15, E and A ≤ 0.1)", () => {
    const err = { E: [] as number[], S: [] as number[], A: [] as number[], B: [] as number[] };
    for (const [smiles, m] of MEASURED_DESCRIPTORS) {
      const d = estimate(smiles);
      if (!d) continue;
      for (const k of ["E", "S", "A", "B"] as const) err[k].push(d[k] - m[k]);
    }
    const rmse = (e: number[]) => Math.sqrt(e.reduce((s, x) => s + x * x, 0) / e.length);
    expect(err.S.length).toBeGreaterThan(60);
    expect(rmse(err.S)).toBeLessThan(0.15);
    expect(rmse(err.B)).toBeLessThan(0.15);
    expect(rmse(err.E)).toBeLessThan(0.1);
    expect(rmse(err.A)).toBeLessThan(0.1);
  });
  it("gives no estimate when an atom has no fragment (halogens are not in the scheme)", () => {
    expect(estimate("Clc1ccccc1")).toBeNull();
  });
  it("abrahamForStructure estimates only where no measured descriptors exist", () => {
    expect(abrahamForStructure(rdkit, "Oc1ccccc1").estimated).toBeNull();
    const unlisted = abrahamForStructure(rdkit, "CCCCOC(=O)c1ccccc1");
    expect(unlisted.measured).toBeNull();
    expect(unlisted.estimated?.provenance).toBe("estimated");
    expect(unlisted.estimated?.V).toBeCloseTo(unlisted.mcGowanV, 4);
  });
});
