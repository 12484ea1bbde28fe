/**
 * Procedure text out: a workup's steps written as a journal-style experimental paragraph, in the phrasing that
 * `readProcedure` reads back to the same steps (the round trip text → steps → text → steps is stable).
 */
import { dryingAgentDisplay, reagentDisplay, solventDisplay } from "./lexicon";
import { type ProposedStep } from "./parse";

type Quantity = { value: number; unit: string };

const isQuantity = (v: unknown): v is Quantity =>
  typeof v === "object" && v !== null && typeof (v as Quantity).value === "number" && typeof (v as Quantity).unit === "string";

function unitText(u: string): string {
  return u === "uL" ? "µL" : u;
}

function amount(step: ProposedStep): string {
  const v = step["volume"];
  if (!isQuantity(v)) return "";
  const portions = typeof step["portions"] === "number" ? step["portions"] : 1;
  return portions > 1 ? ` (${portions} × ${v.value} ${unitText(v.unit)})` : ` (${v.value} ${unitText(v.unit)})`;
}

function list(items: string[]): string {
  if (items.length <= 1) return items.join("");
  return `${items.slice(0, -1).join(", ")} and ${items.at(-1)}`;
}

function rinseText(step: ProposedStep): string {
  const r = step["rinse"] as { solvent?: string; volume?: unknown } | undefined;
  if (!r?.solvent || !isQuantity(r.volume)) return "";
  return `, rinsing with ${solventDisplay(r.solvent)} (${r.volume.value} ${unitText(r.volume.unit)})`;
}

function phrase(step: ProposedStep): string {
  switch (step.type) {
    case "charge": return `diluted with ${solventDisplay(String(step["solvent"]))}${amount(step)}`;
    case "quench": return step["mode"] === "inverse"
      ? `quenched by pouring into ${reagentDisplay(String(step["reagent"]))}${amount(step)}`
      : `quenched with ${reagentDisplay(String(step["reagent"]))}${amount(step)}`;
    case "extract": return `extracted with ${solventDisplay(String(step["solvent"]))}${amount(step)}`;
    case "back_extract": return `extracted with ${reagentDisplay(String(step["reagent"]))}${amount(step)}`;
    case "adjust_ph": {
      const reagent = reagentDisplay(String(step["reagent"]));
      if (typeof step["targetPh"] === "number") return `adjusted to pH ${step["targetPh"]} with ${reagent}`;
      const a = step["amount"];
      if (isQuantity(a)) return `adjusted with ${reagent} (${a.value} ${a.unit})`;
      return `adjusted with ${reagent}${amount(step)}`;
    }
    case "add_salt": {
      const m = step["mass"];
      return isQuantity(m) ? `treated with solid NaCl (${m.value} ${m.unit})` : "saturated with NaCl";
    }
    case "dry": {
      const m = step["mass"];
      const agent = dryingAgentDisplay(String(step["agent"]));
      return `${isQuantity(m) ? `dried over ${agent} (${m.value} ${m.unit})` : `dried (${agent})`}, filtered${rinseText(step)}`;
    }
    case "filter": return step["keep"] === "solid" ? `the solid was collected by filtration${rinseText(step)}` : `filtered${rinseText(step)}`;
    case "concentrate": {
      const method = step["method"];
      const bath = step["bath"], p = step["pressure"];
      const extra = [isQuantity(bath) ? `bath ${bath.value} °C` : "", isQuantity(p) ? `${p.value} ${p.unit}` : ""].filter(Boolean).join(", ");
      const how = method === "high_vacuum" ? "concentrated under high vacuum" : method === "n2_stream" ? "concentrated under a stream of nitrogen"
        : method === "distillation" ? "concentrated by distillation" : "concentrated under reduced pressure";
      return extra ? `${how} (${extra})` : how;
    }
    default: return `${step.type.replace(/_/g, " ")}`;
  }
}

/** The steps of a stored spec's operation list (anything without a type is passed over). */
export function stepsOf(operations: readonly unknown[]): ProposedStep[] {
  return operations.filter((v): v is ProposedStep => typeof v === "object" && v !== null && typeof (v as { type?: unknown }).type === "string");
}

/** Writes steps as one paragraph; each sentence names what it acts on. */
export function renderProcedure(steps: ProposedStep[]): string {
  const sentences: string[] = [];
  let subject = "The mixture was";
  let phrases: string[] = [];
  const flush = () => {
    if (phrases.length) sentences.push(`${subject} ${list(phrases)}.`);
    phrases = [];
  };
  for (let i = 0; i < steps.length; i++) {
    const step = steps[i] as ProposedStep;
    if (step.type === "wash") {
      const group: string[] = [];
      while (steps[i]?.type === "wash") { const w = steps[i] as ProposedStep; group.push(`${reagentDisplay(String(w["reagent"]))}${amount(w)}`); i++; }
      i--;
      phrases.push(`washed with ${list(group)}`);
      continue;
    }
    if (step.type === "separate") {
      flush();
      const next = steps[i + 1];
      if (step["keep"] === "aqueous" && next?.type === "extract") {
        sentences.push(`The layers were separated and the aqueous layer was ${phrase(next)}.`);
        i++;
        subject = "The organic layers were";
      } else {
        sentences.push(step["keep"] === "aqueous" ? "The aqueous layer was kept." : "The layers were separated.");
        subject = step["keep"] === "aqueous" ? "The aqueous layer was" : "The organic layer was";
      }
      continue;
    }
    if (step.type === "remove_cosolvent") {
      flush();
      sentences.push(`The ${solventDisplay(String(step["solvent"]))} was removed under reduced pressure.`);
      continue;
    }
    if (step.type === "combine") {
      flush();
      subject = "The combined organic layers were";
      continue;
    }
    if (step.type === "back_extract") {
      phrases.push(phrase(step));
      flush();
      subject = "The combined aqueous extracts were";
      continue;
    }
    phrases.push(phrase(step));
  }
  flush();
  return sentences.join(" ");
}
