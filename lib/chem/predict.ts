/**
 * Public entry points. predictWorkup validates once (schema, then references to the library) and calls
 * simulateWorkup, the fast path that trusts its input: the Monte-Carlo engine calls it thousands of times.
 */
import { type CompiledComponents } from "./components";
import { evaluateCautions } from "./cautions";
import { evaluateFlags, type FlagContext } from "./flags";
import { lossesByBucket } from "./losses";
import { libraryForWorkup, resolveLibrary, type CompiledLibrary, type Library, type LibraryOverrides } from "./library";
import { checkLayerSequence } from "./layer-sequence";
import { RETAINED_SOLVENT_BP_C } from "./operations";
import { readParameters } from "./parameters";
import { contactResult, sideStream, summarize } from "./report";
import { workupInputSchema, type WorkupInput, type WorkupInputRaw } from "./schema";
import { suggestKey, withoutUnknownKeys } from "./schema-strict";
import { acquireSimulator, releaseSimulator, type Simulator } from "./simulator";
import { type ComponentOutcome, type ContactResult, type StepResult, type WorkupPrediction } from "./types";
import { ENGINE_VERSION } from "./version";

export interface PredictOptions extends LibraryOverrides {
  /** Build every step's phase detail (default true). Monte-Carlo callers pass false for recoveries only. */
  steps?: boolean;
  /** Evaluate failure-mode flags and safety cautions (default true). */
  flags?: boolean;
  /** Treat every solvent as insoluble in water and water as insoluble in it (textbook comparisons; default false). */
  idealPhases?: boolean;
}

export interface ValidationIssue {
  path: string;
  message: string;
}

export class WorkupValidationError extends Error {
  readonly status = 422;
  constructor(readonly issues: ValidationIssue[]) {
    super(issues.map((i) => (i.path ? `${i.path}: ${i.message}` : i.message)).join("; "));
    this.name = "WorkupValidationError";
  }
}

export type ValidationResult = { success: true; data: WorkupInput } | { success: false; issues: ValidationIssue[] };

export interface ValidateOptions extends LibraryOverrides {
  /**
   * A description the app stored itself, read again (a saved version, the group's own export): keys the schema
   * does not know are dropped instead of refused, and so are log K values for solvents no longer in the library.
   * Neither ever changed a prediction; a stored record must stay readable after the schema tightened.
   */
  stored?: boolean;
}

/** Schema check plus every solvent, reagent and drying agent named must exist in the library. */
export function validateWorkup(input: unknown, options: ValidateOptions = {}): ValidationResult {
  const parsed = workupInputSchema.safeParse(options.stored ? withoutUnknownKeys(workupInputSchema, input).value : input);
  if (!parsed.success) {
    return { success: false, issues: parsed.error.issues.map((i) => ({ path: i.path.map(String).join("."), message: i.message })) };
  }
  const lib = resolveLibrary(options);
  if (options.stored) {
    for (const c of parsed.data.components) for (const key of Object.keys(c.logK)) if (!lib.solvents[key]) delete c.logK[key];
  }
  const issues = checkLibraryReferences(parsed.data, lib);
  return issues.length > 0 ? { success: false, issues } : { success: true, data: parsed.data };
}

export function checkLibraryReferences(w: WorkupInput, lib: Library): ValidationIssue[] {
  const issues: ValidationIssue[] = [];
  const solvent = (path: string, key: string, organic = false) => {
    const s = lib.solvents[key];
    if (!s) issues.push({ path, message: `unknown solvent '${key}'` });
    else if (organic && (s.waterMiscible || key === "water")) issues.push({ path, message: `'${key}' is water-miscible and cannot form an extraction layer` });
  };
  const reagent = (path: string, key: string, solid: boolean) => {
    const r = lib.reagents[key];
    if (!r) issues.push({ path, message: `unknown reagent '${key}'` });
    else if ((r.kind === "solid") !== solid) issues.push({ path, message: solid ? `'${key}' is not a solid salt` : `'${key}' is a solid; use add_salt` });
  };
  w.mixture.solvents.forEach((s, i) => solvent(`mixture.solvents.${i}.solvent`, s.solvent));
  w.mixture.reagents.forEach((r, i) => reagent(`mixture.reagents.${i}.reagent`, r.reagent, false));
  w.operations.forEach((op, i) => {
    const p = `operations.${i}`;
    switch (op.type) {
      case "charge": solvent(`${p}.solvent`, op.solvent); break;
      case "extract": solvent(`${p}.solvent`, op.solvent, true); break;
      case "remove_cosolvent": solvent(`${p}.solvent`, op.solvent); break;
      case "quench": case "wash": case "back_extract": case "adjust_ph": reagent(`${p}.reagent`, op.reagent, false);
        if (op.type === "quench" || op.type === "adjust_ph") {
          const r = lib.reagents[op.reagent];
          if (r && op.amountMmol !== undefined && !(r.basis.value > 0)) issues.push({ path: `${p}.amount`, message: `'${op.reagent}' has no concentration; give a volume` });
        }
        break;
      case "add_salt": reagent(`${p}.salt`, op.salt, true); break;
      case "dry": if (!lib.dryingAgents[op.agent]) issues.push({ path: `${p}.agent`, message: `unknown drying agent '${op.agent}'` }); break;
      default: break;
    }
    if ((op.type === "dry" || op.type === "filter") && op.rinse) solvent(`${p}.rinse.solvent`, op.rinse.solvent);
  });
  if (issues.length === 0) issues.push(...checkLayerSequence(w, lib));
  const solventKeys = Object.keys(lib.solvents);
  w.components.forEach((c, i) => {
    for (const key of Object.keys(c.logK)) {
      if (lib.solvents[key]) continue;
      const near = suggestKey(key, solventKeys);
      issues.push({ path: `components.${i}.logK.${key}`, message: `log K for unknown solvent '${key}'${near ? `; did you mean '${near}'?` : ""}` });
    }
    c.ionPairLogKex.forEach((k, j) => solvent(`components.${i}.ionPairLogKex.${j}.solvent`, k.solvent, true));
    // A permanent ion with its own extraction constants has no neutral form for a log P to describe.
    const pairedIon = c.fixedCharge !== 0 && c.ionPairLogKex.length > 0;
    if (!c.logP && Object.keys(c.logK).length === 0 && !pairedIon) issues.push({ path: `components.${i}.logP`, message: `component '${c.key}' needs logP or a logK for a solvent` });
  });
  return issues;
}

