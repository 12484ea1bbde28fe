/**
 * Detection study of the outcome judgement (lib/chem/predictive.ts, lib/workups/analysis.ts, causes.ts): synthetic
 * group histories with known truth, judged in order through the same analyzeOutcome the app uses, each outcome
 * learning from the ones before it. Truth:
 * - the engine's parameter error: once per group and template, the product's log P and pKa are drawn from the same
 *   spread the engine's Monte Carlo uses (stated se plus the Collander translation error to the extraction solvent),
 *   and the true recovery is the engine re-run with them (bounded by 100 %, skewed like the engine's own interval);
 *   each workup adds 1.5 % scatter (volumes, temperature, timing);
 * - handling losses per event, exponential (skewed), each group's own means off the common-practice figures by a
 *   lognormal factor; assay error by method (weight only reads 0–6 % high); reaction yields scattered ±5.5 % (sd)
 *   around each group's own figure;
 * - injected failures in 15 % of workups, re-run on the true parameters at realistic sizes: wrong layer kept, one
 *   extraction fewer, pH at the wrong value (acid: 1.5–3 units high, not enough acid; base: 3–4.5 units low,
 *   bicarbonate-strength basification), methanol co-solvent 60–100 % left in, 20–50 % lost with an emulsion (noted in
 *   80 % of cases), reaction giving 40–75 % of the product.
 * - half of the flagged workups get their true cause recorded at review (--found share), which the cause frequencies
 *   of the following judgements learn from.
 * Run: npm run bench:detection [-- --groups 12 --workups 150 --seed 1 --found 0.5 --show wrong_ph].
 * Targets: 95 % interval covers 93–97 % of clean workups; false flags ≤ 5 %; ≥ 90 % of failures flagged; the true
 * cause first in ≥ 80 % and in the top three in ≥ 95 % of flagged failures.
 */
import { createRng, type Rng } from "@/lib/chem/random";
import { type Operation, type WorkupInput, type WorkupInputRaw } from "@/lib/chem/schema";
import { simulateWorkup } from "@/lib/chem/predict";
import { solventTranslationSd } from "@/lib/chem/uncertainty";
import { HANDLING_PRIOR, fitGroupModel, insideAt, type AssayMethod, type HandlingStep } from "@/lib/chem/predictive";
import { handlingEvents } from "@/lib/chem/handling";
import { analyzeOutcome } from "@/lib/workups/analysis";
import { type CauseCode, type Simulator } from "@/lib/workups/causes";
import { causeFrequencies, historyCaseOf, type PastOutcome } from "@/lib/workups/judgement-history";
import { computePrediction } from "@/lib/workups/prediction";
import { median, nowMs } from "./lib/stats";

const mL = (value: number) => ({ value, unit: "mL" as const });

/** Invented moderately polar products, so that a skipped extraction or a wrong pH costs real material. */
/**
 * The saponification's co-solvent is methanol, the usual one. The engine puts THF left in the funnel mostly into the
 * EtOAc (no loss for this product), so a THF template would inject a "failure" with nothing to detect.
 */
function acidTemplate(): WorkupInputRaw {
  return {
    name: "Hydroxy acid from a saponification (MeOH/NaOH), acidified and extracted",
    components: [{ key: "p", name: "hydroxy acid", role: "product", molarMass: 166.17, amount: { value: 5, unit: "mmol" },
      logP: { value: 0.6, provenance: "literature", se: 0.1 }, pKas: [{ value: 4.2, kind: "acid", provenance: "literature", se: 0.1 }] }],
    mixture: { solvents: [{ solvent: "meoh", volume: mL(20) }], reagents: [{ reagent: "naoh_1m", volume: mL(20) }] },
    operations: [
      { type: "remove_cosolvent", solvent: "meoh", fractionRemoved: 0.95 },
      { type: "adjust_ph", reagent: "hcl_3m", targetPh: 2 },
      { type: "extract", solvent: "etoac", volume: mL(20), portions: 2, keep: "organic" },
      { type: "wash", reagent: "brine", volume: mL(10), portions: 1 },
      { type: "dry", agent: "mgso4", mass: { value: 3, unit: "g" } },
      { type: "concentrate", method: "rotavap" },
    ],
  };
}

