/**
 * "no ionizable site recognised: check" on the compound and in the workup's flags. Chemistry behind the cases
 * (CRC Handbook, "Dissociation Constants of Organic Acids and Bases", from memory): dialkyl phosphates are strong
 * acids (dimethyl phosphate pKa ≈ 1.3) that no site class covers; ethanol (≈ 16), acetamide (≈ 15) and indole N–H
 * (≈ 17) do not ionise in a workup; 1-hydroxybenzotriazole is an acid of pKa 4.60 (Carpino, J. Am. Chem. Soc.
 * 1993, 115, 4397, from memory) and so has a site, not a warning.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { estimateIonizableSites, loadRDKit, NO_SITE_WARNING, type RDKitModule } from "@/lib/chem/structure";
import { siteWarningsWith } from "@/lib/compounds/site-warnings";
import { NO_SITE_FLAG_CODE, siteFlagsWith } from "@/lib/workups/site-flags";

let rdkit: RDKitModule;
beforeAll(async () => {
  rdkit = await loadRDKit();
});

const DIMETHYL_PHOSPHATE = "COP(=O)(O)OC";

const workup = (components: unknown[]) => ({ components, mixture: { solvents: [] }, operations: [] });

describe("the compound page's site warnings", () => {
  it("shows the warning for a structure whose only O–H no class covers", () => {
    const warnings = siteWarningsWith(rdkit, { structureText: DIMETHYL_PHOSPHATE, pKas: [] });
    expect(warnings).toHaveLength(1);
    expect(warnings[0]?.startsWith(NO_SITE_WARNING)).toBe(true);
  });

  it("shows none once a chemist recorded a pKa, and none for HOBt, ethanol or indole", () => {
    const recorded = [{ value: 1.3, kind: "acid" as const, site: "added by hand", provenance: "literature" as const, source: "CRC" }];
    expect(siteWarningsWith(rdkit, { structureText: DIMETHYL_PHOSPHATE, pKas: recorded })).toEqual([]);
    for (const smiles of ["CCO", "c1ccc2[nH]ccc2c1"]) expect(siteWarningsWith(rdkit, { structureText: smiles, pKas: [] })).toEqual([]);
    const hobt = "On1nnc2ccccc12";
    const stored = estimateIonizableSites(rdkit, hobt).map((s) => ({ ...s, site: s.site }));
    expect(stored).toHaveLength(1);
    expect(siteWarningsWith(rdkit, { structureText: hobt, pKas: stored })).toEqual([]);
  });
});

describe("the workup's flags", () => {
  it("adds a warning flag naming the component whose structure has an unrecognised O–H", () => {
    const flags = siteFlagsWith(rdkit, workup([
      { key: "dmp", name: "Dimethyl phosphate", smiles: DIMETHYL_PHOSPHATE, pKas: [] },
      { key: "amide", name: "Acetanilide", smiles: "CC(=O)Nc1ccccc1", pKas: [] },
    ]));
    expect(flags).toHaveLength(1);
    expect(flags[0]).toMatchObject({ code: NO_SITE_FLAG_CODE, severity: "warning", component: "dmp" });
    expect(flags[0]?.cause).toContain(NO_SITE_WARNING);
  });

  it("adds none when the component carries a recorded pKa, has no structure, or its structure does not parse", () => {
    expect(siteFlagsWith(rdkit, workup([
      { key: "dmp", name: "Dimethyl phosphate", smiles: DIMETHYL_PHOSPHATE, pKas: [{ value: 1.3, kind: "acid", provenance: "literature" }] },
      { key: "x", name: "Unknown", pKas: [] },
      { key: "y", name: "Broken", smiles: "C1CC(", pKas: [] },
    ]))).toEqual([]);
  });
});
