/**
 * The property library a prediction runs against (solvents, aqueous reagents, drying agents), and its compiled
 * numeric form. Groups edit a JSON copy; predictWorkup accepts overrides that replace or add entries by key.
 * Compilation is cached per library object so Monte-Carlo runs pay for it once.
 */
import { DRYING_AGENTS, type DryingAgentProps } from "./data/drying-agents";
import { ACID_SYSTEMS, REAGENTS, STRONG_ION_CHARGE, type AcidSystem, type ReagentProps, type StrongIon } from "./data/reagents";
import { SOLVENTS, WATER_KEY, type SolventProps } from "./data/solvents";
import { cosolventLogK, setschenowConstant } from "./partition";
import { type WorkupInput } from "./schema";

export interface Library {
  solvents: Readonly<Record<string, SolventProps>>;
  reagents: Readonly<Record<string, ReagentProps>>;
  dryingAgents: Readonly<Record<string, DryingAgentProps>>;
}

export interface LibraryOverrides {
  solvents?: Record<string, SolventProps>;
  reagents?: Record<string, ReagentProps>;
  dryingAgents?: Record<string, DryingAgentProps>;
}

export const DEFAULT_LIBRARY: Library = { solvents: SOLVENTS, reagents: REAGENTS, dryingAgents: DRYING_AGENTS };

const merged = new WeakMap<object, Library>();

/** The default library with the overrides applied (cached per overrides object). */
export function resolveLibrary(overrides?: LibraryOverrides): Library {
  if (!overrides || (!overrides.solvents && !overrides.reagents && !overrides.dryingAgents)) return DEFAULT_LIBRARY;
  const hit = merged.get(overrides);
  if (hit) return hit;
  const lib: Library = {
    solvents: overrides.solvents ? { ...SOLVENTS, ...overrides.solvents } : SOLVENTS,
    reagents: overrides.reagents ? { ...REAGENTS, ...overrides.reagents } : REAGENTS,
    dryingAgents: overrides.dryingAgents ? { ...DRYING_AGENTS, ...overrides.dryingAgents } : DRYING_AGENTS,
  };
  merged.set(overrides, lib);
  return lib;
}

export const SYSTEM_KEYS = Object.keys(ACID_SYSTEMS) as AcidSystem[];
export const N_SYSTEMS = SYSTEM_KEYS.length;
export const CARBONATE = SYSTEM_KEYS.indexOf("carbonate");
/** Acid dissociation constants of each system, K = 10^−pKa. */
export const SYSTEM_KA: readonly Float64Array[] = SYSTEM_KEYS.map((k) => Float64Array.from(ACID_SYSTEMS[k].pKas, (p) => 10 ** -p.value));
export const SYSTEM_Z0: readonly number[] = SYSTEM_KEYS.map((k) => ACID_SYSTEMS[k].z0);

export interface CompiledReagent {
  props: ReagentProps;
  solid: boolean;
  /** Solutions: g/mL; solids: molar mass g/mol. */
  density: number;
  molarMass: number;
  /** Defining concentration (mol/L) for solutions. */
  concentration: number;
  /** Per mL of solution (mmol) or per mmol of solid: net strong-ion charge, Σz²·n, Σn. */
  strongCharge: number;
  strongZ2: number;
  osmoles: number;
  systems: Float64Array;
  /** Some system total is not zero. */
  hasSystems: boolean;
  /** pH of the fresh solution, filled in by reagentPh (aqueous.ts) on first use; NaN until then. */
  freshPh: number;
}

export interface CompiledLibrary {
  lib: Library;
  solventKeys: string[];
  solventIndex: Map<string, number>;
  solvents: SolventProps[];
  density: Float64Array;
  bpC: Float64Array;
  miscible: Uint8Array;
  /** Mass fractions at saturation, 0–1. */
  solventInWater: Float64Array;
  waterInSolvent: Float64Array;
  /** Setschenow constant of the solvent itself (salt lowers how much dissolves in the aqueous layer). */
  selfSetschenow: Float64Array;
  reagents: Map<string, CompiledReagent>;
  /** log K of water-miscible solvent j between organic solvent i and water, at [j * n + i]. */
  cosolventLogK: Float64Array;
  ionLogKOffset: Float64Array;
  ionPairLogKOffset: Float64Array;
}

export const WATER = 0;

function compileReagent(r: ReagentProps): CompiledReagent {
  let strongCharge = 0, strongZ2 = 0, osmoles = 0;
  for (const [ion, c] of Object.entries(r.ions) as [StrongIon, number][]) {
    const z = STRONG_ION_CHARGE[ion];
    strongCharge += z * c;
    strongZ2 += z * z * c;
    osmoles += c;
  }
  const systems = new Float64Array(N_SYSTEMS);
  for (const [sys, c] of Object.entries(r.systems) as [AcidSystem, number][]) systems[SYSTEM_KEYS.indexOf(sys)] = c;
  const solid = r.kind === "solid";
  return {
    props: r, solid, density: r.density?.value ?? 1, molarMass: solid ? r.basis.value : 0,
    concentration: solid ? 0 : r.basis.value, strongCharge, strongZ2, osmoles, systems, hasSystems: systems.some((x) => x !== 0),
    freshPh: Number.NaN,
  };
}