function baseTemplate(): WorkupInputRaw {
  return {
    name: "Amino ether by pH swing (toluene, 3 M HCl, NaOH, DCM)",
    components: [{ key: "p", name: "amino ether", role: "product", molarMass: 179.26, amount: { value: 4, unit: "mmol" },
      logP: { value: 1.0, provenance: "literature", se: 0.1 }, pKas: [{ value: 8.6, kind: "base", provenance: "literature", se: 0.1 }] }],
    mixture: { solvents: [{ solvent: "toluene", volume: mL(25) }] },
    operations: [
      { type: "back_extract", reagent: "hcl_3m", volume: mL(10), portions: 2, keep: "aqueous" },
      { type: "adjust_ph", reagent: "naoh_10pct", targetPh: 12.5 },
      { type: "extract", solvent: "dcm", volume: mL(15), portions: 2, keep: "organic" },
      { type: "dry", agent: "na2so4", mass: { value: 3, unit: "g" } },
      { type: "concentrate", method: "rotavap" },
    ],
  };
}

interface Template {
  parsed: WorkupInput;
  /** Standard deviation of the product's log P as the engine's Monte Carlo draws it (stated se + translation). */
  logPSd: number;
  engine: { recovery: number; low: number | null; high: number | null };
  extractStep: number;
  acid: boolean;
}

function template(raw: WorkupInputRaw, acid: boolean): Template {
  const computed = computePrediction(raw, { library: {}, seed: 17, draws: 300 });
  const product = computed.parsed.components[0]!;
  return {
    parsed: computed.parsed, acid, logPSd: Math.hypot(product.logP?.se ?? 0.1, solventTranslationSd(computed.parsed)),
    engine: { recovery: computed.productRecovery ?? NaN, low: computed.recoveryLow, high: computed.recoveryHigh },
    extractStep: computed.parsed.operations.findIndex((op) => op.type === "extract"),
  };
}

const cache = new Map<string, number | null>();
const simulate: Simulator = (input) => {
  const key = JSON.stringify(input);
  if (!cache.has(key)) {
    try {
      const r = simulateWorkup(input, { steps: false, flags: false }).recovery["p"];
      cache.set(key, r !== undefined && Number.isFinite(r) ? r : null);
    } catch {
      cache.set(key, null);
    }
  }
  return cache.get(key) ?? null;
};

const withOps = (input: WorkupInput, f: (op: Operation, i: number) => Operation | null): WorkupInput =>
  ({ ...input, operations: input.operations.flatMap((op, i) => { const o = f(op, i); return o ? [o] : []; }) });
const between = (rng: Rng, a: number, b: number) => a + (b - a) * rng.uniform();

type Injected = CauseCode | null;

/** The template as it really behaves in one group: the product's log P and pKa drawn once from the engine's spread. */
function truthOf(t: Template, rng: Rng): WorkupInput {
  const dLogP = t.logPSd * rng.normal();
  return {
    ...t.parsed,
    components: t.parsed.components.map((c, k) => (k !== 0 ? c : {
      ...c,
      ...(c.logP ? { logP: { ...c.logP, value: c.logP.value + dLogP } } : {}),
      pKas: c.pKas.map((p) => ({ ...p, value: p.value + (p.se ?? 0.1) * rng.normal() })),
    })),
  };
}

/**
 * The failure's effect on log recovery (re-run on the true parameters, relative to the true clean recovery), and the
 * spec as the chemist recorded it (the recorded template, an emulsion noted or not).
 */
