/**
 * State of one simulated work-up: the main-line stream, streams saved under a name, streams that left the main
 * line (waste, drying agent, filter cake, evaporated), and the contact/step traces. The per-operation logic is in
 * operations.ts, what a contact records for the flags in contact-trace.ts; this file holds the shared mechanics
 * (equilibrate, split, save or discard).
 * A simulator is reused from run to run (begin → run): its streams come from a pool that each run takes again
 * from the start, and the numbers it reads (log P, pKa, volumes, …) sit in a WorkupParameters, so a Monte-Carlo
 * draw allocates almost nothing. Nothing a run returns may hold a pooled stream.
 */
import { reagentPh, systemBoundProtons } from "./aqueous";
import { allocateComponents, fillComponents, type CompiledComponents } from "./components";
import { traceContact } from "./contact-trace";
import { Equilibrator, type PhMemo } from "./equilibrium";
import { CARBONATE, WATER, type CompiledLibrary, type CompiledReagent } from "./library";
import { applyOperation, type StepDetails } from "./operations";
import { emptyParameters, type WorkupParameters } from "./parameters";
import { type Operation, type OperationType, type WorkupInput } from "./schema";
import { addAt, copyInto, Stream } from "./stream";
import { type ContactTrace, type StepTrace } from "./trace";
import { type SideStream } from "./types";

export interface SideInternal {
  step: number;
  name: string;
  fate: SideStream["fate"];
  stream: Stream;
}

export interface ContactContext {
  step: number;
  opType: OperationType;
  portion: number;
  keep: "organic" | "aqueous" | null;
  reagentKey: string | null;
  reagent: CompiledReagent | null;
  /** Free acid, base and carbonate-bound protons of the streams before mixing (for heat); null when not tracing. */
  before: AcidBaseContent | null;
  temperatureC: number;
}

export interface AcidBaseContent {
  h: number;
  oh: number;
  carbonateProtons: number;
}

export interface ContactOutcome {
  org: Stream;
  aq: Stream;
  trace: ContactTrace | null;
}

export class Simulator {
  input!: WorkupInput;
  params: WorkupParameters = emptyParameters();
  readonly comps: CompiledComponents;
  current: Stream;
  residue = false;
  readonly saved = new Map<string, SideInternal>();
  side: SideInternal[] = [];
  contacts: ContactTrace[] = [];
  stepTraces: StepTrace[] = [];
  readonly eq: Equilibrator;
  tracing = false;
  /** Called after each contact when the caller wants per-step phase detail. */
  onContact: ((ctx: ContactContext, out: ContactOutcome) => void) | null = null;
  /** pH at each contact of the first run since the memory was emptied, where the same contact's pH search starts
   * in later runs (Monte Carlo); null for a run that must not depend on the runs before it. */
  phMemory: PhMemo[] | null = null;
  /** Temperature the equilibrator was last set to, °C. */
  private temperatureC = Number.NaN;
  /** Set while a shared simulator is in use (see predict.ts). */
  busy = false;
  /**
   * A run whose caller reads back the isolated stream only (a compiled work-up: Monte-Carlo draws, bulk
   * re-prediction): the steps build no details and streams sent to waste are not recorded (saved ones are).
   */
  lean = false;
  private readonly pool: Stream[] = [];
  private pooled = 0;
  private readonly scratchStreams: Stream[] = [];
  private contactIndex = 0;
  private readonly untracedOutcome: ContactOutcome;
  private readonly unreadStream: Stream;

  constructor(readonly lib: CompiledLibrary, readonly componentCount: number) {
    this.comps = allocateComponents(componentCount, lib);
    this.eq = new Equilibrator(lib, this.comps);
    this.current = this.newStream();
    this.untracedOutcome = { org: this.current, aq: this.current, trace: null };
    this.unreadStream = new Stream(lib.solventKeys.length, this.comps.count);
  }

