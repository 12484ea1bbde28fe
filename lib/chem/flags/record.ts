/** Record, reagent and measurement failure modes: F9, F19, F20, F26, F27, F28, F29. */
import { type ComponentTag } from "../schema";
import { flag, productInfo, stepName, type Rule } from "./context";

/** F9: crude mass at or above theoretical, or no purity measured. */
export const crudeMassSuspect: Rule = (ctx) => {
  const o = ctx.input.outcome;
  const p = productInfo(ctx);
  if (!o || !p) return [];
  const theoreticalG = (p.startMmol * p.component.molarMass) / 1000;
  if (o.crudeMassG !== undefined && o.crudeMassG >= theoreticalG) {
    return [flag("F9", "warning", "Crude mass at or above theoretical",
      `The recorded crude mass (${(o.crudeMassG * 1000).toFixed(0)} mg) is at least the theoretical ${(theoreticalG * 1000).toFixed(0)} mg of ${p.component.name}: solvent, water or salts are in it, so it is not product mass.`,
      "Dry to constant mass; measure purity by qNMR with an internal standard and water by Karl Fischer.")];
  }
  if (o.crudeMassG !== undefined && (o.purityPct === undefined || o.purityMethod === "none")) {
    return [flag("F9", "info", "No purity measured", "A crude mass without a purity assay gives no product amount: the apparent yield cannot be compared with the prediction or used to fit K.",
      "Assay the crude by qNMR with an internal standard (or calibrated HPLC).")];
  }
  return [];
};

const LIPOPHILIC_HINT = "trifluoroacetate, triflate, tosylate, iodide, BF₄⁻ or PF₆⁻";

/** Share of a component that must be charged at a contact before its ion pair is worth a flag (5 %, a judgement). */
export const ION_PAIR_MIN_CHARGED = 0.05;

/** F19: cation with a lipophilic counter-ion meeting a chlorinated solvent while it is (at least 5 %) charged. */
export const ionPair: Rule = (ctx) => {
  for (const [ci, c] of ctx.input.components.entries()) {
    const cationic = c.fixedCharge > 0 || c.tags.includes("quaternary_ammonium") || c.pKas.some((p) => p.kind === "base");
    if (!cationic || (c.counterIon !== "lipophilic" && !c.tags.includes("quaternary_ammonium"))) continue;
    // Only where the cation is there to pair: a free amine at pH 12 is neutral and extracts as such (F1/F2's concern).
    const t = ctx.contacts.find((x) => x.twoPhase && x.organicSolvents.some((k) => ctx.library.solvents[k]?.ionPairCapable)
      && (x.amounts[ci] as number) > 0 && 1 - (x.fractionNeutral[ci] as number) >= ION_PAIR_MIN_CHARGED);
    if (!t) continue;
    return [flag("F19", "warning", "Ion pair may extract into the chlorinated layer",
      `${c.name} is a cation with a lipophilic counter-ion (${LIPOPHILIC_HINT}); in ${stepName(ctx, t.step)} it meets a chlorinated solvent, where such ion pairs dissolve — an acid wash may not remove it, or an ionic product may stay in the organic layer.`,
      "Exchange to a hydrophilic counter-ion (excess chloride or hydrogen-sulfate wash), switch to a less polar solvent (ether, toluene), or change the pH.",
      { step: t.step, component: c.key })];
  }
  return [];
};

const QUENCH_FOR: Partial<Record<ComponentTag, { reagents: string[]; solvents?: string[]; advice: string }>> = {
  aluminium: { reagents: ["rochelle_sat", "naoh_1m", "naoh_10pct"], advice: "a Fieser sequence (water, 15% NaOH, water), saturated Rochelle salt stirred until two clear layers form, or Na₂SO₄·10H₂O" },
  tin: { reagents: ["kf_1m"], advice: "aqueous KF, which precipitates tin fluorides for filtration" },
  copper: { reagents: ["nh4cl_sat", "nh4cl_nh3_ph9"], advice: "NH₄Cl or NH₄Cl/NH₃ washes, which take copper into water as its blue ammine complex" },
  boron: { reagents: [], solvents: ["meoh"], advice: "repeated co-evaporation with methanol (as trimethyl borate)" },
};

