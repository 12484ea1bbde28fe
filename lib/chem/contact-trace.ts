/**
 * What the simulator records about a contact for the failure-mode flags and safety cautions (trace.ts): layer
 * densities and order, solvent shares, the species split, heat of neutralization and whether a wash reagent
 * was spent. Built only when flags or per-step detail are asked for.
 */
import { HEAT_OF_NEUTRALIZATION_KJ_PER_MOL, reagentPh, systemBoundProtons } from "./aqueous";
import { type Equilibrator } from "./equilibrium";
import { CARBONATE, WATER, type CompiledReagent } from "./library";
import { layerOrder } from "./phases";
import { type AcidBaseContent, type ContactContext, type Simulator } from "./simulator";
import { type Stream } from "./stream";
import { type ContactTrace } from "./trace";

/** Heat capacities for the temperature-rise estimate, J g⁻¹ K⁻¹: water 4.18; organic solvents ≈1.9 (memory). */
const CP_WATER = 4.18;
const CP_ORGANIC = 1.9;

export function traceContact(sim: Simulator, mix: Stream, org: Stream, aq: Stream, ctx: ContactContext): ContactTrace {
  const { eq, lib, comps } = sim;
  const p = eq.phases;
  const rhoOrg = p.density(p.org, 0, sim.componentMass(org));
  const rhoAq = p.density(p.aq, mix.extraMassG, sim.componentMass(aq));
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
  const heat = ctx.before ? heatOfContact(eq, ctx.before, aq) : 0;
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
function heatOfContact(eq: Equilibrator, before: AcidBaseContent, aq: Stream): number {
  if (!Number.isFinite(eq.pH)) return 0;
  const after = eq.freeAcidBase();
  const hAfter = 10 ** -eq.pH;
  const carbAfter = (aq.sys[CARBONATE] as number) * systemBoundProtons(CARBONATE, hAfter) + 2 * eq.co2Mmol;
  const consumed = Math.max(before.h - after.h, before.oh - after.oh, 0);
  const n = Math.max(0, consumed - Math.max(0, carbAfter - before.carbonateProtons));
  return (n / 1000) * -HEAT_OF_NEUTRALIZATION_KJ_PER_MOL;
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
