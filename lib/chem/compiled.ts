/**
 * Compile once, run many times: a work-up bound to its compiled library and a simulator of its own, re-run with
 * changed numbers (WorkupParameters: log P, log K, pKa, volumes, amounts, target pH) and read back as the
 * recoveries, purities and crude mass only. The Monte-Carlo engine and bulk re-prediction use it; one run gives
 * exactly what simulateWorkup(input, { steps: false, flags: false }) gives for the same numbers, except that
 * with `rememberPh` each contact's pH search starts from that contact's pH in the first run (a difference of
 * order 1e-10 in pH, and about three charge-balance evaluations per contact instead of about seven).
 */
import { libraryForWorkup, type CompiledLibrary, type EngineLibraryOptions } from "./library";
import { RETAINED_SOLVENT_BP_C } from "./operations";
import { assignParameters, copyParameters, readParameters, type WorkupParameters } from "./parameters";
import { simulateWorkup } from "./predict";
import { type WorkupInput } from "./schema";
import { Simulator } from "./simulator";
import { type WorkupSimulator } from "./uncertainty";

export type { EngineLibraryOptions } from "./library";

export interface CompileOptions {
  /** Start each contact's pH search from its pH in the first run (default false: every run starts afresh). */
  rememberPh?: boolean;
}

export class CompiledWorkup {
  input: WorkupInput;
  /** The input's own numbers, and the numbers the next run uses (edit these in place). */
  readonly nominal: WorkupParameters;
  readonly params: WorkupParameters;
  /** After run(): per component in input order, fraction 0–1 of the starting amount isolated, and % of the crude. */
  recovery: Float64Array;
  purityPct: Float64Array;
  crudeMassMg = Number.NaN;
  private sim: Simulator;

  constructor(input: WorkupInput, private readonly options: EngineLibraryOptions = {}, private readonly compile: CompileOptions = {}) {
    this.input = input;
    this.sim = this.simulatorFor(libraryForWorkup(input, options).lib, input.components.length);
    this.nominal = readParameters(input);
    this.params = copyParameters(this.nominal);
    this.recovery = new Float64Array(input.components.length);
    this.purityPct = new Float64Array(input.components.length);
  }

  get componentKeys(): string[] {
    return this.input.components.map((c) => c.key);
  }

  /** Switches to another work-up (bulk re-prediction); the library and simulator are kept when its solvents match. */
  load(input: WorkupInput): void {
    const lib = libraryForWorkup(input, this.options).lib;
    const n = input.components.length;
    if (lib !== this.sim.lib || n !== this.sim.componentCount) this.sim = this.simulatorFor(lib, n);
    else if (this.sim.phMemory && !sameSteps(input, this.input)) this.sim.phMemory = [];
    if (this.recovery.length !== n) {
      this.recovery = new Float64Array(n);
      this.purityPct = new Float64Array(n);
    }
    this.input = input;
    readParameters(input, this.nominal);
    readParameters(input, this.params);
  }

  /** Puts the input's own numbers back into `params`. */
  reset(): void {
    assignParameters(this.params, this.nominal);
  }

  /** Simulates with `params`; throws as simulateWorkup does. */
  run(): void {
    const { sim, params } = this;
    sim.begin(this.input, params, false);
    sim.run();
    const { lib, comps } = sim;
    const iso = sim.current;
    // The same sums, in the same order, as the prediction's crude mass and purity (predict.ts).
    let solventMg = 0;
    for (let i = 0; i < lib.solventKeys.length; i++) {
      const v = iso.solv[i] as number;
      if (v <= 1e-9 || (lib.bpC[i] as number) < RETAINED_SOLVENT_BP_C.rotavap) continue;
      solventMg += v * (lib.density[i] as number) * 1000;
    }
    let componentMg = 0;
    for (let c = 0; c < comps.count; c++) componentMg += (iso.comp[c] as number) * (comps.molarMass[c] as number);
    const crude = componentMg + solventMg;
    for (let c = 0; c < comps.count; c++) {
      const isolated = iso.comp[c] as number;
      const start = params.amountMmol[c] as number;
      this.recovery[c] = start > 0 ? isolated / start : 0;
      this.purityPct[c] = crude > 0 ? (100 * (isolated * (comps.molarMass[c] as number))) / crude : 0;
    }
    this.crudeMassMg = crude;
  }

  private simulatorFor(lib: CompiledLibrary, n: number): Simulator {
    const sim = new Simulator(lib, n);
    sim.phMemory = this.compile.rememberPh ? [] : null;
    sim.lean = true;
    return sim;
  }
}

/** Same operation types in the same order and the same numbers of portions: the contacts line up. */
function sameSteps(a: WorkupInput, b: WorkupInput): boolean {
  if (a.operations.length !== b.operations.length) return false;
  return a.operations.every((op, i) => {
    const other = b.operations[i];
    return other !== undefined && other.type === op.type && ("portions" in op ? op.portions : 1) === ("portions" in other ? other.portions : 1);
  });
}

export function compileWorkup(input: WorkupInput, options: EngineLibraryOptions = {}, compile: CompileOptions = {}): CompiledWorkup {
  return new CompiledWorkup(input, options, compile);
}

const engines = new WeakMap<WorkupSimulator, EngineLibraryOptions>();

/**
 * simulateWorkup with these library options, as a WorkupSimulator that propagateUncertainty recognises and runs
 * on a compiled work-up instead of a perturbed copy per draw.
 */
export function engineSimulator(options: EngineLibraryOptions = {}): WorkupSimulator {
  const simulate: WorkupSimulator = (input, o) => simulateWorkup(input, { ...options, ...o });
  engines.set(simulate, options);
  return simulate;
}

/** The library options of the engine behind `simulate`, or undefined for any other simulator. */
export function engineOptionsOf(simulate: WorkupSimulator): EngineLibraryOptions | undefined {
  return simulate === simulateWorkup ? {} : engines.get(simulate);
}