/** F20: metal reagent whose usual quench or removal wash is missing. */
export const wrongQuench: Rule = (ctx) => {
  const used = new Set<string>();
  for (const op of ctx.input.operations) {
    if ("reagent" in op) used.add(op.reagent);
    if (op.type === "charge") used.add(op.solvent);
  }
  for (const r of ctx.input.mixture.reagents) used.add(r.reagent);
  for (const c of ctx.input.components) {
    for (const tag of c.tags) {
      const rule = QUENCH_FOR[tag];
      if (!rule) continue;
      if (rule.reagents.some((r) => used.has(r)) || rule.solvents?.some((s) => used.has(s))) continue;
      return [flag("F20", "warning", "Metal salts: usual quench or removal step missing",
        `${c.name} brings ${tag} into the work-up, but the record has no step that usually deals with it; metal salts can form gels or stay in the product (10–50% trapped is common practice, unmeasured).`,
        `Use ${rule.advice}; filter through Celite and wash the cake well.`, { component: c.key })];
    }
  }
  return [];
};

/** F26: no in-process assay: a reaction shortfall cannot be told from a work-up loss. */
export const noInProcessAssay: Rule = (ctx) => {
  const o = ctx.input.outcome;
  if (!o || o.inProcessAssay === true) return [];
  return [flag("F26", "info", "No in-process assay before the quench",
    "Without a quantitative sample of the reaction before the quench, a low yield cannot be split between the reaction and the work-up: the prediction starts from the theoretical amounts.",
    "Take a quantitative sample with an internal standard before the quench.")];
};

/** F27: small scale or semi-quantitative purity method. */
export const measurementArtefact: Rule = (ctx) => {
  const p = productInfo(ctx);
  if (!p) return [];
  const mg = p.startMmol * p.component.molarMass;
  const method = ctx.input.outcome?.purityMethod;
  const reasons: string[] = [];
  if (mg < 20) reasons.push(`the product scale is ${mg.toFixed(1)} mg, where weighing and transfer errors reach several percent`);
  if (method === "hplc_area") reasons.push("purity is HPLC area % without response factors");
  if (method === "nmr_no_standard") reasons.push("purity is from NMR integration without an internal standard");
  if (reasons.length === 0) return [];
  return [flag("F27", "info", "Measurement may not support a precise yield", `The recovery measurement is uncertain: ${reasons.join("; ")}.`,
    "Use qNMR with a certified internal standard or calibrated HPLC; widen the uncertainty and leave the record out of K fitting.")];
};

const CHELATED_METALS: ComponentTag[] = ["copper", "zinc", "palladium", "nickel", "iron"];

/** F28: chelating product with a transition metal present. */
export const chelation: Rule = (ctx) => {
  const p = productInfo(ctx);
  if (!p?.component.chelating) return [];
  const metals = [...new Set(ctx.input.components.flatMap((c) => c.tags.filter((t) => CHELATED_METALS.includes(t))))];
  if (metals.length === 0) return [];
  return [flag("F28", "warning", "Product may bind the metal",
    `${p.component.name} has a chelating motif and ${metals.join(", ")} is present: the product can be dragged into the aqueous layer or solid metal residues, and the crude may be coloured.`,
    "Use complexing washes (NH₃/NH₄Cl for copper, EDTA) or a metal scavenger.", { component: p.component.key })];
};

/** F29: oxidant or peroxide not destroyed before concentration. */
export const oxidantNotQuenched: Rule = (ctx) => {
  const ox = ctx.input.components.find((c) => c.tags.includes("oxidant") || c.tags.includes("peroxide"));
  if (!ox) return [];
  const conc = ctx.steps.find((s) => s.type === "concentrate");
  if (!conc) return [];
  const reduced = ctx.input.operations.slice(0, conc.index - 1).some((op) => "reagent" in op && ctx.library.reagents[op.reagent]?.purpose === "reducing");
  if (reduced) return [];
  return [flag("F29", "danger", "Oxidant not destroyed before concentration",
    `${ox.name} is an oxidant, and no reducing wash comes before ${stepName(ctx, conc.index)}: concentrating it can decompose the product or explode.`,
    "Wash with aqueous thiosulfate or sulfite, confirm with a peroxide test strip or KI test, and follow your institution's rules for peroxides.",
    { step: conc.index, component: ox.key })];
};
