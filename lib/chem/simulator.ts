/**
 * State of one simulated work-up: the main-line stream, streams saved under a name, streams that left the main
 * line (waste, drying agent, filter cake, evaporated), and the contact/step traces. The per-operation logic is in
 * operations.ts; this file holds the shared mechanics (equilibrate, split, save or discard, heat and gas).
 */
import { HEAT_OF_NEUTRALIZATION_KJ_PER_MOL, reagentPh, systemBoundProtons } from "./aqueous";
import { type CompiledComponents } from "./components";
import { Equilibrator } from "./equilibrium";
import { CARBONATE, WATER, type CompiledLibrary, type CompiledReagent } from "./library";
import { layerOrder } from "./phases";
import { type OperationType, type WorkupInput } from "./schema";
import { Stream } from "./stream";
import { type ContactTrace, type StepTrace } from "./trace";
import { type SideStream } from "./types";

/** Heat capacities for the temperature-rise estimate, J g⁻¹ K⁻¹: water 4.18; organic solvents ≈1.9 (memory). */
const CP_WATER = 4.18;
const CP_ORGANIC = 1.9;

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
  current: Stream;
  residue = false;
  readonly saved = new Map<string, SideInternal>();
  readonly side: SideInternal[] = [];
  readonly contacts: ContactTrace[] = [];
  readonly stepTraces: StepTrace[] = [];
  readonly eq: Equilibrator;
  /** Called after each contact when the caller wants per-step phase detail. */
  onContact: ((ctx: ContactContext, out: ContactOutcome) => void) | null = null;

  constructor(readonly input: WorkupInput, readonly lib: CompiledLibrary, readonly comps: CompiledComponents, readonly tracing: boolean) {
    this.eq = Equilibrator.for(lib, comps);
    this.current = this.newStream();
  }

  newStream(): Stream {
    return new Stream(this.lib.solventKeys.length, this.comps.count);
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

  /** Equilibrates a mixture into two new streams and records the contact. */
  contact(mix: Stream, ctx: ContactContext): ContactOutcome {
    const org = this.newStream();
    const aq = this.newStream();
    const eq = this.eq;
    eq.equilibrate(mix, org, aq);
    let trace: ContactTrace | null = null;
    if (this.tracing || this.onContact) trace = this.traceContact(mix, org, aq, ctx);
    const out = { org, aq, trace };
    if (trace) this.contacts.push(trace);
    this.onContact?.(ctx, out);
    return out;
  }

  private traceContact(mix: Stream, org: Stream, aq: Stream, ctx: ContactContext): ContactTrace {
    const { eq, lib, comps } = this;
    const p = eq.phases;
    const rhoOrg = p.density(p.org, 0, this.componentMass(org));
    const rhoAq = p.density(p.aq, mix.extraMassG, this.componentMass(aq));
    const twoPhase = p.hasAqueous && p.hasOrganic;
    const order = layerOrder(rhoOrg, rhoAq);
    let chlorinated = 0, immiscible = 0, cosolvent = 0, dipolar = 0, total = 0;
    const organicSolvents: string[] = [];
    for (let i = 0; i < lib.solventKeys.length; i++) {
      const v = mix.solv[i] as number;
      total += v;
      if (i !== WATER && lib.miscible[i]) {
        if (lib.solvents[i]?.dipolarAprotic) dipolar += v; else cosolvent += v;
      }
      const vo = p.org[i] as number;
      if (i !== WATER && vo > 0) organicSolvents.push(lib.solventKeys[i] as string);
      if (i !== WATER && !lib.miscible[i]) {
        immiscible += vo;
        if (lib.solvents[i]?.chlorinated) chlorinated += vo;
      }
    }
    const lost = new Float64Array(comps.count);
    if (ctx.keep) lost.set(ctx.keep === "organic" ? aq.comp : org.comp);
    const heat = ctx.before ? this.heatOfContact(ctx.before, aq) : 0;
    const organicMass = p.organicVolume * (Number.isFinite(rhoOrg) ? rhoOrg : 0.8);
    const aqueousMass = p.aqueousVolume * (Number.isFinite(rhoAq) ? rhoAq : 1);
    const cp = CP_WATER * aqueousMass + CP_ORGANIC * organicMass;
    const fresh = ctx.reagent ? reagentPh(ctx.reagent) : NaN;
    return {
      step: ctx.step, opType: ctx.opType, portion: ctx.portion, keep: ctx.keep, reagentKey: ctx.reagentKey,
      reagentPh: fresh, pH: eq.pH,
      organicVolume: twoPhase || !p.hasAqueous ? p.organicVolume : 0,
      aqueousVolume: p.hasAqueous ? p.aqueousVolume : 0,
      organicDensity: rhoOrg, aqueousDensity: rhoAq, twoPhase,
      organicOnTop: order.organicOnTop,
      chlorinatedOrganic: immiscible > 0 && chlorinated / immiscible > 0.5,
      cosolventShare: total > 0 ? cosolvent / total : 0,
      dipolarShare: total > 0 ? dipolar / total : 0,
      cosolventFractionAqueous: p.cosolventFraction,
      saltM: p.saltM,
      distribution: Float64Array.from(eq.distribution),
      fractionNeutral: Float64Array.from(eq.fractionNeutral),
      fractionAqueous: Float64Array.from(eq.fractionAqueous),
      amounts: Float64Array.from(mix.comp),
      lost,
      co2Mmol: eq.co2Mmol,
      heatKJ: heat,
      temperatureRiseK: cp > 0 ? (heat * 1000) / cp : 0,
      capacityExceeded: ctx.reagent !== null && (ctx.opType === "wash" || ctx.opType === "back_extract") && capacityExceeded(ctx.reagent, fresh, eq.pH),
      liquidVolume: total,
      temperatureC: ctx.temperatureC,
      organicSolvents,
    };
  }

  /**
   * Heat released on mixing, kJ: protons or hydroxide consumed, less the protons taken up by carbonate
   * (bicarbonate neutralization is nearly thermoneutral), times 55.8 kJ/mol (CODATA, see aqueous.ts).
   */
  private heatOfContact(before: AcidBaseContent, aq: Stream): number {
    if (!Number.isFinite(this.eq.pH)) return 0;
    const after = this.eq.freeAcidBase();
    const hAfter = 10 ** -this.eq.pH;
    const carbAfter = (aq.sys[CARBONATE] as number) * systemBoundProtons(CARBONATE, hAfter) + 2 * this.eq.co2Mmol;
    const consumed = Math.max(before.h - after.h, before.oh - after.oh, 0);
    const n = Math.max(0, consumed - Math.max(0, carbAfter - before.carbonateProtons));
    return (n / 1000) * -HEAT_OF_NEUTRALIZATION_KJ_PER_MOL;
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
    } else {
      this.side.push({ step, name, fate: "waste", stream });
    }
  }

  leave(step: number, stream: Stream, fate: SideStream["fate"], name: string): void {
    this.side.push({ step, name, fate, stream });
  }
}

/** A basic or acidic reagent is spent when the pH after contact has moved more than 1 unit from the fresh reagent's. */
export function capacityExceeded(r: CompiledReagent, fresh: number, pH: number): boolean {
  if (!Number.isFinite(fresh) || !Number.isFinite(pH)) return false;
  const purpose = r.props.purpose;
  if (purpose === "base") return pH < fresh - 1;
  if (purpose === "acid") return pH > fresh + 1;
  if (purpose === "buffer") return Math.abs(pH - fresh) > 1;
  return false;
}
