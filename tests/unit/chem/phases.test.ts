import { describe, expect, it } from "vitest";
import { SOLVENTS } from "@/lib/chem/data/solvents";
import { REAGENTS } from "@/lib/chem/data/reagents";
import { DRYING_AGENTS } from "@/lib/chem/data/drying-agents";
import { layerOrder, mixtureDensity, waterActivity } from "@/lib/chem/phases";
import { predictWorkup } from "@/lib/chem/predict";
import { type WorkupInputRaw } from "@/lib/chem/schema";

const density = (k: string) => SOLVENTS[k]?.density.value ?? NaN;

describe("handbook values in the tables", () => {
  it.each([
    // CRC Handbook 95th ed., Physical Constants of Organic Compounds (digitized)
    ["etoac", 0.9003], ["et2o", 0.7138], ["dcm", 1.3266], ["chcl3", 1.4788], ["toluene", 0.8623], ["hexane", 0.6606], ["thf", 0.8833], ["dmso", 1.101],
  ])("density of %s is %f g/mL", (k, rho) => {
    expect(density(k)).toBeCloseTo(rho, 4);
  });
  it.each([
    // mutual solubilities: Merck Index EtOAc; OSHA DCM; IUPAC-NIST chloroform and 1-butanol
    ["etoac", 8.3, 3.3], ["dcm", 1.3, 0.2], ["chcl3", 0.79, 0.0758], ["nbuoh", 7.4, 20.3], ["toluene", 0.067, 0.04],
  ])("%s: %f wt% in water, %f wt% water in solvent", (k, sInW, wInS) => {
    expect(SOLVENTS[k]?.solventInWaterWtPct?.value).toBeCloseTo(sInW, 4);
    expect(SOLVENTS[k]?.waterInSolventWtPct?.value).toBeCloseTo(wInS, 4);
  });
  it("brine and reagent densities (CRC concentrative table; York teaching labs for 3 M HCl)", () => {
    expect(REAGENTS.brine?.density?.value).toBeCloseTo(1.2, 2);
    expect(REAGENTS.hcl_3m?.density?.value).toBeCloseTo(1.043, 3);
    expect(REAGENTS.licl_5pct?.basis.value).toBeCloseTo(1.211, 3);
    expect(REAGENTS.citric_10pct?.density?.value).toBeCloseTo(1.0402, 4);
  });
  it("drying-agent capacities are hydrate stoichiometry (hydrate formulas, derived)", () => {
    // MgSO₄·7H₂O: 7·18.015/120.37 = 1.048; Na₂SO₄·10H₂O: 180.15/142.04 = 1.268
    expect(DRYING_AGENTS.mgso4?.capacityGPerG.value).toBeCloseTo(1.048, 2);
    expect(DRYING_AGENTS.na2so4?.capacityGPerG.value).toBeCloseTo(1.268, 2);
  });
  it("every table value names a source and a confidence", () => {
    for (const s of Object.values(SOLVENTS)) for (const v of [s.density, s.bpC, s.logP]) expect(v.source.length).toBeGreaterThan(0);
    for (const r of Object.values(REAGENTS)) expect(r.basis.source.length).toBeGreaterThan(0);
  });
});

describe("layer densities and order (Nichols, Organic Chemistry Laboratory Techniques, LibreTexts §4.4 “Which Layer is Which?”)", () => {
  it("DCM : hexane 1:1 ≈ 0.995 g/mL, essentially water: marginal", () => {
    const rho = mixtureDensity({ dcm: 1, hexane: 1 }, density);
    expect(rho).toBeCloseTo(0.994, 2);
    expect(layerOrder(rho, 0.9982).marginal).toBe(true);
  });
  it("DCM : EtOAc 1:1 ≈ 1.12: sinks below water but floats on brine (1.197)", () => {
    const rho = mixtureDensity({ dcm: 1, etoac: 1 }, density);
    expect(rho).toBeCloseTo(1.11, 1);
    expect(layerOrder(rho, 0.9982).organicOnTop).toBe(false);
    expect(layerOrder(rho, 1.197).organicOnTop).toBe(true);
  });
  it("water activity of saturated NaCl ≈ 0.75 (Robinson & Stokes, Electrolyte Solutions; from memory)", () => {
    expect(waterActivity(2 * 5.42)).toBeCloseTo(0.77, 1);
    expect(waterActivity(0)).toBe(1);
  });
});

const twoLayer = (solvent: string, reagent: string, vOrg = 50, vAq = 50): WorkupInputRaw => ({
  components: [{ key: "x", name: "Naphthalene", role: "product", molarMass: 128.17, amount: { value: 1, unit: "mmol" }, logP: { value: 3.34, provenance: "literature" } }],
  mixture: { solvents: [{ solvent, volume: { value: vOrg, unit: "mL" } }] },
  operations: [{ type: "wash", reagent, volume: { value: vAq, unit: "mL" } }],
});

describe("phases in a wash", () => {
  it("50 mL EtOAc washed with 50 mL water loses about 4 g (≈4.5 mL) of EtOAc (from the mutual solubilities above; derived)", () => {
    const c = predictWorkup(twoLayer("etoac", "water")).steps[0]?.contacts[0];
    const lost = c?.phases.find((p) => p.kind === "aqueous")?.solventsMl.etoac ?? 0;
    expect(lost * 0.9003).toBeGreaterThan(3.5);
    expect(lost * 0.9003).toBeLessThan(5);
  });
  it("brine loses less EtOAc than water", () => {
    const w = predictWorkup(twoLayer("etoac", "water")).steps[0]?.contacts[0]?.phases.find((p) => p.kind === "aqueous")?.solventsMl.etoac ?? 0;
    const b = predictWorkup(twoLayer("etoac", "brine")).steps[0]?.contacts[0]?.phases.find((p) => p.kind === "aqueous")?.solventsMl.etoac ?? 0;
    expect(b).toBeLessThan(w / 2);
  });
  it("100 mL EtOAc holds ≈2.7 g water after a water wash (from the mutual solubilities above; derived)", () => {
    const org = predictWorkup(twoLayer("etoac", "water", 100, 100)).steps[0]?.contacts[0]?.phases.find((p) => p.kind === "organic");
    const waterG = (org?.solventsMl.water ?? 0) * 0.9982;
    expect(waterG).toBeGreaterThan(2.4);
    expect(waterG).toBeLessThan(3.1);
  });
  it("DCM is the bottom layer under water and EtOAc the top layer over brine", () => {
    const dcm = predictWorkup(twoLayer("dcm", "water")).steps[0]?.contacts[0]?.phases.find((p) => p.kind === "organic");
    const etoac = predictWorkup(twoLayer("etoac", "brine")).steps[0]?.contacts[0]?.phases.find((p) => p.kind === "organic");
    expect(dcm?.position).toBe("bottom");
    expect(dcm?.densityGPerMl).toBeGreaterThan(1.3);
    expect(etoac?.position).toBe("top");
  });
  it("the aqueous brine layer is ~1.2 g/mL and the ether layer ~0.71", () => {
    const c = predictWorkup(twoLayer("et2o", "brine")).steps[0]?.contacts[0];
    expect(c?.phases.find((p) => p.kind === "aqueous")?.densityGPerMl).toBeCloseTo(1.2, 1);
    expect(c?.phases.find((p) => p.kind === "organic")?.densityGPerMl).toBeCloseTo(0.72, 1);
  });
});
