/**
 * The dry step: the agent takes up the dissolved water; the spent agent holds back some solution (hold-up), and
 * rinsing it with fresh solvent returns most of that. A rinse is part of the step: when the record gives none,
 * the common practice of rinsing the spent agent with two portions of the layer's own solvent, each twice the
 * volume it holds, is assumed (DEFAULT_RINSE_*; the editor's help text says so). Each portion leaves
 * V_h/(V_h + V_r) of the solute in the held solution behind (single mixing cell, common practice).
 */
import { DRYING_AGENT_EXCESS } from "./data/drying-agents";
import { WATER } from "./library";
import { NO_DETAILS, type StepDetails } from "./operations";
import { type OperationOf } from "./schema";
import { type Simulator } from "./simulator";
import { addAt } from "./stream";

/** Default rinse of a spent drying agent: two portions, each twice the agent's hold-up volume (common practice). */
export const DEFAULT_RINSE_PORTIONS = 2;
export const DEFAULT_RINSE_PER_HOLD_UP = 2;

/** The solvent the layer mostly is (not water): the default rinse solvent. */
function mainSolvent(sim: Simulator): number {
  let main = -1, most = 0;
  for (let i = 1; i < sim.current.solv.length; i++) {
    const v = sim.current.solv[i] as number;
    if (v > most) { most = v; main = i; }
  }
  return main;
}

export function dry(sim: Simulator, op: OperationOf<"dry">, step: number): StepDetails {
  const agent = sim.lib.lib.dryingAgents[op.agent];
  if (!agent) throw new Error(`unknown drying agent '${op.agent}'`);
  const cur = sim.current;
  const rhoW = sim.lib.density[WATER] as number;
  const waterG = (cur.solv[WATER] as number) * rhoW;
  const neededG = waterG / agent.capacityGPerG.value;
  const massG = op.massG ?? neededG * DRYING_AGENT_EXCESS;
  const absorbedG = Math.min(waterG, massG * agent.capacityGPerG.value);
  addAt(cur.solv, WATER, -(absorbedG / rhoW));
  const volume = cur.totalVolume();
  const holdUp = agent.holdUpMlPerG.value * massG;
  let retained = volume > 0 ? Math.min(1, holdUp / volume) : 0;
  let rinseMl = 0;
  let portions = 0;
  if (op.rinse) {
    rinseMl = sim.params.rinseMl[step - 1] as number;
    portions = 1;
    addAt(cur.solv, sim.solventIndex(op.rinse.solvent), rinseMl);
    retained *= holdUp / (holdUp + rinseMl);
  } else {
    const solvent = mainSolvent(sim);
    if (solvent > 0 && holdUp > 0) {
      const portion = DEFAULT_RINSE_PER_HOLD_UP * holdUp;
      portions = DEFAULT_RINSE_PORTIONS;
      rinseMl = portions * portion;
      addAt(cur.solv, solvent, rinseMl);
      retained *= (holdUp / (holdUp + portion)) ** portions;
    }
  }
  const held = sim.newStream();
  held.addFrom(cur, retained);
  for (let c = 0; c < cur.comp.length; c++) addAt(cur.comp, c, -(held.comp[c] as number));
  for (let i = 0; i < cur.solv.length; i++) addAt(cur.solv, i, -(held.solv[i] as number));
  held.solid = true;
  const water = sim.newStream();
  water.solv[WATER] = absorbedG / rhoW;
  held.addFrom(water, 1);
  if (sim.lean) return NO_DETAILS;
  sim.leave(step, held, "drying_agent", `${agent.name} (spent)`);
  return { waterG, agentNeededG: neededG, agentRecommendedG: neededG * DRYING_AGENT_EXCESS, agentUsedG: massG,
    waterLeftG: waterG - absorbedG, holdUpMl: holdUp, rinseMl, rinsePortions: portions, defaultRinse: !op.rinse, fractionHeldUp: retained };
}
