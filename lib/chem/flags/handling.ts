/** Handling failure modes: F13, F14, F15, F17, F23. */
import { DRYING_AGENT_EXCESS_LOAD, DRYING_AGENT_MAX_LOAD } from "../data/drying-agents";
import { gasMolarVolumeMl } from "../units";
import { flag, operationOf, pct, productInfo, stepName, type Rule } from "./context";

const FUNNEL_SIZES_ML = [60, 125, 250, 500, 1000, 2000, 5000];

/** Funnel assumed when the record gives none: the smallest standard size at least 1.5 × the liquid (common practice). */
export function assumedFunnelMl(liquidMl: number): number {
  return FUNNEL_SIZES_ML.find((s) => s >= 1.5 * liquidMl) ?? 2 * liquidMl;
}

/** F13: CO₂ from one portion fills more than a quarter of the funnel's headspace (common practice). */
export const co2Foaming: Rule = (ctx) => {
  for (const t of ctx.contacts) {
    if (t.co2Mmol <= 0) continue;
    const gas = t.co2Mmol * gasMolarVolumeMl(t.temperatureC);
    const funnel = ctx.input.funnelMl ?? assumedFunnelMl(t.liquidVolume);
    const headspace = Math.max(funnel - t.liquidVolume, 1);
    if (gas <= 0.25 * headspace) continue;
    return [flag("F13", gas > headspace ? "danger" : "warning", "CO₂ foaming or ejection",
      `${stepName(ctx, t.step)} releases about ${gas.toFixed(0)} mL of CO₂ (${t.co2Mmol.toFixed(1)} mmol) in one portion, ${pct(gas / headspace)} of the ${headspace.toFixed(0)} mL headspace of a ${funnel.toFixed(0)} mL funnel.`,
      "Neutralize in an open, stirred flask first; add slowly; swirl unstoppered before stoppering; vent often.", { step: t.step })];
  }
  return [];
};

/** Share of the product lost to evaporation above which F14 is a danger rather than a warning. */
const F14_DANGER_LOSS = 0.2;
/** Share lost that raises F14 even for a product boiling above the warning boiling point. */
const F14_WARN_LOSS = 0.02;

/** F14: volatile product on concentration, from the evaporation model's predicted loss at the step. */
export const volatileProduct: Rule = (ctx) => {
  const p = productInfo(ctx);
  const bp = p?.component.bpC;
  if (!p || bp === undefined || p.startMmol <= 0) return [];
  for (const s of ctx.steps) {
    const op = operationOf(ctx, s.index);
    if (op?.type !== "concentrate") continue;
    let lost = 0;
    for (const x of ctx.side) if (x.step === s.index && x.fate === "evaporated") lost += (x.stream.comp[p.index] as number) / p.startMmol;
    const warnBelow = op.method === "high_vacuum" ? 250 : 150;
    if (bp >= warnBelow && lost < F14_WARN_LOSS) continue;
    const where = op.method === "high_vacuum" ? "high vacuum" : "concentration";
    return [flag("F14", lost > F14_DANGER_LOSS ? "danger" : "warning", "Volatile product lost on concentration",
      `${p.component.name} boils at ${bp.toFixed(0)} °C; ${where} in ${stepName(ctx, s.index)} (bath ${op.bathC.toFixed(0)} °C, ${Number(s.details.pressureMbar ?? 0).toPrecision(3)} mbar) is predicted to carry away about ${pct(lost)} of it with the solvent.`,
      "Control the pressure, keep the bath cool, stop with some solvent left and quantify by qNMR, or extract into a low-boiling solvent (pentane, ether).",
      { step: s.index, component: p.component.key })];
  }
  return [];
};

/** F15: product held back by the drying agent or filter cake. */
export const heldUp: Rule = (ctx) => {
  const p = productInfo(ctx);
  if (!p || p.startMmol <= 0) return [];
  const out = [];
  for (const x of ctx.side) {
    if (x.fate !== "drying_agent" && x.fate !== "filter_cake") continue;
    const f = (x.stream.comp[p.index] as number) / p.startMmol;
    const op = operationOf(ctx, x.step);
    const agent = op?.type === "dry" ? ctx.library.dryingAgents[op.agent] : undefined;
    const amineTrap = agent?.retains.includes("amines") && p.basePka !== null && p.basePka > 8;
    if (f <= 0.01 && !amineTrap) continue;
    // Advice agrees with F23: "use less agent" only when the agent is in clear excess, never when it is loaded.
    const step = ctx.steps.find((t) => t.index === x.step);
    const load = loadOf(ctx, x.step);
    const remedies = [
      load !== null && load < DRYING_AGENT_EXCESS_LOAD ? "use less agent (a brine wash first lowers the need)" : "",
      op?.type === "dry" && step?.details.defaultRinse === true
        ? "rinse the spent agent with fresh solvent (the prediction assumes two portions, each twice the solution it holds)"
        : "rinse the solid with more fresh solvent, in several small portions",
      amineTrap ? "or dry basic amines over Na₂SO₄ or K₂CO₃" : "",
    ].filter(Boolean);
    out.push(flag("F15", "warning", "Product held back by the drying agent or filter cake",
      [f > 0.01 ? `About ${pct(f)} of ${p.component.name} stays in the solution held by the ${x.name} in ${stepName(ctx, x.step)}.` : "",
        amineTrap ? `${agent?.name ?? "The agent"} is mildly Lewis-acidic and can hold basic amines.` : ""].filter(Boolean).join(" "),
      `${remedies.join("; ").replace(/^./, (c) => c.toUpperCase())}.`,
      { step: x.step, component: p.component.key }));
    break;
  }
  return out;
};