function cosolventMatrix(solvents: SolventProps[]): Float64Array {
  const n = solvents.length;
  const m = new Float64Array(n * n);
  solvents.forEach((cos, j) => {
    if (!cos.waterMiscible || j === WATER) return;
    solvents.forEach((org, i) => { if (!org.waterMiscible) m[j * n + i] = cosolventLogK(cos, org); });
  });
  return m;
}

const compiled = new WeakMap<Library, Map<string, CompiledLibrary>>();

/**
 * Compiles the library for the solvents a work-up uses (water always first). Restricting the arrays to those
 * few solvents keeps every per-stream array small (V8 allocates small typed arrays on the heap, large ones
 * off it at several times the cost), and the inner loops short. Cached per library and solvent set.
 */
export function compileLibrary(lib: Library, solventKeys?: readonly string[]): CompiledLibrary {
  const keys = solventKeys
    ? [WATER_KEY, ...new Set(solventKeys.filter((k) => k !== WATER_KEY && lib.solvents[k]))]
    : [WATER_KEY, ...Object.keys(lib.solvents).filter((k) => k !== WATER_KEY)];
  const cacheKey = keys.join("\u0000");
  let byKeys = compiled.get(lib);
  if (!byKeys) { byKeys = new Map(); compiled.set(lib, byKeys); }
  const hit = byKeys.get(cacheKey);
  if (hit) return hit;
  const solvents = keys.map((k) => {
    const s = lib.solvents[k];
    if (!s) throw new Error(`solvent library has no '${k}'`);
    return s;
  });
  const f64 = (fn: (s: SolventProps) => number) => Float64Array.from(solvents, fn);
  const out: CompiledLibrary = {
    lib,
    solventKeys: keys,
    solventIndex: new Map(keys.map((k, i) => [k, i])),
    solvents,
    density: f64((s) => s.density.value),
    bpC: f64((s) => s.bpC.value),
    miscible: Uint8Array.from(solvents, (s) => (s.waterMiscible ? 1 : 0)),
    solventInWater: f64((s) => (s.solventInWaterWtPct?.value ?? 0) / 100),
    waterInSolvent: f64((s) => (s.waterInSolventWtPct?.value ?? 0) / 100),
    selfSetschenow: f64((s) => setschenowConstant(s.logP.value)),
    cosolventLogK: cosolventMatrix(solvents),
    ionLogKOffset: f64((s) => s.ionLogKOffset),
    ionPairLogKOffset: f64((s) => s.ionPairLogKOffset),
    reagents: byKeys.size > 0 ? (byKeys.values().next().value as CompiledLibrary).reagents
      : new Map(Object.entries(lib.reagents).map(([k, r]) => [k, compileReagent(r)])),
  };
  byKeys.set(cacheKey, out);
  return out;
}

const idealized = new WeakMap<Library, Library>();

/** The library with solvent and water treated as mutually insoluble (textbook extraction arithmetic). */
export function idealLibrary(lib: Library): Library {
  const hit = idealized.get(lib);
  if (hit) return hit;
  const solvents = Object.fromEntries(Object.entries(lib.solvents).map(([k, s]) => [k, { ...s, solventInWaterWtPct: null, waterInSolventWtPct: null }]));
  const out: Library = { ...lib, solvents };
  idealized.set(lib, out);
  return out;
}

/** The solvents a work-up names (mixture, charges, extractions, cosolvent removal, rinses), in order of first use. */
export function workupSolvents(w: WorkupInput): string[] {
  const used: string[] = [];
  const add = (k: string) => { if (!used.includes(k)) used.push(k); };
  for (const s of w.mixture.solvents) add(s.solvent);
  for (const op of w.operations) {
    if (op.type === "charge" || op.type === "extract" || op.type === "remove_cosolvent") add(op.solvent);
    if ((op.type === "dry" || op.type === "filter") && op.rinse) add(op.rinse.solvent);
  }
  return used;
}

/** The solvents of a work-up in the compiled library's order (water first), for a work-up whose solvents all
 * exist in the library (a validated one). */
export function engineSolventKeys(w: WorkupInput): string[] {
  return [WATER_KEY, ...workupSolvents(w).filter((k) => k !== WATER_KEY)];
}

export interface EngineLibraryOptions extends LibraryOverrides {
  /** Treat every solvent as insoluble in water and water as insoluble in it (textbook comparisons). */
  idealPhases?: boolean;
}

/** The library a work-up runs against, and its compiled form over the work-up's solvents. */
export function libraryForWorkup(w: WorkupInput, options: EngineLibraryOptions): { library: Library; lib: CompiledLibrary } {
  const library = resolveLibrary(options);
  const ideal = options.idealPhases ?? w.options.idealPhases;
  return { library, lib: compileLibrary(ideal ? idealLibrary(library) : library, workupSolvents(w)) };
}
