/**
 * The concentrate step. Solvents are removed by boiling point as before (high-boiling ones stay in the crude);
 * each component with a boiling point loses what the evaporation model (evaporation.ts) predicts from its vapour
 * pressure at the bath temperature, the pressure and the time, co-evaporating with the solvents in the flask.
 */
import { DEFAULT_SOLVENT_MOLAR_MASS, SOLVENT_MOLAR_MASS } from "./data/vapour-pressure";
import { DEFAULT_PRESSURE_MBAR, RULE_OF_20_K, ATM_MBAR, evaporate, solventVapourPressure, vapourPressureFromBp, type EvaporationConditions } from "./evaporation";
import { WATER } from "./library";
import { NO_DETAILS, type StepDetails } from "./operations";
import { type OperationOf } from "./schema";
import { type Simulator } from "./simulator";

/** Solvents above these normal boiling points stay in the crude (assumption; DMF, DMSO, NMP on a rotavap). */
export const RETAINED_SOLVENT_BP_C = { rotavap: 130, n2_stream: 130, distillation: 130, high_vacuum: 200 } as const;

let amounts = new Float64Array(16);
let pressures = new Float64Array(16);

/** The pressure of the step, else the method's default (rotavap: rule of 20 on the main volatile solvent). */
export function concentrationPressure(sim: Simulator, op: OperationOf<"concentrate">): number {
  if (op.pressureMbar !== undefined) return op.pressureMbar;
  if (op.method !== "rotavap") return DEFAULT_PRESSURE_MBAR[op.method];
  const { lib } = sim;
  let main = -1, most = 0;
  for (let i = 0; i < lib.solventKeys.length; i++) {
    const v = sim.current.solv[i] as number;
    if (v > most && (lib.bpC[i] as number) < RETAINED_SOLVENT_BP_C.rotavap) { most = v; main = i; }
  }
  if (main < 0) return DEFAULT_PRESSURE_MBAR.high_vacuum * 100;
  return Math.min(ATM_MBAR, solventVapourPressure(lib.solventKeys[main] as string, lib.bpC[main] as number, op.bathC - RULE_OF_20_K));
}

export function concentrate(sim: Simulator, op: OperationOf<"concentrate">, step: number): StepDetails {
  const cur = sim.current;
  const { lib } = sim;
  const waterMl = cur.solv[WATER] as number;
  const volumeMl = cur.totalVolume();
  const gone = sim.newStream();
  const comps = sim.input.components;
  let volatile = false;
  for (const c of comps) if (c.bpC !== undefined) volatile = true;
  // The pressure matters to volatile components; a lean run (simulator.ts) needs it for nothing else.
  const pressureMbar = volatile || !sim.lean ? concentrationPressure(sim, op) : Number.NaN;
  if (volatile) {
    const ns = lib.solventKeys.length;
    const n = ns + comps.length;
    if (amounts.length < n) { amounts = new Float64Array(n); pressures = new Float64Array(n); }
    for (let i = 0; i < ns; i++) {
      const key = lib.solventKeys[i] as string;
      amounts[i] = ((cur.solv[i] as number) * (lib.density[i] as number) * 1000) / (SOLVENT_MOLAR_MASS[key] ?? DEFAULT_SOLVENT_MOLAR_MASS);
      pressures[i] = solventVapourPressure(key, lib.bpC[i] as number, op.bathC);
    }
    for (let ci = 0; ci < comps.length; ci++) {
      const bp = comps[ci]?.bpC;
      amounts[ns + ci] = cur.comp[ci] as number;
      pressures[ns + ci] = bp === undefined ? 0 : vapourPressureFromBp(bp, op.bathC);
    }
    const conditions: EvaporationConditions = { method: op.method, bathC: op.bathC, pressureMbar, minutes: op.minutes ?? null };
    evaporate(n === amounts.length ? amounts : amounts.subarray(0, n), n === pressures.length ? pressures : pressures.subarray(0, n), ns, conditions);
    for (let ci = 0; ci < comps.length; ci++) {
      const before = cur.comp[ci] as number;
      const left = Math.min(before, Math.max(0, amounts[ns + ci] as number));
      gone.comp[ci] = before - left;
      cur.comp[ci] = left;
    }
  }
  const cut = RETAINED_SOLVENT_BP_C[op.method];
  for (let i = 0; i < cur.solv.length; i++) {
    if ((lib.bpC[i] as number) < cut) { gone.solv[i] = cur.solv[i] as number; cur.solv[i] = 0; }
  }
  sim.leave(step, gone, "evaporated", "evaporated solvent");
  sim.residue = true;
  if (sim.lean) return NO_DETAILS;
  return { method: op.method, bathC: op.bathC, pressureMbar, waterMl, volumeMl };
}
