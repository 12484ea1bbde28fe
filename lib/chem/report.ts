/**
 * Builds the public, JSON-shaped pieces of a prediction from the simulator's streams: each layer's state at a
 * contact (volume, density, position, pH, solvents, components by species) and summaries of streams.
 */
import { type CompiledComponents } from "./components";
import { type Equilibrator } from "./equilibrium";
import { WATER, type CompiledLibrary } from "./library";
import { type ContactOutcome } from "./simulator";
import { type Stream } from "./stream";
import { type ContactResult, type LayerKind, type PhaseState, type SideStream, type SpeciesAmounts, type StreamSummary } from "./types";
import { gasMolarVolumeMl } from "./units";
import { type SideInternal } from "./simulator";

const TINY = 1e-12;

function solventRecord(lib: CompiledLibrary, volumes: ArrayLike<number>): Record<string, number> {
  const out: Record<string, number> = {};
  for (let i = 0; i < lib.solventKeys.length; i++) {
    const v = volumes[i] as number;
    if (v > TINY) out[lib.solventKeys[i] as string] = v;
  }
  return out;
}

function componentRecord(comps: CompiledComponents, amounts: ArrayLike<number>): Record<string, number> {
  const out: Record<string, number> = {};
  for (let c = 0; c < comps.count; c++) out[comps.keys[c] as string] = amounts[c] as number;
  return out;
}

function speciesRecord(eq: Equilibrator, comps: CompiledComponents, s: Stream, kind: LayerKind): Record<string, SpeciesAmounts> {
  const out: Record<string, SpeciesAmounts> = {};
  for (let c = 0; c < comps.count; c++) {
    const n = s.comp[c] as number;
    const f0 = eq.fractionNeutral[c] as number;
    let neutral: number;
    if (kind === "aqueous") neutral = n * f0;
    else {
      const d = eq.distribution[c] as number;
      neutral = Number.isFinite(d) && d > 0 ? (n * (eq.kNeutral[c] as number) * f0) / d : n * f0;
    }
    out[comps.keys[c] as string] = { neutral, charged: n - neutral };
  }
  return out;
}

/** The layers of one contact, read from the equilibrator right after it ran. */
export function contactResult(lib: CompiledLibrary, comps: CompiledComponents, eq: Equilibrator, out: ContactOutcome, portion: number): ContactResult {
  const t = out.trace;
  const phases: PhaseState[] = [];
  const distribution: Record<string, number> = {};
  for (let c = 0; c < comps.count; c++) distribution[comps.keys[c] as string] = eq.distribution[c] as number;
  const two = t?.twoPhase ?? false;
  if (eq.phases.hasOrganic) {
    phases.push({
      kind: "organic", volumeMl: eq.phases.organicVolume, densityGPerMl: t?.organicDensity ?? NaN,
      position: two ? (t?.organicOnTop ? "top" : "bottom") : "single", pH: null, ionicStrength: null,
      solventsMl: solventRecord(lib, eq.phases.org), components: speciesRecord(eq, comps, out.org, "organic"),
      ...(two ? { distributionRatio: distribution } : {}),
    });
  }
  if (eq.phases.hasAqueous) {
    phases.push({
      kind: "aqueous", volumeMl: eq.phases.aqueousVolume, densityGPerMl: t?.aqueousDensity ?? NaN,
      position: two ? (t?.organicOnTop ? "bottom" : "top") : "single", pH: eq.pH, ionicStrength: eq.ionicStrength,
      solventsMl: solventRecord(lib, eq.phases.aq), components: speciesRecord(eq, comps, out.aq, "aqueous"),
      ...(two ? { distributionRatio: distribution } : {}),
    });
  }
  return {
    portion, phases,
    densityDifference: two && t ? t.organicDensity - t.aqueousDensity : null,
    co2Mmol: eq.co2Mmol, co2GasMl: eq.co2Mmol * gasMolarVolumeMl(t?.temperatureC ?? Number.NaN),
    heatKJ: t?.heatKJ ?? 0, temperatureRiseK: t?.temperatureRiseK ?? 0,
    capacityExceeded: t?.capacityExceeded ?? false,
    reagentPh: t && Number.isFinite(t.reagentPh) ? t.reagentPh : null,
  };
}

export function streamKind(lib: CompiledLibrary, s: Stream, residue: boolean): StreamSummary["kind"] {
  if (s.solid) return "solid";
  if (residue) return "residue";
  let water = 0, organic = 0, miscible = 0;
  for (let i = 0; i < lib.solventKeys.length; i++) {
    const v = s.solv[i] as number;
    if (i === WATER) water += v;
    else if (lib.miscible[i]) miscible += v;
    else organic += v;
  }
  if (water + organic + miscible <= TINY) return "empty";
  if (organic > TINY && water > 0.1 * (organic + miscible)) return "mixture";
  if (water > organic + miscible || (organic <= TINY && water > TINY)) return "aqueous";
  return "organic";
}

export function summarize(lib: CompiledLibrary, comps: CompiledComponents, s: Stream, residue: boolean): StreamSummary {
  return {
    kind: streamKind(lib, s, residue),
    volumeMl: s.totalVolume(),
    solventsMl: solventRecord(lib, s.solv),
    components: componentRecord(comps, s.comp),
  };
}

export function sideStream(lib: CompiledLibrary, comps: CompiledComponents, x: SideInternal): SideStream {
  const out: SideStream = {
    step: x.step, name: x.name, fate: x.fate, volumeMl: x.stream.totalVolume(), components: componentRecord(comps, x.stream.comp),
  };
  if (x.fate === "waste") out.wasteClass = wasteClass(lib, x.stream);
  return out;
}

/**
 * A discarded layer is aqueous waste when water is most of its volume: a wash saturated with ethyl acetate
 * (8.3 wt %, ≈9 vol %) or carrying DMF is still an aqueous layer, not organic waste.
 */
export function wasteClass(lib: CompiledLibrary, s: Stream): NonNullable<SideStream["wasteClass"]> {
  if (s.solid) return "solid";
  let water = 0, other = 0, chlorinated = 0;
  for (let i = 0; i < lib.solventKeys.length; i++) {
    const v = s.solv[i] as number;
    if (i === WATER) water += v;
    else {
      other += v;
      if (lib.solvents[i]?.chlorinated) chlorinated += v;
    }
  }
  if (water > 0 && water >= other) return "aqueous";
  return chlorinated > 0 ? "halogenated_organic" : "non_halogenated_organic";
}
