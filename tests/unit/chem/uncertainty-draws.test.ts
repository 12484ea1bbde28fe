/**
 * The Monte-Carlo draw loop (compiled work-up, numbers rewritten in place, pH searches started from the nominal
 * run, recoveries only) against a reference written here from scratch: for each draw the same standard normals
 * are applied to a deep copy of the input by walking each uncertain input's path, the copy is simulated with
 * every step, flag and caution (the traced path), and the intervals are taken from sorted samples. Same seed,
 * same draws: the intervals must agree to numerical noise, on every example work-up and the benchmark's.
 */
import { readdirSync, readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { benchWorkup } from "../../../bench/chem.bench";
import { simulateWorkup, validateWorkup } from "@/lib/chem/predict";
import { createRng } from "@/lib/chem/random";
import { workupInputSchema, type WorkupInput } from "@/lib/chem/schema";
import { propagateUncertainty, type Interval, type UncertainInput } from "@/lib/chem/uncertainty";

function example(file: string): WorkupInput {
  const v = validateWorkup(JSON.parse(readFileSync(`examples/${file}`, "utf8")));
  if (!v.success) throw new Error(JSON.stringify(v.issues));
  return v.data;
}

/** A copy of `input` with uncertain input s moved by sd·z[s]: log and pH values additively, volumes and amounts
 * by the factor exp(sd·z), the ion-pair shift of a solvent added to the copy's own. */
function perturbedCopy(input: WorkupInput, sites: readonly UncertainInput[], z: Float64Array): WorkupInput {
  const copy = structuredClone(input) as unknown as Record<string, unknown>;
  sites.forEach((site, s) => {
    const dz = site.sd * (z[s] as number);
    const parts = site.path.split(".");
    if (parts[0] === "ionPair") {
      const shift = { ...((copy.ionPairShift as Record<string, number> | undefined) ?? {}) };
      shift[parts[1] as string] = (shift[parts[1] as string] ?? 0) + dz;
      copy.ionPairShift = shift;
      return;
    }
    // log P, log K and pKa values are objects with a `value`; volumes, amounts and pH are plain numbers.
    let holder = copy;
    for (const part of parts.slice(0, -1)) holder = holder[part] as Record<string, unknown>;
    const last = parts[parts.length - 1] as string;
    const target = holder[last];
    const box = typeof target === "object" && target !== null ? (target as Record<string, unknown>) : holder;
    const field = box === holder ? last : "value";
    const value = box[field] as number;
    box[field] = site.scale === "relative" ? value * Math.exp(dz) : value + dz;
  });
  return copy as unknown as WorkupInput;
}

/** Linear interpolation between order statistics at rank (n − 1)·p of the sorted sample. */
function percentile(sorted: readonly number[], p: number): number {
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h);
  const a = sorted[lo] as number;
  const b = sorted[Math.min(lo + 1, sorted.length - 1)] as number;
  return a + (h - lo) * (b - a);
}

function reference(values: number[]): Interval {
  const sorted = [...values].sort((a, b) => a - b);
  const mean = values.reduce((s, v) => s + v, 0) / values.length;
  const sd = Math.sqrt(values.reduce((s, v) => s + (v - mean) ** 2, 0) / (values.length - 1));
  return { p025: percentile(sorted, 0.025), p50: percentile(sorted, 0.5), p975: percentile(sorted, 0.975), mean, sd };
}

/** Tetrabutylammonium bromide with naphthalene, taken from water into chloroform (its published extraction
 * constants are uncertain inputs too). */
const quaternary = workupInputSchema.parse({
  components: [
    { key: "tbab", name: "Tetrabutylammonium bromide", role: "reagent", molarMass: 322.37, amount: { value: 2, unit: "mmol" }, smiles: "CCCC[N+](CCCC)(CCCC)CCCC.[Br-]" },
    { key: "naphthalene", name: "Naphthalene", role: "product", molarMass: 128.17, amount: { value: 5, unit: "mmol" }, logP: { value: 3.34, provenance: "literature" } },
  ],
  mixture: { solvents: [{ solvent: "water", volume: { value: 40, unit: "mL" } }] },
  operations: [{ type: "extract", solvent: "chcl3", volume: { value: 20, unit: "mL" }, portions: 2, keep: "organic" }, { type: "wash", reagent: "brine", volume: { value: 20, unit: "mL" } }],
});

const cases: Array<[string, WorkupInput]> = [
  ...readdirSync("examples").filter((f) => f.endsWith(".json")).sort().map((f): [string, WorkupInput] => [f, example(f)]),
  ["bench work-up", workupInputSchema.parse(benchWorkup())],
  ["tetrabutylammonium bromide into chloroform", quaternary],
];

describe("Monte-Carlo draw loop against perturbed copies simulated in full", () => {
  it.each(cases)("%s: same percentiles, mean and sd for the same seed", (_name, input) => {
    const draws = 120;
    const seed = 17;
    const fast = propagateUncertainty(input, simulateWorkup, { draws, seed });
    const rng = createRng(seed);
    const z = new Float64Array(fast.inputs.length);
    const recovery = new Map<string, number[]>(input.components.map((c) => [c.key, []]));
    const purity = new Map<string, number[]>(input.components.map((c) => [c.key, []]));
    const crude: number[] = [];
    let failed = 0;
    for (let d = 0; d < draws; d++) {
      for (let s = 0; s < z.length; s++) z[s] = rng.normal();
      let result;
      try {
        result = simulateWorkup(perturbedCopy(input, fast.inputs, z));
      } catch {
        failed++;
        continue;
      }
      for (const c of input.components) {
        recovery.get(c.key)?.push(result.recovery[c.key] as number);
        purity.get(c.key)?.push(result.purityPct[c.key] as number);
      }
      crude.push(result.crudeMassMg);
    }
    expect(fast.failedDraws).toBe(failed);
    const close = (got: Interval, want: Interval, tolerance: number, what: string) => {
      for (const k of ["p025", "p50", "p975", "mean", "sd"] as const) {
        expect(Math.abs(got[k] - want[k]), `${what} ${k}: ${got[k]} vs ${want[k]}`).toBeLessThanOrEqual(tolerance);
      }
    };
    for (const c of input.components) {
      const got = fast.components[c.key];
      if (!got) throw new Error(`no interval for ${c.key}`);
      // Recoveries are fractions 0–1 and purities percentages; 1e-8 of either is far below the Monte-Carlo spread.
      close(got.recovery, reference(recovery.get(c.key) ?? []), 1e-8, `${c.key} recovery`);
      close(got.purityPct, reference(purity.get(c.key) ?? []), 1e-6, `${c.key} purity`);
    }
    const crudeRef = reference(crude);
    close(fast.crudeMassMg, crudeRef, 1e-8 * Math.max(1, crudeRef.p975), "crude mass");
  });
});