function inject(kind: Injected, template: Template, truth: WorkupInput, rng: Rng): { effect: number; spec: WorkupInput; phOff?: number } {
  const t = { ...template, parsed: truth };
  const r0 = simulate(truth) ?? template.engine.recovery;
  const rerun = (input: WorkupInput) => Math.log(Math.max(simulate(input) ?? 1e-6, 1e-6) / r0);
  switch (kind) {
    case "wrong_layer":
      return { effect: rerun(withOps(t.parsed, (op, i) => (i === t.extractStep && op.type === "extract" ? { ...op, keep: "aqueous" } : op))), spec: template.parsed };
    case "one_fewer_extraction":
      return { effect: rerun(withOps(t.parsed, (op, i) => (i === t.extractStep && op.type === "extract" ? { ...op, portions: op.portions - 1 } : op))), spec: template.parsed };
    case "wrong_ph": {
      const d = t.acid ? between(rng, 1.5, 3) : -between(rng, 3, 4.5);
      return { phOff: d, effect: rerun(withOps(t.parsed, (op) => (op.type === "adjust_ph" && op.targetPh !== undefined ? { ...op, targetPh: op.targetPh + d } : op))), spec: template.parsed };
    }
    case "cosolvent_not_removed": {
      const left = between(rng, 0.6, 1);
      return { effect: rerun(withOps(t.parsed, (op) => (op.type === "remove_cosolvent" ? (left > 0.999 ? null : { ...op, fractionRemoved: op.fractionRemoved * (1 - left) }) : op))), spec: template.parsed };
    }
    case "emulsion_loss": {
      const noted = rng.uniform() < 0.8;
      const spec = noted ? withOps(template.parsed, (op, i) => (i === t.extractStep ? { ...op, observed: { ...op.observed, interface: "emulsion" } } as Operation : op)) : template.parsed;
      return { effect: Math.log(1 - between(rng, 0.2, 0.5)), spec };
    }
    case "reaction_shortfall":
      return { effect: Math.log(between(rng, 0.4, 0.75)), spec: template.parsed };
    default: {
      // Clean workups note an emulsion now and then too (5 %), with no loss to show for it.
      const noted = rng.uniform() < 0.05;
      return { effect: 0, spec: noted ? withOps(template.parsed, (op, i) => (i === t.extractStep ? { ...op, observed: { ...op.observed, interface: "emulsion" } } as Operation : op)) : template.parsed };
    }
  }
}

/**
 * A share of records hold the pH read off paper after the adjustment (assumed 40 %: many chemists write "pH 2
 * (paper)", many do not). Paper reads to about half a unit; a wrong pH shows in the reading when one was taken.
 */
const PH_READ_SHARE = 0.4;
function withPhReading(spec: WorkupInput, off: number, rng: Rng): WorkupInput {
  if (rng.uniform() >= PH_READ_SHARE) return spec;
  return withOps(spec, (op) => {
    if (op.type !== "adjust_ph" || op.targetPh === undefined) return op;
    const read = Math.min(14, Math.max(0, Math.round(2 * (op.targetPh + off + 0.25 * rng.normal())) / 2));
    return { ...op, observed: { ...op.observed, pH: read } } as Operation;
  });
}

const METHODS: AssayMethod[] = ["qnmr", "hplc", "gc", "weight_only"];
const STEPS = Object.keys(HANDLING_PRIOR) as HandlingStep[];

interface Tally { clean: number; covered: number; falseFlags: number; failures: number; flagged: number; first: number; top3: number; ranked: number; byKind: Record<string, KindTally>; bands: { n: number; flagged: number }[]; byAssay: Record<"assayed" | "not assayed", { n: number; flagged: number }> }
/** Per kind of failure: how many, flagged, ranked, and the true loss and predictive sd (to see what is detectable). */
interface KindTally { n: number; flagged: number; first: number; top3: number; losses: number[]; sds: number[] }
/** Flagged share by the failure's true loss of product: what an outcome of this scatter can and cannot reveal. */
const LOSS_BANDS = [0.1, 0.2, 0.3, 1.01];

