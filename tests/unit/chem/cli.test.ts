/**
 * Spawns the command-line tool on the example files, as a user would run it, and checks the structure of the
 * output and the relations physics requires (no hard-coded predictions).
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it, vi } from "vitest";
import { main } from "@/bin/cli";
import type { WorkupPrediction } from "@/lib/chem/types";
import type { WorkupUncertainty } from "@/lib/chem/uncertainty";
import type { WorkupPlan } from "@/lib/chem/planner";
import type { LogKFit } from "@/lib/chem/fit";

const ROOT = path.resolve(import.meta.dirname, "../../..");
const TIMEOUT = 60_000;

function run(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const r = spawnSync(process.execPath, [path.join(ROOT, "bin/layerwise.mjs"), ...args], { cwd: ROOT, encoding: "utf8" });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

function json<T>(...args: string[]): T {
  const r = run(...args);
  expect(r.stderr).toBe("");
  expect(r.status).toBe(0);
  return JSON.parse(r.stdout) as T;
}

const tmp = mkdtempSync(path.join(tmpdir(), "layerwise-cli-"));
function writeTemp(name: string, content: string): string {
  const file = path.join(tmp, name);
  writeFileSync(file, content);
  return file;
}
const exampleRaw = (name: string) => JSON.parse(readFileSync(path.join(ROOT, "examples", `${name}.json`), "utf8")) as Record<string, unknown> & { operations: Array<Record<string, unknown>> };

describe("layerwise predict", () => {
  it("separates a neutral amide from an amine and a carboxylic acid (examples/acid-base-separation.json)", () => {
    const p = json<WorkupPrediction>("predict", "examples/acid-base-separation.json");
    expect(p.engineVersion).toMatch(/\d+\.\d+/);
    expect(p.steps).toHaveLength(5);
    expect(Object.keys(p.recovery).sort()).toEqual(["aniline", "benzanilide", "benzoic-acid", "triethylamine"]);
    // Amines go into the acid wash and the acid into the bicarbonate (two-unit rule: “Strategies for optimization of LLE protocols”, LCGC N. Am. 2021, 39(4), 198).
    expect(p.recovery.benzanilide).toBeGreaterThan(0.9);
    for (const impurity of ["aniline", "triethylamine", "benzoic-acid"]) expect(p.recovery[impurity]).toBeLessThan(0.05);
    // Mass balance: isolated plus every side stream gives back the starting amount.
    for (const c of p.components) {
      const side = p.sideStreams.reduce((s, x) => s + (x.components[c.key] ?? 0), 0);
      expect(side + (p.isolated.components[c.key] ?? 0)).toBeCloseTo(c.startMmol, 9);
    }
    const aqueousPh = (step: number) => p.steps[step]?.contacts.map((c) => c.phases.find((x) => x.kind === "aqueous")?.pH ?? NaN) ?? [];
    for (const pH of aqueousPh(0)) expect(pH).toBeLessThan(1.5); // 1 M HCl stays strongly acidic
    for (const pH of aqueousPh(1)) { expect(pH).toBeGreaterThan(6); expect(pH).toBeLessThan(9); } // bicarbonate buffer
    // EtOAc (0.90 g/mL, CRC Handbook 95th ed., Physical Constants of Organic Compounds) floats on every aqueous wash.
    for (const step of p.steps) for (const c of step.contacts) expect(c.phases.find((x) => x.kind === "organic")?.position).toBe("top");
    // Neutralizing benzoic acid with bicarbonate releases CO2 (HCO₃⁻ + HA → A⁻ + H₂O + CO₂; common practice).
    expect(p.steps[1]?.contacts.reduce((s, c) => s + c.co2Mmol, 0)).toBeGreaterThan(0);
    for (const f of p.flags) { expect(f.cause.length).toBeGreaterThan(10); expect(f.remedy.length).toBeGreaterThan(10); }
  }, TIMEOUT);

  it("prints a readable per-step report with --explain", () => {
    const r = run("predict", "examples/acid-base-separation.json", "--explain");
    expect(r.status).toBe(0);
    for (const text of ["Step 1", "Step 5", "pH", "Result (isolated fraction)", "recovery", "purity", "benzanilide", "aniline", "triethylamine", "benzoic-acid", "crude mass"]) {
      expect(r.stdout).toContain(text);
    }
    expect(r.stdout).toMatch(/Flags/);
  }, TIMEOUT);

  it("adds a reproducible uncertainty interval with --uncertainty N --seed S", () => {
    const a = json<WorkupPrediction & { uncertainty: WorkupUncertainty }>("predict", "examples/acid-base-separation.json", "--uncertainty", "200", "--seed", "3");
    const b = json<WorkupPrediction & { uncertainty: WorkupUncertainty }>("predict", "examples/acid-base-separation.json", "--uncertainty", "200", "--seed", "3");
    expect(b.uncertainty).toEqual(a.uncertainty);
    expect(a.uncertainty.draws).toBe(200);
    expect(a.uncertainty.seed).toBe(3);
    for (const key of Object.keys(a.recovery)) {
      const r = a.uncertainty.components[key]?.recovery;
      if (!r) throw new Error(`no interval for ${key}`);
      expect(r.p025).toBeLessThanOrEqual(r.p50);
      expect(r.p50).toBeLessThanOrEqual(r.p975);
      expect(r.p025).toBeGreaterThanOrEqual(0);
    }
    const explained = run("predict", "examples/acid-base-separation.json", "--explain", "--uncertainty", "50");
    expect(explained.stdout).toContain("95 % interval");
  }, TIMEOUT);

  it("predicts the stoichiometric ceiling when too little acid is added before extraction", () => {
    // Stoichiometry, illustrative numbers (common practice): 5 mmol of carboxylate with 5 mmol excess hydroxide; 8 mL of 1 M HCl protonates only
    // 3 mmol, so recovery is capped near 60 %, while 12 mL (pH 1–2) recovers nearly all.
    const raw = exampleRaw("saponification-ph-swing");
    const acidify = raw.operations.find((op) => op.type === "adjust_ph");
    if (!acidify) throw new Error("example has no adjust_ph");
    acidify.volume = { value: 8, unit: "mL" };
    const short = json<WorkupPrediction>("predict", writeTemp("short-acid.json", JSON.stringify(raw)));
    const enough = json<WorkupPrediction>("predict", "examples/saponification-ph-swing.json");
    expect(enough.recovery["benzoic-acid"]).toBeGreaterThan(0.9);
    expect(short.recovery["benzoic-acid"]).toBeGreaterThan(0.5);
    expect(short.recovery["benzoic-acid"]).toBeLessThan(0.62);
  }, TIMEOUT);

  it("carries a basic product through a pH swing (examples/amine-back-extraction.json)", () => {
    const p = json<WorkupPrediction>("predict", "examples/amine-back-extraction.json");
    expect(p.recovery.lidocaine).toBeGreaterThan(0.85);
    // The neutral chloroacetamide stays in the toluene discarded at step 1.
    expect(p.recovery.chloroacetamide).toBeLessThan(0.1);
    const acidLeg = p.steps[0]?.contacts.map((c) => c.phases.find((x) => x.kind === "aqueous")?.pH ?? NaN) ?? [];
    for (const pH of acidLeg) expect(pH).toBeLessThan(7.9 - 2); // lidocaine pKaH 7.9 [lido]
  }, TIMEOUT);
});

describe("layerwise plan and fit", () => {
  it("recommends acid and base washes inside their pH windows and checks them by simulation", () => {
    const plan = json<WorkupPlan>("plan", "examples/acid-base-separation.json", "--json");
    expect(plan.washes.map((w) => w.purpose).sort()).toEqual(["remove_acids", "remove_bases"]);
    for (const w of plan.washes) {
      if (!w.window || !w.reagent) throw new Error(`no reagent for ${w.purpose}`);
      expect(w.reagent.pH).toBeGreaterThanOrEqual(w.window.low);
      expect(w.reagent.pH).toBeLessThanOrEqual(w.window.high);
      expect(w.reasons.length).toBeGreaterThan(2);
    }
    expect(plan.check?.meetsTargets).toBe(true);
    const text = run("plan", "examples/acid-base-separation.json");
    expect(text.status).toBe(0);
    for (const s of ["pH window", "Changes to the procedure", "Simulated check", "two units"]) expect(text.stdout).toContain(s);
  }, TIMEOUT);

  it("fits log K from a recovery and reports only a bound near 100 %", () => {
    const value = json<LogKFit>("fit", "examples/acid-base-separation.json", "--component", "benzanilide", "--recovery", "0.7");
    expect(value.kind).toBe("value");
    expect(value.solvent).toBe("etoac");
    expect(value.se).toBeGreaterThan(0);
    const bound = json<LogKFit>("fit", "examples/acid-base-separation.json", "--component", "benzanilide", "--recovery", "0.98");
    expect(bound.kind).toBe("lower_bound");
    expect(bound.logK).toBeGreaterThan(value.logK ?? Infinity);
  }, TIMEOUT);
});

describe("layerwise strict input", () => {
  it("reads a file that starts with a UTF-8 byte-order mark (RFC 8259 §8.1: a parser may ignore it)", () => {
    const text = readFileSync(path.join(ROOT, "examples", "acid-base-separation.json"), "utf8");
    const withMark = writeTemp("bom.json", `\uFEFF${text}`);
    // Before: "is not valid JSON: Unexpected token (the mark)".
    const p = json<WorkupPrediction>("predict", withMark);
    expect(p.recovery).toEqual(json<WorkupPrediction>("predict", "examples/acid-base-separation.json").recovery);
  }, TIMEOUT);

  it("refuses misspelt keys at the object holding them, with the nearest allowed key", () => {
    const raw = exampleRaw("acid-base-separation");
    (raw.operations[0] as Record<string, unknown>).portion = 3;
    (raw.components as Array<Record<string, unknown>>)[0] = { ...(raw.components as Array<Record<string, unknown>>)[0], pKa: [] };
    const r = run("predict", writeTemp("typo.json", JSON.stringify(raw)));
    expect(r.status).toBe(2);
    expect(r.stderr).toContain("components[0]: `pKa`: unknown key; did you mean `pKas`?");
    expect(r.stderr).toContain("operations[0]: `portion`: unknown key; did you mean `portions`?");
  }, TIMEOUT);

  it("switches the idealisations on from flags, the same as from the input's options", () => {
    const flags = json<WorkupPrediction>("predict", "examples/acid-base-separation.json", "--ideal-phases", "--no-salting-out", "--no-ion-partition");
    const raw = exampleRaw("acid-base-separation");
    const fromFile = json<WorkupPrediction>("predict", writeTemp("ideal.json", JSON.stringify({ ...raw, options: { idealPhases: true, noSaltingOut: true, noIonPartition: true } })));
    expect(flags.recovery).toEqual(fromFile.recovery);
    // Mutually insoluble phases: no organic solvent leaves with the washes, so every wash's organic layer keeps its
    // volume (ideal-phase arithmetic of textbook extraction problems).
    const organic = (p: WorkupPrediction) => p.steps[0]?.contacts[0]?.phases.find((x) => x.kind === "organic")?.volumeMl ?? Number.NaN;
    expect(organic(flags)).toBeCloseTo(50, 6);
    // Real phases exchange solvent and water; over 1 M HCl (ionic strength 1 M) EtOAc's loss to the wash and the
    // water it takes up nearly cancel, so the net change is small but not zero.
    expect(Math.abs(organic(json<WorkupPrediction>("predict", "examples/acid-base-separation.json")) - 50)).toBeGreaterThan(1e-3);
  }, TIMEOUT);
});

describe("layerwise errors", () => {
  it("exits 2 and names the problem for malformed JSON, invalid fields, unknown names and bad options", () => {
    const malformed = run("predict", writeTemp("bad.json", "{ \"components\": [ }"));
    expect(malformed.status).toBe(2);
    expect(malformed.stderr).toMatch(/is not valid JSON/);

    const raw = exampleRaw("acid-base-separation");
    (raw.components as Array<Record<string, unknown>>)[0] = { ...(raw.components as Array<Record<string, unknown>>)[0], molarMass: -5 };
    const invalid = run("predict", writeTemp("invalid.json", JSON.stringify(raw)));
    expect(invalid.status).toBe(2);
    expect(invalid.stderr).toMatch(/components\[0\]\.molarMass: molarMass must be > 0/);

    const unknown = exampleRaw("acid-base-separation");
    unknown.mixture = { solvents: [{ solvent: "etherx", volume: { value: 50, unit: "mL" } }] };
    const unknownRun = run("predict", writeTemp("unknown.json", JSON.stringify(unknown)));
    expect(unknownRun.status).toBe(2);
    expect(unknownRun.stderr).toMatch(/mixture\.solvents\[0\]\.solvent: unknown solvent 'etherx'/);

  }, TIMEOUT);

  it("exits 2 for a missing file, bad options, an unknown command or component (in process)", async () => {
    const inProcess = async (...args: string[]): Promise<{ code: number; stderr: string }> => {
      const chunks: string[] = [];
      const err = vi.spyOn(process.stderr, "write").mockImplementation((c: string | Uint8Array) => { chunks.push(String(c)); return true; });
      const out = vi.spyOn(process.stdout, "write").mockImplementation(() => true);
      try {
        return { code: await main(args), stderr: chunks.join("") };
      } finally {
        err.mockRestore();
        out.mockRestore();
      }
    };
    expect(await inProcess("predict", path.join(tmp, "missing.json"))).toMatchObject({ code: 2, stderr: expect.stringMatching(/no such file/) as unknown });
    expect(await inProcess("predict", "examples/acid-base-separation.json", "--uncertainty", "abc")).toMatchObject({ code: 2, stderr: expect.stringMatching(/--uncertainty must be/) as unknown });
    expect((await inProcess("predict", "examples/acid-base-separation.json", "--bogus")).code).toBe(2);
    expect((await inProcess("predict", "examples/acid-base-separation.json", "--seed", "4")).stderr).toMatch(/--seed only applies/);
    expect((await inProcess("frobnicate")).code).toBe(2);
    expect(await inProcess("fit", "examples/acid-base-separation.json", "--component", "nope", "--recovery", "0.5")).toMatchObject({ code: 2, stderr: expect.stringMatching(/nope/) as unknown });
    expect(await inProcess("plan", "examples/acid-base-separation.json", "--target-recovery", "2")).toMatchObject({ code: 2, stderr: expect.stringMatching(/plan\.targetRecovery/) as unknown });
    expect((await inProcess("--help")).code).toBe(0);
  }, TIMEOUT);
});
