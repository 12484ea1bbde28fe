/**
 * The workup operations acting on the simulator's streams. Wash, back-extraction and
 * extraction are one physics (§1.1): mix, equilibrate, split, keep one layer; they differ in what is added
 * (aqueous reagent or organic solvent) and in which layer carries on. Each portion is a fresh equilibration.
 * Volumes, amounts, target pH and rinse volumes are read from the simulator's parameters (parameters.ts).
 */
import { reagentPh } from "./aqueous";
import { concentrate } from "./concentrate";
import { dry } from "./drying";
import { dissolveSolid } from "./salt-solutions";
import { CARBONATE, WATER } from "./library";
import { volumeForTargetPh } from "./target-ph";
import { type OperationOf, type Operation } from "./schema";
import { type AcidBaseContent, type ContactContext, type Simulator } from "./simulator";
import { addAt, type Stream } from "./stream";

export { RETAINED_SOLVENT_BP_C } from "./concentrate";

export type StepDetails = Record<string, number | string | boolean>;
/** What a step of a lean run (simulator.ts) returns instead of its details. */
export const NO_DETAILS: StepDetails = Object.freeze({});
type Handler<T extends Operation["type"]> = (sim: Simulator, op: OperationOf<T>, step: number) => StepDetails;

/** The perturbable numbers of step `step` (1-based) come from the simulator's parameters, not from `op`. */
const volumeOf = (sim: Simulator, step: number): number => sim.params.volumeMl[step - 1] as number;

/** Stands in for the context of a contact nobody traces (the Monte-Carlo path builds none). */
const UNTRACED: ContactContext = Object.freeze({
  step: 0, opType: "charge", portion: 0, keep: null, reagentKey: null, reagent: null, before: null, temperatureC: Number.NaN,
});

function ctx(sim: Simulator, op: Operation, step: number, portion: number, keep: ContactContext["keep"],
  reagentKey: string | null, before: AcidBaseContent | null): ContactContext {
  if (!sim.tracing && !sim.onContact) return UNTRACED;
  return {
    step, opType: op.type, portion, keep, reagentKey, reagent: reagentKey ? sim.reagent(reagentKey) : null, before,
    temperatureC: op.temperatureC ?? sim.input.temperatureC,
  };
}

/**
 * Equilibrates the current stream in place (no separation) so the step shows its layers and pH. Its two layers
 * are merged again, so only CO₂ leaving the water changes what carries on: a run that traces nothing (recoveries
 * only: Monte-Carlo draws, bulk re-prediction) skips the solve when the stream holds no carbonate.
 */
function settle(sim: Simulator, op: Operation, step: number, reagentKey: string | null, before: AcidBaseContent | null): void {
  if (!sim.tracing && !sim.onContact && (sim.current.sys[CARBONATE] as number) === 0) return;
  const out = sim.contact(sim.current, ctx(sim, op, step, 1, null, reagentKey, before));
  const merged = out.org;
  merged.addFrom(out.aq, 1);
  merged.lastPh = out.aq.lastPh;
  sim.current = merged;
}

const charge: Handler<"charge"> = (sim, op, step) => {
  const before = sim.acidBase(sim.current);
  const volumeMl = volumeOf(sim, step);
  addAt(sim.current.solv, sim.solventIndex(op.solvent), volumeMl);
  sim.residue = false;
  if (op.solvent === "water") settle(sim, op, step, null, before);
  return sim.lean ? NO_DETAILS : { volumeMl };
};

/** Reagent volume of step `step`: its volume, else its amount at the reagent's concentration, else 0. */
function reagentVolume(sim: Simulator, key: string, step: number): number {
  const volumeMl = volumeOf(sim, step);
  if (!Number.isNaN(volumeMl)) return volumeMl;
  const r = sim.reagent(key);
  const amountMmol = sim.params.operationAmountMmol[step - 1] as number;
  return r.concentration > 0 ? (Number.isNaN(amountMmol) ? 0 : amountMmol) / r.concentration : 0;
}

const quench: Handler<"quench"> = (sim, op, step) => {
  const r = sim.reagent(op.reagent);
  const v = reagentVolume(sim, op.reagent, step);
  const fresh = sim.freshReagent(r, v);
  const before = sim.acidBase(sim.current, fresh);
  sim.current.addFrom(fresh, 1);
  sim.residue = false;
  settle(sim, op, step, op.reagent, before);
  if (sim.lean) return NO_DETAILS;
  const gas = op.reactive?.gasPerMol !== undefined ? op.reactive.amountMmol * op.reactive.gasPerMol : 0;
  return { reagentVolumeMl: v, gasMmol: gas };
};