  /** Starts a run of `input` with the numbers in `params` (read from it, or perturbed). */
  begin(input: WorkupInput, params: WorkupParameters, tracing: boolean): void {
    const { lib, comps } = this;
    this.input = input;
    this.params = params;
    this.tracing = tracing;
    this.onContact = null;
    fillComponents(comps, input.components, params, lib);
    this.eq.componentsChanged();
    this.eq.setIonPairShift(params.ionPairShift);
    this.eq.lastSolved = NaN;
    this.pooled = 0;
    this.contactIndex = 0;
    this.residue = false;
    // New arrays rather than length = 0, which V8 runs as a slower runtime call.
    if (this.saved.size > 0) this.saved.clear();
    if (this.side.length > 0) this.side = [];
    if (this.contacts.length > 0) this.contacts = [];
    if (this.stepTraces.length > 0) this.stepTraces = [];
    const cur = this.newStream();
    this.current = cur;
    const { solvents, reagents } = input.mixture;
    for (let i = 0; i < solvents.length; i++) {
      addAt(cur.solv, lib.solventIndex.get((solvents[i] as { solvent: string }).solvent) ?? WATER, params.mixtureSolventMl[i] as number);
    }
    for (let i = 0; i < reagents.length; i++) {
      const r = lib.reagents.get((reagents[i] as { reagent: string }).reagent);
      if (r) cur.addReagent(r, params.mixtureReagentMl[i] as number, lib.density[WATER] as number);
    }
    copyInto(cur.comp, comps.startMmol);
    for (let c = 0; c < comps.count; c++) {
      const ions = comps.saltIons[c] as number;
      if (ions === 0) continue;
      const n = comps.startMmol[c] as number;
      cur.strongCharge += (comps.saltCharge[c] as number) * n;
      cur.strongZ2 += ions * n;
      cur.osmoles += ions * n;
    }
  }

  /** Applies every operation in order; `afterStep` (detail mode) sees each step as it ends. */
  run(afterStep?: (index: number, op: Operation, details: StepDetails, sideBefore: number) => void): void {
    const ops = this.input.operations;
    for (let i = 0; i < ops.length; i++) {
      const op = ops[i] as Operation;
      const index = i + 1;
      const firstContact = this.contacts.length;
      const sideBefore = this.side.length;
      const temperatureC = op.temperatureC ?? this.input.temperatureC;
      if (temperatureC !== this.temperatureC) {
        this.temperatureC = temperatureC;
        this.eq.setTemperature(temperatureC);
      }
      const details = applyOperation(this, op, index);
      if (this.tracing) this.stepTraces.push({ index, type: op.type, details, firstContact, contactCount: this.contacts.length - firstContact });
      afterStep?.(index, op, details, sideBefore);
    }
  }

  /** An empty stream from the pool. */
  newStream(): Stream {
    const s = this.pool[this.pooled++];
    if (s) {
      s.clear();
      return s;
    }
    const fresh = new Stream(this.lib.solventKeys.length, this.comps.count);
    this.pool.push(fresh);
    return fresh;
  }

  /** Empty stream number `k` of a small set for trial mixtures that never leave the operation using them. */
  scratch(k: number): Stream {
    let s = this.scratchStreams[k];
    if (!s) {
      s = new Stream(this.lib.solventKeys.length, this.comps.count);
      this.scratchStreams[k] = s;
    } else s.clear();
    return s;
  }

  solventIndex(key: string): number {
    const i = this.lib.solventIndex.get(key);
    if (i === undefined) throw new Error(`unknown solvent '${key}'`);
    return i;
  }

  reagent(key: string): CompiledReagent {
    const r = this.lib.reagents.get(key);
    if (!r) throw new Error(`unknown reagent '${key}'`);
    return r;
  }

  /** A fresh portion of reagent solution (volume in mL). */
  freshReagent(r: CompiledReagent, volumeMl: number): Stream {
    const s = this.newStream();
    s.addReagent(r, volumeMl, this.lib.density[WATER] as number);
    s.lastPh = reagentPh(r);
    return s;
  }