function runGroup(groupSeed: number, workups: number, templates: Template[], tally: Tally): void {
  const rng = createRng(groupSeed);
  // The group's own typical losses and reaction yield, off the common-practice figures.
  const lossMean = Object.fromEntries(STEPS.map((s) => [s, HANDLING_PRIOR[s].mean * Math.exp(0.5 * rng.normal())])) as Record<HandlingStep, number>;
  const yieldMean = Math.log(0.95) + 0.03 * rng.normal();
  // The engine's parameter error is the same every time this group runs a template (same compound, same solvents).
  const truths = templates.map((t) => truthOf(t, rng));
  const engineError = templates.map((t, k) => Math.log(Math.max(simulate(truths[k]!) ?? t.engine.recovery, 1e-6) / t.engine.recovery));
  const past: PastOutcome[] = [];
  for (let i = 0; i < workups; i++) {
    const ti = i % templates.length;
    const t = templates[ti]!;
    const assayed = rng.uniform() < 0.3;
    const method = METHODS[Math.floor(rng.uniform() * METHODS.length)]!;
    const kinds: CauseCode[] = ["wrong_layer", "one_fewer_extraction", "wrong_ph", "emulsion_loss", ...(t.acid ? ["cosolvent_not_removed" as const] : []), ...(assayed ? [] : ["reaction_shortfall" as const])];
    const kind: Injected = rng.uniform() < 0.15 ? kinds[Math.floor(rng.uniform() * kinds.length)]! : null;
    const injected = inject(kind, t, truths[ti]!, rng);
    const { effect } = injected;
    const spec = withPhReading(injected.spec, injected.phOff ?? 0, rng);
    const events = handlingEvents(t.parsed.operations);
    let handling = 0;
    for (const s of STEPS) for (let k = 0; k < events[s]; k++) handling += -lossMean[s] * Math.log(1 - rng.uniform());
    const trueEngine = Math.log(t.engine.recovery) + (engineError[ti] as number) + 0.015 * rng.normal();
    const expected = 5;
    const crudeTrue = expected * Math.exp(yieldMean + 0.055 * rng.normal());
    const reference = assayed ? crudeTrue * Math.exp(0.02 * rng.normal()) : null;
    const productMmol = crudeTrue * Math.exp(trueEngine - handling + effect);
    const assayError = method === "weight_only" ? Math.log(1 + between(rng, 0, 0.06)) : (method === "qnmr" ? 0.015 : 0.025) * rng.normal();
    const molarMass = t.parsed.components[0]!.molarMass;
    const outcome = method === "weight_only"
      ? { isolatedMassMg: productMmol * molarMass * Math.exp(assayError), purityPct: null, purityMethod: method }
      : { isolatedMassMg: (productMmol * molarMass) / 0.95, purityPct: 95 * Math.exp(assayError), purityMethod: method };
    const model = fitGroupModel(past.map((p) => historyCaseOf(p.analysis)).filter((h) => h !== null));
    const analysis = analyzeOutcome({
      outcome, spec, library: {}, model, causeFrequencies: causeFrequencies(past), simulate,
      header: { assayedProductMmol: reference, expectedProductMmol: expected },
      prediction: { workupVersion: 1, engineVersion: "bench", productKey: "p", productRecovery: t.engine.recovery, recoveryLow: t.engine.low, recoveryHigh: t.engine.high, flags: [] },
    });
    // A share of flagged workups gets its cause found when the group reviews it (the injected one; a clean workup
    // flagged by chance gets "other"); the rest are judged on the ranking alone.
    const reviewed = rng.uniform() < FOUND_SHARE;
    const found = analysis.flagged && reviewed ? (kind ?? "other") : null;
    past.push({ analysis, foundCause: found });
    const q = analysis.predictive?.quantile ?? NaN;
    if (kind === null) {
      tally.clean++;
      if (insideAt(q, 0.95)) tally.covered++;
      if (analysis.flagged) tally.falseFlags++;
      continue;
    }
    const k = (tally.byKind[kind] ??= { n: 0, flagged: 0, first: 0, top3: 0, losses: [], sds: [] });
    tally.failures++;
    k.n++;
    k.losses.push(1 - Math.exp(effect));
    const band = tally.bands[LOSS_BANDS.findIndex((b) => 1 - Math.exp(effect) < b)] ?? tally.bands.at(-1)!;
    band.n++;
    if (analysis.flagged) band.flagged++;
    const basis = tally.byAssay[assayed ? "assayed" : "not assayed"];
    basis.n++;
    if (analysis.flagged) basis.flagged++;
    k.sds.push(analysis.predictive?.logSd ?? NaN);
    if (SHOW === kind) {
      const reading = spec.operations.find((o) => o.type === "adjust_ph")?.observed?.pH;
      const top = analysis.causes.slice(0, 3).map((c) => `${c.code} ${(100 * c.score).toFixed(0)} % (gap ${(100 * c.fractionOfGap).toFixed(0)} %)`).join(", ");
      console.log(`    ${kind} ${t.acid ? "acid" : "base"} loss ${(100 * (1 - Math.exp(effect))).toFixed(0)} %${assayed ? " assayed" : ""}${reading !== undefined ? ` pH read ${reading}` : ""}: ${analysis.flagged ? "flagged" : "not flagged"}; ${top || "no cause listed"}`);
    }
    if (!analysis.flagged) continue;
    tally.flagged++;
    k.flagged++;
    tally.ranked++;
    const rank = analysis.causes.findIndex((c) => c.code === kind);
    if (rank === 0) { tally.first++; k.first++; }
    if (rank >= 0 && rank < 3) { tally.top3++; k.top3++; }
  }
}