/** n portions of an aqueous reagent against the current stream (wash: organic kept; back-extract: aqueous kept). */
const aqueousPortions: Handler<"wash" | "back_extract"> = (sim, op, step) => {
  const r = sim.reagent(op.reagent);
  const volumeMl = volumeOf(sim, step);
  // Washes nobody reads (a lean run keeping the organic layer, nothing saved) are not combined.
  const combine = !(sim.lean && op.keep === "organic" && op.saveAs === undefined);
  const other = combine ? sim.newStream() : sim.current;
  let organic = sim.current;
  for (let p = 1; p <= op.portions; p++) {
    let mix: Stream;
    let before: AcidBaseContent | null = null;
    if (sim.lean) {
      // The organic layer is consumed by the contact, so a lean run adds the portion to it in place (the same
      // sums as a fresh portion with the layer added).
      mix = organic;
      mix.addReagent(r, volumeMl, sim.lib.density[WATER] as number);
      mix.lastPh = reagentPh(r);
      mix.solid = false;
    } else {
      mix = sim.freshReagent(r, volumeMl);
      before = sim.acidBase(organic, mix);
      mix.addFrom(organic, 1);
    }
    const out = sim.contact(mix, ctx(sim, op, step, p, op.keep, op.reagent, before), combine);
    organic = out.org;
    if (!combine) continue;
    other.addFrom(out.aq, 1);
    other.lastPh = out.aq.lastPh;
  }
  if (op.keep === "organic") {
    sim.current = organic;
    sim.divert(step, other, op.saveAs, op.portions > 1 ? "combined aqueous washes" : "aqueous wash");
  } else {
    sim.current = other;
    sim.divert(step, organic, op.saveAs, "washed organic layer");
  }
  return sim.lean ? NO_DETAILS : { portions: op.portions, reagentPh: reagentPh(r) };
};

/** n portions of organic solvent against the current stream; the extracts are combined. */
const extract: Handler<"extract"> = (sim, op, step) => {
  const si = sim.solventIndex(op.solvent);
  const volumeMl = volumeOf(sim, step);
  const extracts = sim.newStream();
  let aqueous = sim.current;
  for (let p = 1; p <= op.portions; p++) {
    // The aqueous stream is consumed by this contact, so the solvent is added to it in place.
    const before = sim.acidBase(aqueous);
    addAt(aqueous.solv, si, volumeMl);
    const out = sim.contact(aqueous, ctx(sim, op, step, p, op.keep, null, before));
    aqueous = out.aq;
    extracts.addFrom(out.org, 1);
  }
  if (op.keep === "organic") {
    sim.current = extracts;
    sim.divert(step, aqueous, op.saveAs, "extracted aqueous layer");
  } else {
    sim.current = aqueous;
    sim.divert(step, extracts, op.saveAs, "combined organic extracts");
  }
  return sim.lean ? NO_DETAILS : { portions: op.portions };
};

const separate: Handler<"separate"> = (sim, op, step) => {
  const aqueousRead = !(sim.lean && op.keep === "organic" && op.saveAs === undefined);
  const out = sim.contact(sim.current, ctx(sim, op, step, 1, op.keep, null, sim.acidBase(sim.current)), aqueousRead);
  sim.current = op.keep === "organic" ? out.org : out.aq;
  sim.divert(step, op.keep === "organic" ? out.aq : out.org, op.saveAs, op.keep === "organic" ? "aqueous layer" : "organic layer");
  return NO_DETAILS;
};

const combine: Handler<"combine"> = (sim, op, step) => {
  const streams = op.streams.map((name) => {
    const rec = sim.saved.get(name);
    if (!rec) throw new Error(`no stream saved as '${name}'`);
    return rec;
  });
  const before = sim.acidBase(sim.current, ...streams.map((x) => x.stream));
  for (const rec of streams) {
    sim.current.addFrom(rec.stream, 1);
    rec.fate = "combined";
    sim.saved.delete(rec.name);
  }
  sim.residue = false;
  settle(sim, op, step, null, before);
  return { streams: op.streams.join(", ") };
};

/** Adds reagent; with a target pH, finds the volume that reaches it (pH is monotone in the volume). */
const adjustPh: Handler<"adjust_ph"> = (sim, op, step) => {
  const r = sim.reagent(op.reagent);
  let v = reagentVolume(sim, op.reagent, step);
  const details: StepDetails = {};
  const target = sim.params.targetPh[step - 1] as number;
  if (!Number.isNaN(target)) {
    const found = volumeForTargetPh(sim, r, target);
    v = found.volumeMl;
    if (found.outcome === "already") details.alreadyAtTarget = true;
    else if (found.outcome === "wrong_direction") Object.assign(details, { wrongDirection: true, startPh: found.startPh });
    else details.targetReached = found.outcome === "reached";
  }
  const fresh = sim.freshReagent(r, v);
  const before = sim.acidBase(sim.current, fresh);
  if (v > 0) sim.current.addFrom(fresh, 1);
  settle(sim, op, step, op.reagent, before);
  details.reagentVolumeMl = v;
  details.reagentMmol = v * r.concentration;
  return details;
};

