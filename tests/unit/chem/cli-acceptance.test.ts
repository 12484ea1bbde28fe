/**
 * `npx layerwise predict` as a chemist runs it, on the three everyday mixtures in examples/: the answers a chemist
 * expects (common practice; the salt pH from the weak-acid formula of D. C. Harris, Quantitative Chemical
 * Analysis, ch. "Fundamentals of acid–base equilibria": [H⁺] = √(K_a·F) for a weak acid BH⁺ of formal
 * concentration F). The CLI runs as a child process on each file.
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import type { WorkupPrediction } from "@/lib/chem/types";

const ROOT = path.resolve(import.meta.dirname, "../../..");
const TIMEOUT = 120_000;

function predict(file: string): WorkupPrediction {
  const r = spawnSync(process.execPath, [path.join(ROOT, "bin/layerwise.mjs"), "predict", file], { cwd: ROOT, encoding: "utf8" });
  expect(r.stderr).toBe("");
  expect(r.status).toBe(0);
  return JSON.parse(r.stdout) as WorkupPrediction;
}

const aqueousPh = (p: WorkupPrediction, step: number): number[] =>
  p.steps[step]?.contacts.map((c) => c.phases.find((x) => x.kind === "aqueous")?.pH ?? Number.NaN) ?? [];

describe("layerwise predict: the acceptance mixtures", () => {
  it("an amine hydrochloride stays in the water under a DCM wash, and goes into DCM once basified", () => {
    const p = predict("examples/amine-hydrochloride-dcm-wash.json");
    // 5.0 mmol benzylammonium chloride in 50 mL: F = 0.10 M, pKa 9.34 (Perrin 1965, from memory), so
    // pH = ½(9.34 + 1.00) = 5.2 (Harris); the trace of free base the DCM takes leaves a little acid behind, so
    // the wash sits a little lower. Far from the pH ≈ 10.6 of the free base (the defect this guards against).
    const [washPh] = aqueousPh(p, 0);
    expect(washPh).toBeGreaterThan(4);
    expect(washPh).toBeLessThan(6);
    // The DCM wash (discarded) takes under 1 % of the salt (common practice) but the neutral impurity.
    const wash = p.sideStreams.find((s) => s.step === 1);
    expect(wash).toBeDefined();
    expect((wash?.components["benzylamine-hcl"] ?? Number.NaN) / 5).toBeLessThan(0.01);
    expect(p.recovery.naphthalene).toBeLessThan(0.05);
    // Basified with 1 M NaOH past the pKa (common practice: pH ≥ pKa + 2), then two DCM extractions recover it.
    for (const pH of aqueousPh(p, 1)) expect(pH).toBeGreaterThan(11.3);
    expect(p.recovery["benzylamine-hcl"]).toBeGreaterThan(0.95);
  }, TIMEOUT);

  it("a carboxylic acid is removed from ethyl acetate by 2 × 1 M NaOH as its sodium salt", () => {
    const p = predict("examples/carboxylate-naoh-wash.json");
    // Common practice: a base wash removes a carboxylic acid essentially completely; the neutral product stays.
    expect(p.recovery.ibuprofen).toBeLessThan(0.01);
    expect(p.recovery.naphthalene).toBeGreaterThan(0.95);
    // 25 mL of 1 M NaOH, 2 mmol of it spent on the acid, stays strongly basic (about 0.9 M OH⁻: pH > 13).
    for (const pH of aqueousPh(p, 0)) expect(pH).toBeGreaterThan(13);
  }, TIMEOUT);

  it("a limiting bicarbonate wash spends its capacity, releases its CO₂ volume and warns of foaming at danger level", () => {
    const p = predict("examples/limiting-bicarbonate-wash.json");
    // 4 mL saturated NaHCO₃ (1.11 M, Seidell) = 4.4 mmol against 10 mmol benzoic acid: the bicarbonate is the
    // limiting reagent, so at least half of the acid stays in the organic layer (common practice).
    expect(p.recovery["benzoic-acid"]).toBeGreaterThan(0.5);
    expect(p.recovery["benzoic-acid"]).toBeLessThan(0.7);
    // Each mmol of bicarbonate spent gives a mmol of CO₂: at most 4.4 mmol × 24.1 mL/mmol (20 °C, 1 atm,
    // ideal gas) = 107 mL, less what the water keeps dissolved.
    const gasMl = p.steps[0]?.contacts.reduce((s, c) => s + c.co2GasMl, 0) ?? 0;
    expect(gasMl).toBeGreaterThan(80);
    expect(gasMl).toBeLessThan(107);
    // More gas than the free volume of a 100 mL funnel holding about 34 mL of liquid: danger (common practice).
    expect(p.flags.find((f) => f.code === "F13")?.severity).toBe("danger");
    expect(p.cautions.some((c) => c.code === "gas_evolution")).toBe(true);
  }, TIMEOUT);

  it("flags a structure with an O–H that no ionizable-site class covers, as the server does", () => {
    const dir = mkdtempSync(path.join(tmpdir(), "layerwise-cli-site-"));
    const file = path.join(dir, "phosphate.json");
    // Dimethyl phosphate: its P–O–H is acidic (pKa ≈ 1.3, from memory) but no site class covers phosphate diesters.
    writeFileSync(file, JSON.stringify({
      components: [{ key: "dmp", name: "Dimethyl phosphate", role: "impurity", smiles: "COP(=O)(O)OC", molarMass: 126.05,
        amount: { value: 1, unit: "mmol" }, logP: { value: -0.8, provenance: "estimated" } }],
      mixture: { solvents: [{ solvent: "etoac", volume: { value: 30, unit: "mL" } }] },
      operations: [{ type: "wash", reagent: "water", volume: { value: 20, unit: "mL" } }],
    }));
    const p = predict(file);
    const notice = p.flags.find((f) => f.cause.includes("no ionizable site recognised: check"));
    expect(notice?.component).toBe("dmp");
    expect(notice?.severity).toBe("warning");
  }, TIMEOUT);
});