  /** Equilibrates a mixture into two new streams and records the contact. `aqueousRead` false: nothing will read
   * the aqueous layer (a lean run discarding it), which is then left empty. */
  contact(mix: Stream, ctx: ContactContext, aqueousRead = true): ContactOutcome {
    const traced = this.tracing || this.onContact !== null;
    const org = this.newStream();
    // An aqueous layer nobody reads is left empty: one stream, never cleared, stands for all of them.
    const aq = aqueousRead || traced ? this.newStream() : this.unreadStream;
    const eq = this.eq;
    const k = this.contactIndex++;
    const memory = this.phMemory;
    let memo: PhMemo | null = null;
    if (memory) {
      memo = memory[k] ?? null;
      if (!memo) {
        memo = { pH: Number.NaN, h: Number.NaN, ionicStrength: Number.NaN };
        memory.push(memo);
      }
    }
    eq.equilibrate(mix, org, aq, memo, aqueousRead || traced);
    let trace: ContactTrace | null = null;
    if (traced) trace = traceContact(this, mix, org, aq, ctx);
    // Untraced, the caller reads the two layers at once: one outcome object serves every contact.
    const out = traced ? { org, aq, trace } : this.untracedOutcome;
    out.org = org;
    out.aq = aq;
    if (trace) this.contacts.push(trace);
    this.onContact?.(ctx, out);
    return out;
  }

  /** Acid–base content of streams about to be mixed; null when no trace is kept (Monte-Carlo path). */
  acidBase(...streams: Stream[]): AcidBaseContent | null {
    if (!this.tracing && !this.onContact) return null;
    let h = 0, oh = 0, carbonateProtons = 0;
    for (const s of streams) {
      if (!Number.isFinite(s.lastPh)) continue;
      const hc = 10 ** -s.lastPh;
      const v = s.solv[WATER] as number;
      h += hc * v;
      oh += (1e-14 / hc) * v;
      carbonateProtons += (s.sys[CARBONATE] as number) * systemBoundProtons(CARBONATE, hc);
    }
    return { h, oh, carbonateProtons };
  }

  componentMass(s: Stream): number {
    let m = 0;
    for (let c = 0; c < this.comps.count; c++) m += ((s.comp[c] as number) * (this.comps.molarMass[c] as number)) / 1000;
    return m;
  }

  /** Sends a stream off the main line: saved under `saveAs`, else to waste. */
  divert(step: number, stream: Stream, saveAs: string | undefined, name: string): void {
    if (saveAs !== undefined) {
      const rec: SideInternal = { step, name: saveAs, fate: "saved", stream };
      this.saved.set(saveAs, rec);
      this.side.push(rec);
    } else if (!this.lean) {
      this.side.push({ step, name, fate: "waste", stream });
    }
  }

  leave(step: number, stream: Stream, fate: SideStream["fate"], name: string): void {
    if (!this.lean) this.side.push({ step, name, fate, stream });
  }
}

const shared = new WeakMap<CompiledLibrary, Map<number, Simulator>>();

/**
 * A simulator for this library and component count, reused from call to call; a call made while another run
 * is under way (from inside a rule, say) gets a new one. Hand it back with `releaseSimulator`.
 */
export function acquireSimulator(lib: CompiledLibrary, componentCount: number): Simulator {
  let byCount = shared.get(lib);
  if (!byCount) { byCount = new Map(); shared.set(lib, byCount); }
  const hit = byCount.get(componentCount);
  if (hit && !hit.busy) { hit.busy = true; return hit; }
  const sim = new Simulator(lib, componentCount);
  if (!hit) byCount.set(componentCount, sim);
  sim.busy = true;
  return sim;
}

export function releaseSimulator(sim: Simulator): void {
  sim.busy = false;
  sim.onContact = null;
}