const addSalt: Handler<"add_salt"> = (sim, op, step) => {
  const r = sim.reagent(op.salt);
  const water = sim.current.solv[WATER] as number;
  const present = r.osmoles > 0 ? sim.current.osmoles / r.osmoles : 0;
  let mmol: number;
  if (op.saturate) {
    const sol = r.props.solubilityGPer100g?.value ?? 0;
    const saturated = (((sol / 100) * water * (sim.lib.density[WATER] as number)) / r.molarMass) * 1000;
    mmol = Math.max(0, saturated - present);
  } else mmol = (((op.massG ?? 0) / r.molarMass) * 1000);
  const before = sim.acidBase(sim.current);
  sim.current.addReagent(r, mmol, sim.lib.density[WATER] as number);
  const grownMl = dissolveSolid(sim.current, op.salt, r.molarMass, water * (sim.lib.density[WATER] as number), present, mmol, sim.lib.density[WATER] as number);
  settle(sim, op, step, op.salt, before);
  return { saltMmol: mmol, saltG: (mmol * r.molarMass) / 1000, volumeGrowthMl: grownMl };
};

const removeCosolvent: Handler<"remove_cosolvent"> = (sim, op, step) => {
  const i = sim.solventIndex(op.solvent);
  const removed = (sim.current.solv[i] as number) * op.fractionRemoved;
  addAt(sim.current.solv, i, -removed);
  const gone = sim.newStream();
  gone.solv[i] = removed;
  sim.leave(step, gone, "evaporated", `evaporated ${op.solvent}`);
  return { removedMl: removed };
};

/** Hold-up of solution on a filter cake or pad, mL per g (memory, as for drying agents). */
const CAKE_HOLD_UP_ML_PER_G = 1;

const filter: Handler<"filter"> = (sim, op, step) => {
  const cur = sim.current;
  const solid = sim.newStream();
  solid.solid = true;
  for (const key of op.solidComponents) {
    const c = sim.comps.keys.indexOf(key);
    solid.comp[c] = cur.comp[c] as number;
    cur.comp[c] = 0;
  }
  const volume = cur.totalVolume();
  const holdUp = (op.cakeMassG ?? 0) * CAKE_HOLD_UP_ML_PER_G;
  let retained = volume > 0 ? Math.min(1, holdUp / volume) : 0;
  if (op.rinse) {
    const rinseMl = sim.params.rinseMl[step - 1] as number;
    addAt(cur.solv, sim.solventIndex(op.rinse.solvent), rinseMl);
    if (holdUp > 0) retained *= holdUp / (holdUp + rinseMl);
  }
  const wet = sim.newStream();
  wet.addFrom(cur, retained);
  for (let c = 0; c < cur.comp.length; c++) addAt(cur.comp, c, -(wet.comp[c] as number));
  for (let i = 0; i < cur.solv.length; i++) addAt(cur.solv, i, -(wet.solv[i] as number));
  solid.addFrom(wet, 1);
  if (op.keep === "solid") {
    sim.divert(step, cur, op.saveAs, "filtrate");
    sim.current = solid;
  } else sim.leave(step, solid, "filter_cake", "filter cake");
  return sim.lean ? NO_DETAILS : { fractionHeldUp: retained };
};

/** Dispatch by a switch: a keyed lookup in a table of handlers goes megamorphic across ten operation shapes. */
export function applyOperation(sim: Simulator, op: Operation, step: number): StepDetails {
  switch (op.type) {
    case "charge": return charge(sim, op, step);
    case "quench": return quench(sim, op, step);
    case "wash": case "back_extract": return aqueousPortions(sim, op, step);
    case "extract": return extract(sim, op, step);
    case "separate": return separate(sim, op, step);
    case "combine": return combine(sim, op, step);
    case "adjust_ph": return adjustPh(sim, op, step);
    case "add_salt": return addSalt(sim, op, step);
    case "remove_cosolvent": return removeCosolvent(sim, op, step);
    case "dry": return dry(sim, op, step);
    case "filter": return filter(sim, op, step);
    case "concentrate": return concentrate(sim, op, step);
  }
}
