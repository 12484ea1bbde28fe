/**
 * Safety prompts shown beside the step that triggers them (common practice). They remind, they do not
 * authorise: local rules, the institution's chemical hygiene plan and safety office, and current safety data
 * sheets govern. Each text ends by saying so.
 */
import { type FlagContext } from "./flags";
import { stepName } from "./flags/context";
import { assumedFunnelMl } from "./flags/handling";
import { type Caution } from "./types";
import { GAS_MOLAR_VOLUME_ML_PER_MMOL, gasMolarVolumeMl } from "./units";

const DEFER = "Follow your local rules and your institution's safety plan; this is a prompt, not an approval.";
/** Gas worth a venting prompt, mL (≈0.2 mmol; assumption). */
const GAS_PROMPT_ML = 5;
/** Temperature rise worth an exotherm prompt, K (assumption). */
const EXOTHERM_PROMPT_K = 5;

export function evaluateCautions(ctx: FlagContext): Caution[] {
  const out: Caution[] = [];
  const once = new Set<string>();
  const add = (code: Caution["code"], step: number, text: string, key: string = code) => {
    if (once.has(key)) return;
    once.add(key);
    out.push({ code, step, text: `${text} ${DEFER}` });
  };
  const tags = new Set(ctx.input.components.flatMap((c) => c.tags));
  for (const t of ctx.contacts) {
    const gas = t.co2Mmol * gasMolarVolumeMl(t.temperatureC);
    if (gas >= GAS_PROMPT_ML) {
      const funnel = ctx.input.funnelMl ?? assumedFunnelMl(t.liquidVolume);
      const free = Math.max(funnel - t.liquidVolume, 1);
      const over = gas > free ? ` — more than the ${free.toFixed(0)} mL free volume of a ${funnel.toFixed(0)} mL funnel: neutralize in an open, stirred flask first, then` : ":";
      add("gas_evolution", t.step, `${stepName(ctx, t.step)} releases about ${gas.toFixed(0)} mL of CO₂ (${Number.isFinite(t.temperatureC) ? t.temperatureC.toFixed(0) : "25"} °C, 1 atm) in portion ${t.portion}${over} add slowly, swirl before stoppering, vent often with the stem pointed away from people, into the back of the hood.`, `gas${t.step}`);
    }
    if (t.temperatureRiseK >= EXOTHERM_PROMPT_K) {
      add("exotherm", t.step, `Neutralization in ${stepName(ctx, t.step)} releases about ${t.heatKJ.toFixed(1)} kJ, warming the mixture by about ${t.temperatureRiseK.toFixed(0)} K: add slowly with cooling, and let it cool before stoppering a funnel with low-boiling solvent.`, `heat${t.step}`);
    }
    if (t.twoPhase && t.organicSolvents.some((k) => (ctx.library.solvents[k]?.bpC.value ?? 999) < 45)) {
      add("volatile_solvent_pressure", t.step, `${stepName(ctx, t.step)} shakes a low-boiling solvent (ether or dichloromethane) in a closed funnel: vapour pressure builds up; vent after the first inversion and often afterwards.`);
    }
    if (tags.has("cyanide") && t.pH < 9) {
      add("cyanide", t.step, `Cyanide is present and the aqueous layer in ${stepName(ctx, t.step)} is predicted at pH ${t.pH.toFixed(1)}: acidifying cyanide releases HCN. Keep cyanide streams basic and collect their waste separately.`);
    }
    if (tags.has("azide") && (t.pH < 6 || t.organicSolvents.some((k) => ctx.library.solvents[k]?.chlorinated))) {
      add("azide", t.step, `Azide is present in ${stepName(ctx, t.step)}: acid forms volatile, toxic hydrazoic acid, and azide with dichloromethane can form explosive products.`);
    }
  }
  ctx.input.operations.forEach((op, i) => {
    const step = i + 1;
    if (op.type === "quench" && op.reactive) {
      const gas = op.reactive.gasPerMol !== undefined ? op.reactive.amountMmol * op.reactive.gasPerMol * GAS_MOLAR_VOLUME_ML_PER_MMOL : null;
      add("reactive_quench", step, `Quenching ${op.reactive.name} can run away: cool, dilute, add the quench slowly at a rate that lets heat and gas escape${gas !== null ? ` (about ${gas.toFixed(0)} mL of gas expected)` : ""}.`, `quench${step}`);
    }
    if (op.type === "concentrate" || op.type === "remove_cosolvent") {
      const ethers = evaporatedPeroxideFormers(ctx, step);
      if (ethers.length > 0 && !(op.type === "concentrate" && op.peroxideTested)) {
        add("peroxide_former", step, `${stepName(ctx, step)} evaporates ${ethers.join(", ")}, which form peroxides that concentrate on evaporation: test for peroxides first and never evaporate to dryness a solvent of unknown age.`, `perox${step}`);
      }
    }
  });
  for (const x of ctx.side) {
    let chlorinated = 0;
    for (let i = 1; i < ctx.lib.solventKeys.length; i++) if (ctx.lib.solvents[i]?.chlorinated) chlorinated += x.stream.solv[i] as number;
    if (x.fate === "waste" && chlorinated > 0.05) {
      add("chlorinated_waste", x.step, `The ${x.name} from ${stepName(ctx, x.step)} contains about ${chlorinated.toFixed(1)} mL of chlorinated solvent: collect it as halogenated waste, apart from non-halogenated and aqueous waste.`);
    }
    if (x.fate === "waste" && ["tin", "copper", "palladium", "nickel", "zinc"].some((m) => tags.has(m as never))) {
      add("heavy_metal_waste", x.step, `Metal residues go with the ${x.name} in ${stepName(ctx, x.step)}: collect it in the heavy-metal waste stream.`);
    }
  }
  if (tags.has("hf_source")) add("hydrogen_fluoride", 1, "The mixture contains an HF source: work in a fume hood with calcium gluconate gel at hand, in plastic, never alone, and send the waste through the hazardous-waste programme.");
  const toxic = ctx.lib.solvents.filter((s) => s.reproductiveToxicant).map((s) => s.key);
  if (toxic.length > 0) {
    const firstUse = ctx.input.mixture.solvents.some((s) => toxic.includes(s.solvent)) ? 1
      : ctx.input.operations.findIndex((op) => op.type === "charge" && toxic.includes(op.solvent)) + 1;
    if (firstUse > 0) add("reproductive_toxicant", firstUse, "Amide solvents (DMF, DMAc, NMP) are reproductive toxicants: handle them in the hood with suitable gloves.");
  }
  return out.sort((a, b) => a.step - b.step);
}

function evaporatedPeroxideFormers(ctx: FlagContext, step: number): string[] {
  const gone = ctx.side.filter((x) => x.step === step && x.fate === "evaporated");
  const names = new Set<string>();
  for (const g of gone) {
    for (let i = 1; i < ctx.lib.solventKeys.length; i++) {
      if ((g.stream.solv[i] as number) > 0.01 && ctx.lib.solvents[i]?.peroxideFormer) names.add(ctx.lib.solvents[i]?.name ?? "");
    }
  }
  return [...names];
}
