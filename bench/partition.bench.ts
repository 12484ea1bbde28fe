/**
 * `npm run bench:partition`: the partition model against measured solvent/water partition coefficients
 * (bench/data/partition-measured.csv, every row with its published source). Not part of the test suite.
 * Per solvent: n, RMSE and bias (predicted − measured, log units) of
 *  - the old Collander line on the measured octanol log P of the same source (data/solvents.ts),
 *  - the Abraham model with the measured descriptors (data/abraham-solutes.ts),
 *  - the Abraham model anchored on the measured octanol log P (abrahamLogK with anchor on).
 * Then the engine's speed with and without descriptors (median of several runs, µs per prediction).
 * The last line printed is one JSON object with every number.
 */
import { readFileSync } from "node:fs";
import { performance } from "node:perf_hooks";
import { componentDescriptors, abrahamEstimate } from "../lib/chem/abraham";
import { MEASURED_DESCRIPTORS } from "../lib/chem/data/abraham-solutes";
import { estimateAbrahamDescriptors, type EstimatedDescriptors } from "../lib/chem/structure/abraham-estimate";
import { loadRDKit } from "../lib/chem/structure/rdkit";
import { ABRAHAM_SOLVENTS } from "../lib/chem/data/abraham-solvents";
import { SOLVENTS } from "../lib/chem/data/solvents";
import { abrahamLogK, collanderLogK } from "../lib/chem/partition";
import { simulateWorkup } from "../lib/chem/predict";
import { workupInputSchema, type WorkupInputRaw } from "../lib/chem/schema";

interface Row { solvent: string; compound: string; smiles: string; logK: number; logPoct: number; donor: boolean; source: string }