export function predictWorkup(input: WorkupInputRaw, options: PredictOptions = {}): WorkupPrediction {
  const v = validateWorkup(input, options);
  if (!v.success) throw new WorkupValidationError(v.issues);
  return simulateWorkup(v.data, options);
}

/** Fast path: no validation, no zod. `parsed` must come from workupInputSchema (or be a perturbed copy of one). */
export function simulateWorkup(parsed: WorkupInput, options: PredictOptions = {}): WorkupPrediction {
  const { library, lib } = libraryForWorkup(parsed, options);
  const detail = options.steps !== false;
  const withFlags = options.flags !== false;
  const sim = acquireSimulator(lib, parsed.components.length);
  try {
    sim.begin(parsed, readParameters(parsed, sim.params, lib.solventKeys), withFlags);
    const comps = sim.comps;
    const steps: StepResult[] = [];
    let contacts: ContactResult[] = [];
    if (detail) sim.onContact = (ctx, out) => contacts.push(contactResult(lib, comps, sim.eq, out, ctx.portion));
    sim.run(detail ? (index, op, details, sideBefore) => {
      steps.push({
        index, type: op.type, label: op.label ?? op.type, contacts, details,
        kept: summarize(lib, comps, sim.current, sim.residue),
        sideStreams: sim.side.slice(sideBefore).map((x) => sideStream(lib, comps, x)),
      });
      contacts = [];
    } : undefined);
    return assemble(parsed, library, lib, comps, sim, steps, withFlags);
  } finally {
    releaseSimulator(sim);
  }
}

function assemble(w: WorkupInput, library: Library, lib: CompiledLibrary, comps: CompiledComponents, sim: Simulator,
  steps: StepResult[], withFlags: boolean): WorkupPrediction {
  const iso = sim.current;
  const residualSolventsMg: Record<string, number> = {};
  let solventMg = 0;
  for (let i = 0; i < lib.solventKeys.length; i++) {
    const v = iso.solv[i] as number;
    if (v <= 1e-9 || (lib.bpC[i] as number) < RETAINED_SOLVENT_BP_C.rotavap) continue;
    const mg = v * (lib.density[i] as number) * 1000;
    residualSolventsMg[lib.solventKeys[i] as string] = mg;
    solventMg += mg;
  }
  let componentMg = 0;
  for (let c = 0; c < comps.count; c++) componentMg += (iso.comp[c] as number) * (comps.molarMass[c] as number);
  const crudeMassMg = componentMg + solventMg;
  const recovery: Record<string, number> = {};
  const purityPct: Record<string, number> = {};
  const components: ComponentOutcome[] = w.components.map((c, ci) => {
    const isolatedMmol = iso.comp[ci] as number;
    const r = c.amountMmol > 0 ? isolatedMmol / c.amountMmol : 0;
    const mg = isolatedMmol * c.molarMass;
    const purity = crudeMassMg > 0 ? (100 * mg) / crudeMassMg : 0;
    recovery[c.key] = r;
    purityPct[c.key] = purity;
    return { key: c.key, name: c.name, role: c.role, startMmol: c.amountMmol, isolatedMmol, recovery: r, isolatedMg: mg, purityPct: purity };
  });
  const productIndex = w.components.findIndex((c) => c.role === "product");
  const sideStreams = sim.side.map((x) => sideStream(lib, comps, x));
  const ctx: FlagContext = {
    input: w, library, lib, comps, contacts: sim.contacts, steps: sim.stepTraces, side: sim.side, isolated: iso,
    recovery: Float64Array.from(components, (c) => c.recovery), productIndex, crudeMassMg, residualSolventsMg,
  };
  return {
    engineVersion: ENGINE_VERSION,
    steps,
    isolated: summarize(lib, comps, iso, sim.residue),
    components,
    recovery,
    purityPct,
    crudeMassMg,
    residualSolventsMg,
    productKey: productIndex >= 0 ? (w.components[productIndex]?.key ?? null) : null,
    sideStreams,
    // Skipped on the recoveries-only path (Monte Carlo), which reads no losses.
    ...(withFlags || steps.length > 0 ? { losses: lossesByBucket(sideStreams, Object.fromEntries(w.components.map((c) => [c.key, c.amountMmol]))) } : {}),
    flags: withFlags ? evaluateFlags(ctx) : [],
    cautions: withFlags ? evaluateCautions(ctx) : [],
  };
}
