/**
 * Choices for the solvent, reagent, salt and drying-agent pickers, from the group's library (the shipped tables with
 * the group's own entries over them). A value a record names that the library lacks stays selectable, marked, so
 * an old record still shows what it says and the message beside the field explains the problem.
 */
import { type Library } from "@/lib/chem/library";
import { type ReagentPurpose } from "@/lib/chem/data/reagents";

export interface Choice {
  value: string;
  label: string;
}

export interface ChoiceGroup {
  label: string;
  choices: Choice[];
}

const byLabel = (a: Choice, b: Choice) => a.label.localeCompare(b.label, "en");

export type SolventUse = "any" | "layer" | "miscible";

export function solventChoices(lib: Library, use: SolventUse): ChoiceGroup[] {
  const all = Object.values(lib.solvents);
  const layer = all.filter((s) => !s.waterMiscible).map((s) => ({ value: s.key, label: s.name })).sort(byLabel);
  const miscible = all.filter((s) => s.waterMiscible).map((s) => ({ value: s.key, label: s.name })).sort(byLabel);
  if (use === "layer") return [{ label: "Form a layer with water", choices: layer }];
  if (use === "miscible") return [{ label: "Water-miscible", choices: miscible }];
  return [{ label: "Form a layer with water", choices: layer }, { label: "Water and water-miscible", choices: miscible }];
}

const PURPOSE_LABELS: Record<ReagentPurpose, string> = {
  acid: "Acids", base: "Bases", buffer: "Buffers", neutral: "Water", salt: "Salt solutions", reducing: "Reducing washes", complexing: "Complexing washes",
};
const PURPOSE_ORDER: ReagentPurpose[] = ["neutral", "salt", "base", "acid", "buffer", "reducing", "complexing"];

/** Aqueous solutions for washes, quenches and pH changes, grouped by what they do. */
export function reagentChoices(lib: Library, kind: "solution" | "solid"): ChoiceGroup[] {
  const rows = Object.values(lib.reagents).filter((r) => r.kind === kind);
  return PURPOSE_ORDER.map((purpose) => ({
    label: PURPOSE_LABELS[purpose],
    choices: rows.filter((r) => r.purpose === purpose).map((r) => ({ value: r.key, label: r.name })).sort(byLabel),
  })).filter((g) => g.choices.length > 0);
}

export function dryingAgentChoices(lib: Library): ChoiceGroup[] {
  return [{ label: "Drying agents", choices: Object.values(lib.dryingAgents).map((a) => ({ value: a.key, label: a.name })).sort(byLabel) }];
}

/** The groups, plus the current value when the library does not know it. */
export function withCurrent(groups: ChoiceGroup[], current: string): ChoiceGroup[] {
  if (current === "" || groups.some((g) => g.choices.some((c) => c.value === current))) return groups;
  return [{ label: "Not in the library", choices: [{ value: current, label: `${current} (not in the library)` }] }, ...groups];
}

/** Display name of a solvent, reagent or drying agent key (the key itself when unknown). */
export function libraryName(lib: Library, key: string): string {
  return lib.solvents[key]?.name ?? lib.reagents[key]?.name ?? lib.dryingAgents[key]?.name ?? key;
}