/**
 * Share of flagged workups whose cause the group finds at review and records (assumed: half; --found 0 runs the
 * study without any findings, the model learning from its own rankings only).
 */
const FOUND_SHARE = argument("found", 0.5);

/** --show <cause>: list every injected failure of that kind with its judgement (to see why one is missed). */
const SHOW = (() => { const i = process.argv.indexOf("--show"); return i >= 0 ? process.argv[i + 1] : undefined; })();

function argument(name: string, fallback: number): number {
  const i = process.argv.indexOf(`--${name}`);
  const v = i >= 0 ? Number(process.argv[i + 1]) : NaN;
  return Number.isFinite(v) ? v : fallback;
}

function main(): void {
  const groups = argument("groups", 12);
  const workups = argument("workups", 150);
  const seed = argument("seed", 1);
  const t0 = nowMs();
  const templates = [template(acidTemplate(), true), template(baseTemplate(), false)];
  const tally: Tally = { clean: 0, covered: 0, falseFlags: 0, failures: 0, flagged: 0, first: 0, top3: 0, ranked: 0, byKind: {}, bands: LOSS_BANDS.map(() => ({ n: 0, flagged: 0 })), byAssay: { assayed: { n: 0, flagged: 0 }, "not assayed": { n: 0, flagged: 0 } } };
  const perGroup: number[] = [];
  for (let g = 0; g < groups; g++) {
    const g0 = nowMs();
    runGroup(seed * 1000 + g, workups, templates, tally);
    perGroup.push(nowMs() - g0);
  }
  const share = (a: number, b: number) => (b > 0 ? `${((100 * a) / b).toFixed(1)} %` : "—");
  console.log(`Detection study: ${groups} groups × ${workups} workups (seed ${seed}, causes found at review for ${(100 * FOUND_SHARE).toFixed(0)} % of flagged ones), engine recoveries ${templates.map((t) => t.engine.recovery.toFixed(3)).join(", ")}`);
  console.log(`  95 % interval covers clean workups: ${share(tally.covered, tally.clean)} of ${tally.clean} (target 93–97 %)`);
  console.log(`  false flags on clean workups:       ${share(tally.falseFlags, tally.clean)} (target ≤ 5 %)`);
  console.log(`  injected failures flagged:          ${share(tally.flagged, tally.failures)} of ${tally.failures} (target ≥ 90 %)`);
  console.log(`  true cause first (flagged ones):    ${share(tally.first, tally.ranked)} (target ≥ 80 %)`);
  console.log(`  true cause in the top three:        ${share(tally.top3, tally.ranked)} (target ≥ 95 %)`);
  console.log("    by kind (median true loss of the product, median predictive sd on the log scale):");
  for (const [kind, k] of Object.entries(tally.byKind)) {
    console.log(`    ${kind.padEnd(22)} n=${String(k.n).padStart(3)}  loss ${(100 * median(k.losses)).toFixed(0).padStart(3)} %  sd ${median(k.sds).toFixed(3)}  flagged ${share(k.flagged, k.n).padStart(7)}  first ${share(k.first, k.flagged).padStart(7)}  top 3 ${share(k.top3, k.flagged).padStart(7)}`);
  }
  console.log(`    by true loss: ${tally.bands.map((b, i) => `${i === 0 ? "<" : `${(100 * LOSS_BANDS[i - 1]!).toFixed(0)}–`}${(100 * Math.min(1, LOSS_BANDS[i]!)).toFixed(0)} % flagged ${share(b.flagged, b.n)} of ${b.n}`).join(", ")}`);
  console.log(`    by crude: ${Object.entries(tally.byAssay).map(([k, b]) => `${k} flagged ${share(b.flagged, b.n)} of ${b.n}`).join(", ")}`);
  console.log(`  time: median ${median(perGroup).toFixed(0)} ms per group history, total ${(nowMs() - t0).toFixed(0)} ms`);
}

main();