/** Water load of a dry step's agent as a share of its theoretical capacity; null for other steps. */
function loadOf(ctx: Parameters<Rule>[0], step: number): number | null {
  const op = operationOf(ctx, step);
  const s = ctx.steps.find((t) => t.index === step);
  if (op?.type !== "dry" || !s) return null;
  const cap = ctx.library.dryingAgents[op.agent]?.capacityGPerG.value ?? 1;
  const used = Number(s.details.agentUsedG ?? 0);
  return used > 0 ? Number(s.details.waterG ?? 0) / (cap * used) : null;
}

/** F17: neutral form above its solubility in either layer. */
export const precipitation: Rule = (ctx) => {
  const out = [];
  for (const [ci, c] of ctx.input.components.entries()) {
    const sw = c.solubility?.water;
    const so = c.solubility?.organic;
    if (sw === undefined && so === undefined) continue;
    for (const t of ctx.contacts) {
      if (!t.twoPhase && t.aqueousVolume <= 0) continue;
      const fa = t.fractionAqueous[ci] as number;
      const amount = t.amounts[ci] as number;
      const aqMgMl = (amount * fa * (t.fractionNeutral[ci] as number) * c.molarMass) / Math.max(t.aqueousVolume, 1e-9);
      const orgMgMl = t.organicVolume > 0 ? (amount * (1 - fa) * c.molarMass) / t.organicVolume : 0;
      const overAq = sw !== undefined && aqMgMl > sw;
      const overOrg = so !== undefined && orgMgMl > so;
      if (!overAq && !overOrg) continue;
      out.push(flag("F17", "warning", "Solid may form at the interface",
        `In ${stepName(ctx, t.step)} the neutral ${c.name} may reach ${overAq ? `${aqMgMl.toFixed(1)} mg/mL in water (solubility ${sw} mg/mL)` : `${orgMgMl.toFixed(1)} mg/mL in the organic layer (solubility ${so} mg/mL)`}; it can come out as a solid and be discarded with a layer or filter.`,
        "Add solvent or warm gently; filter and assay any solid separately (it is often the product), or isolate it deliberately by filtration.",
        { step: t.step, component: c.key }));
      break;
    }
  }
  return out;
};

/** F23: wet organic layer (no drying with a solvent that holds > 1 % water) or drying agent overloaded. */
export const wetOrganic: Rule = (ctx) => {
  const dried = ctx.steps.filter((s) => s.type === "dry");
  for (const s of dried) {
    const left = Number(s.details.waterLeftG ?? 0);
    const load = Number(s.details.waterG ?? 0);
    const used = Number(s.details.agentUsedG ?? 0);
    const op = operationOf(ctx, s.index);
    const cap = op?.type === "dry" ? ctx.library.dryingAgents[op.agent]?.capacityGPerG.value ?? 1 : 1;
    if (left > 1e-6 || load > DRYING_AGENT_MAX_LOAD * cap * used) {
      return [flag("F23", "warning", "Drying agent overloaded",
        `${stepName(ctx, s.index)} has about ${load.toFixed(2)} g of water to take up with ${used.toFixed(1)} g of agent (${pct(load / Math.max(cap * used, 1e-9))} of its theoretical capacity).`,
        "Wash with brine first and add agent until some stays free-flowing.", { step: s.index })];
    }
  }
  const conc = ctx.steps.find((s) => s.type === "concentrate");
  if (conc && dried.length === 0) {
    const water = Number(conc.details.waterMl ?? 0);
    // Solvents that hold > 1 wt% water (EtOAc, ether, 2-MeTHF, BuOH; F23, common practice): dissolved water above 0.5 vol%.
    if (water > 0.005 * Number(conc.details.volumeMl ?? Infinity)) {
      return [flag("F23", "warning", "Organic layer not dried before concentration",
        `About ${water.toFixed(2)} mL of water is predicted in the organic solution concentrated in ${stepName(ctx, conc.index)}: it inflates the crude mass and carries salts into it.`,
        "Wash with brine, then dry over MgSO₄ or Na₂SO₄ until some agent stays free-flowing.", { step: conc.index })];
    }
  }
  return [];
};