/** Minimal CSV reader for the data file: comma-separated, double-quoted fields may hold commas, '#' lines are notes. */
export function readMeasured(path = new URL("./data/partition-measured.csv", import.meta.url)): Row[] {
  const lines = readFileSync(path, "utf8").split("\n").filter((l) => l.trim() && !l.startsWith("#"));
  const split = (line: string) => [...line.matchAll(/("([^"]*)"|[^,]*)(,|$)/g)].map((m) => m[2] ?? m[1] ?? "").slice(0, 7);
  return lines.slice(1).map((line) => {
    const [solvent = "", compound = "", smiles = "", logK = "", logPoct = "", donor = "", source = ""] = split(line);
    return { solvent, compound, smiles, logK: Number(logK), logPoct: logPoct.trim() === "" ? Number.NaN : Number(logPoct), donor: donor === "1", source };
  });
}

export interface Stats { n: number; rmse: number; bias: number }
export function stats(errors: number[]): Stats {
  const n = errors.length;
  if (n === 0) return { n, rmse: Number.NaN, bias: Number.NaN };
  const round = (x: number) => Math.round(x * 1000) / 1000;
  return { n, rmse: round(Math.sqrt(errors.reduce((s, e) => s + e * e, 0) / n)), bias: round(errors.reduce((s, e) => s + e, 0) / n) };
}

export interface SolventValidation {
  /** Rows with descriptors and an octanol log P: the old line and the model scored on the same compounds. */
  old: Stats | null;
  abraham: Stats;
  anchored: Stats;
  /** The model on every row with descriptors (with or without an octanol log P). */
  abrahamAll: Stats;
  /** Each route on the rows where it applies: the water→solvent equation and the gas→solvent difference. */
  waterRoute: Stats | null;
  gasRoute: Stats | null;
  missing: string[];
}

export function validate(rows: Row[]): Record<string, SolventValidation> {
  const bySolvent = new Map<string, Row[]>();
  for (const r of rows) bySolvent.set(r.solvent, [...(bySolvent.get(r.solvent) ?? []), r]);
  const out: Record<string, SolventValidation> = {};
  for (const [solvent, list] of bySolvent) {
    const props = SOLVENTS[solvent];
    const coefficients = ABRAHAM_SOLVENTS[solvent];
    const old: number[] = [], ab: number[] = [], anchored: number[] = [], all: number[] = [], water: number[] = [], gas: number[] = [], missing: string[] = [];
    for (const r of list) {
      const d = componentDescriptors({ smiles: r.smiles });
      const est = d && coefficients ? abrahamEstimate(d, coefficients) : null;
      if (!d || !est || !coefficients) { missing.push(r.compound); continue; }
      all.push(est.value - r.logK);
      if (coefficients.water) water.push(abrahamEstimate(d, { ...coefficients, gas: undefined, preferWater: true })!.value - r.logK);
      if (coefficients.gas && d.L !== undefined) gas.push(abrahamEstimate(d, { ...coefficients, water: undefined })!.value - r.logK);
      if (!Number.isFinite(r.logPoct)) continue;
      // For octanol the old line is the identity on the same number: no information, so it is not scored.
      if (props?.partition && solvent !== "octanol") old.push(collanderLogK(r.logPoct, props, r.donor) - r.logK);
      ab.push(est.value - r.logK);
      anchored.push(abrahamLogK(est, r.logPoct, true) - r.logK);
    }
    out[solvent] = {
      old: old.length ? stats(old) : null, abraham: stats(ab), anchored: stats(anchored), abrahamAll: stats(all),
      waterRoute: water.length ? stats(water) : null, gasRoute: gas.length ? stats(gas) : null, missing,
    };
  }
  return out;
}

/**
 * Descriptors estimated by group contribution (Platts et al. 1999) for the measured rows whose compound is not in
 * the measured-descriptor table: the model from estimated descriptors, the same anchored on the row's octanol log P
 * (what the engine does when a compound has both), and the old line, on the same rows; and the octanol–water log P
 * the estimated descriptors give against the measured one (MNSol's octanol value), once per compound.
 */
export async function validateEstimated(rows: Row[]) {
  const rdkit = await loadRDKit();
  const cache = new Map<string, EstimatedDescriptors | null>();
  const estimate = (smiles: string) => {
    if (!cache.has(smiles)) {
      const mol = rdkit.get_mol(smiles);
      cache.set(smiles, mol ? estimateAbrahamDescriptors(rdkit, mol) : null);
      mol?.delete();
    }
    return cache.get(smiles) ?? null;
  };
  const octanol = ABRAHAM_SOLVENTS.octanol as NonNullable<(typeof ABRAHAM_SOLVENTS)[string]>;
  const logPErrors = new Map<string, number>();
  const bySolvent: Record<string, { estimated: Stats; anchored: Stats; old: Stats; notEstimable: number }> = {};
  for (const solvent of [...new Set(rows.map((r) => r.solvent))]) {
    const props = SOLVENTS[solvent];
    const coefficients = ABRAHAM_SOLVENTS[solvent];
    const est: number[] = [], anchored: number[] = [], old: number[] = [];
    let notEstimable = 0;
    for (const r of rows) {
      if (r.solvent !== solvent || MEASURED_DESCRIPTORS.has(r.smiles) || !Number.isFinite(r.logPoct) || !coefficients) continue;
      const d = estimate(r.smiles);
      if (!d) { notEstimable++; continue; }
      const e = abrahamEstimate(d, coefficients);
      if (!e) continue;
      est.push(e.value - r.logK);
      anchored.push(abrahamLogK(e, r.logPoct, true) - r.logK);
      if (props?.partition && solvent !== "octanol") old.push(collanderLogK(r.logPoct, props, r.donor) - r.logK);
      logPErrors.set(r.smiles, (abrahamEstimate(d, octanol)?.value ?? Number.NaN) - r.logPoct);
    }
    bySolvent[solvent] = { estimated: stats(est), anchored: stats(anchored), old: stats(old), notEstimable };
  }
  return { bySolvent, octanolLogP: stats([...logPErrors.values()]) };
}

/** The chem benchmark's style of work-up, with or without SMILES (SMILES switch on the Abraham path). */
function timedWorkup(withSmiles: boolean): WorkupInputRaw {
  const mmol = (value: number) => ({ value, unit: "mmol" as const });
  const mL = (value: number) => ({ value, unit: "mL" as const });
  const s = (smiles: string) => (withSmiles ? { smiles } : {});
  return {
    components: [
      { key: "ketone", name: "Benzophenone", role: "product", molarMass: 182.22, amount: mmol(5), logP: { value: 3.18, provenance: "literature" }, ...s("O=C(c1ccccc1)c1ccccc1") },
      { key: "aniline", name: "Aniline", role: "starting_material", molarMass: 93.13, amount: mmol(0.5), ...s("Nc1ccccc1"),
        logP: { value: 0.9, provenance: "literature" }, pKas: [{ value: 4.6, kind: "base", provenance: "literature" }] },
      { key: "tea", name: "Triethylamine", role: "reagent", molarMass: 101.19, amount: mmol(2), ...s("CCN(CC)CC"),
        logP: { value: 1.45, provenance: "literature" }, pKas: [{ value: 10.72, kind: "base", provenance: "literature" }] },
      { key: "acid", name: "Benzoic acid", role: "byproduct", molarMass: 122.12, amount: mmol(1), ...s("O=C(O)c1ccccc1"),
        logP: { value: 1.87, provenance: "literature" }, pKas: [{ value: 4.2, kind: "acid", provenance: "literature" }] },
    ],
    mixture: { solvents: [{ solvent: "etoac", volume: mL(40) }, { solvent: "dmf", volume: mL(5) }] },
    operations: [
      { type: "wash", reagent: "water", volume: mL(20), portions: 3 },
      { type: "wash", reagent: "hcl_1m", volume: mL(20), portions: 2 },
      { type: "wash", reagent: "nahco3_sat", volume: mL(20), portions: 2 },
      { type: "wash", reagent: "brine", volume: mL(20) },
      { type: "dry", agent: "mgso4" },
      { type: "concentrate" },
    ],
  };
}

function medianMicroseconds(fn: () => void, runs = 7, iterations = 2000): number {
  const times: number[] = [];
  for (let i = 0; i < 200; i++) fn();
  for (let r = 0; r < runs; r++) {
    const t0 = performance.now();
    for (let i = 0; i < iterations; i++) fn();
    times.push(((performance.now() - t0) * 1000) / iterations);
  }
  times.sort((a, b) => a - b);
  return Math.round((times[Math.floor(runs / 2)] as number) * 10) / 10;
}

async function main(): Promise<void> {
  const results = validate(readMeasured());
  // The workup solvents that must be validated: shown with n = 0 when they have no measured rows, not left out.
  const none: Stats = { n: 0, rmse: Number.NaN, bias: Number.NaN };
  for (const key of ["etoac", "dcm", "chcl3", "et2o", "toluene", "hexane"]) {
    results[key] ??= { old: null, abraham: none, anchored: none, abrahamAll: none, waterRoute: null, gasRoute: null, missing: [] };
  }
  const f = (s: Stats | null) => (s && s.n > 0 ? `${s.rmse.toFixed(2)} / ${s.bias >= 0 ? "+" : ""}${s.bias.toFixed(2)}` : "n/a");
  console.log("RMSE / bias (predicted − measured), log units. Same rows: descriptors and an octanol log P (old line's input).");
  console.log("solvent       n  old line        Abraham         anchored     |  all rows: n  Abraham       water eq. (n)        gas eq. (n)");
  for (const [solvent, r] of Object.entries(results)) {
    const route = (s: Stats | null) => (s ? `${f(s)} (${s.n})` : "n/a");
    console.log(`${solvent.padEnd(10)} ${String(r.abraham.n).padStart(4)}  ${f(r.old).padEnd(14)}  ${f(r.abraham).padEnd(14)}  ${f(r.anchored).padEnd(12)} | ` +
      `${String(r.abrahamAll.n).padStart(4)}  ${f(r.abrahamAll).padEnd(12)}  ${route(r.waterRoute).padEnd(19)}  ${route(r.gasRoute)}`);
    if (r.missing.length) console.log(`  no descriptors (${r.missing.length}): ${r.missing.slice(0, 12).join(", ")}${r.missing.length > 12 ? ", …" : ""}`);
  }
  const estimated = await validateEstimated(readMeasured());
  console.log("\nCompounds without measured descriptors, descriptors estimated by group contribution (same rows per solvent):");
  console.log("solvent       n  estimated       anchored on log P   old line     (not estimable)");
  for (const [solvent, r] of Object.entries(estimated.bySolvent)) {
    if (r.estimated.n === 0 && r.notEstimable === 0) continue;
    console.log(`${solvent.padEnd(10)} ${String(r.estimated.n).padStart(4)}  ${f(r.estimated).padEnd(14)}  ${f(r.anchored).padEnd(18)}  ${f(r.old).padEnd(12)} (${r.notEstimable})`);
  }
  console.log(`octanol–water log P from estimated descriptors vs measured (MNSol), n = ${estimated.octanolLogP.n}: ${f(estimated.octanolLogP)}`);
  // Engine speed on the fast path (recoveries only), as bench:chem measures it: the same parsed input again, and
  // new component objects every call (as stored work-ups arrive), with and without SMILES (Abraham vs Collander).
  const timing: Record<string, number> = {};
  for (const withSmiles of [false, true]) {
    const input = workupInputSchema.parse(timedWorkup(withSmiles));
    const fresh = Array.from({ length: 2000 }, (_, i) => ({ ...input, components: input.components.map((c) => ({ ...c, amountMmol: c.amountMmol * (1 + i / 4000) })) }));
    let next = 0;
    const tag = withSmiles ? "abraham" : "collander";
    timing[`${tag}SameUs`] = medianMicroseconds(() => { simulateWorkup(input, { steps: false, flags: false }); });
    timing[`${tag}FreshUs`] = medianMicroseconds(() => { simulateWorkup(fresh[next++ % fresh.length] as typeof input, { steps: false, flags: false }); });
  }
  console.log(`engine fast path, 9-step work-up, median µs per prediction: Collander ${timing.collanderSameUs} (new objects ${timing.collanderFreshUs}),` +
    ` Abraham ${timing.abrahamSameUs} (new objects ${timing.abrahamFreshUs})`);
  console.log(JSON.stringify({ validation: results, estimated, timing }));
}

if (import.meta.url === `file://${process.argv[1]}`) await main();
