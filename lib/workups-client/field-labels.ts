/**
 * What the editor calls each field (the label the form shows, the step or component it belongs to, the unit typed
 * beside it), so a validation message reads in the form's words: "Step 2 (Adjust pH): Target pH must be between −2
 * and 16", not "targetPh must be between −2 and 16". Field keys are those of field-errors.ts.
 */
import { COMMON_FIELDS, operationMeta } from "./operation-forms";
import { unitKey, type EditorState, type HeaderState } from "./editor-types";

/** The header's labels, as the record section shows them. */
export const HEADER_LABELS: Record<keyof HeaderState, string> = {
  title: "Title", performedOn: "Date run", chemistId: "Chemist", notebookRef: "Notebook reference", notebookUrl: "Notebook entry address (URL)",
  scaleMmol: "Reaction scale (mmol)", expectedProductMmol: "Expected product (mmol)", assayedProductMmol: "Product assayed before the workup (mmol)",
};

const SETTINGS_LABELS: Record<string, string> = { name: "Name", temperature: "Workup temperature", funnel: "Separatory funnel size" };

const COMPONENT_LABELS: Record<string, string> = {
  name: "Name", role: "Role", amount: "Amount", molarMass: "Molar mass (g/mol)", logP: "log P", "logP.provenance": "log P from",
  "logP.source": "Source of log P", smiles: "Structure (SMILES)", key: "Name", pKas: "pKa values",
};

const NESTED_LABELS: Record<string, string> = {
  "rinse.solvent": "Rinse solvent", "rinse.volume": "Rinse volume", "reactive.name": "Species", "reactive.amount": "Amount left to quench",
  "reactive.gasPerMol": "Gas (mol per mol)",
};

export interface FieldLabel {
  /** Where the field is, when the label alone is ambiguous: "Step 2 (Wash)", "Component 1 (Benzoic acid)". */
  place: string | null;
  /** The field's label ("Volume per portion"), or null for a whole row or section. */
  label: string | null;
  /** The unit typed beside a quantity ("mL"), when it has one. */
  unit: string | null;
}

const unitWords = (unit: string | undefined | null) => (!unit ? null : unit === "uL" ? "µL" : unit === "umol" ? "µmol" : unit);

function splitKey(key: string): [string, string] {
  const dot = key.indexOf(".");
  return dot < 0 ? [key, ""] : [key.slice(0, dot), key.slice(dot + 1)];
}

export function fieldLabel(key: string, state: EditorState): FieldLabel {
  const [head, field] = splitKey(key);
  if (head === "header") return { place: null, label: HEADER_LABELS[field as keyof HeaderState] ?? null, unit: null };
  if (head === "settings") {
    const q = field === "temperature" ? state.settings.temperature : field === "funnel" ? state.settings.funnel : null;
    return { place: null, label: SETTINGS_LABELS[field] ?? null, unit: unitWords(q?.unit) };
  }
  if (head === "components") return { place: "Components", label: null, unit: null };
  if (head === "operations") return { place: "Steps", label: null, unit: null };
  if (head === "mixture") return { place: "Starting mixture", label: null, unit: null };
  const [kind, id] = head.split(":");
  if (kind === "op") {
    const index = state.operations.findIndex((o) => o.id === id);
    const op = state.operations[index];
    if (!op) return { place: "Steps", label: null, unit: null };
    const meta = operationMeta(op.type);
    const place = `Step ${index + 1} (${meta.label})`;
    if (field === "") return { place, label: null, unit: null };
    if (field === "type") return { place, label: "Type of step", unit: null };
    const own = [...meta.fields, ...COMMON_FIELDS].find((f) => f.name === field);
    const label = NESTED_LABELS[field] ?? (field === "label" ? "Description" : own?.label) ?? null;
    return { place, label, unit: unitWords(op.values[unitKey(field)]) };
  }
  if (kind === "comp" || kind === "pka") {
    const index = state.components.findIndex((c) => (kind === "comp" ? c.id === id : c.pKas.some((p) => p.id === id)));
    const c = state.components[index];
    if (!c) return { place: "Components", label: null, unit: null };
    const place = `Component ${index + 1}${c.name.trim() ? ` (${c.name.trim()})` : ""}`;
    if (kind === "pka") {
      const n = c.pKas.findIndex((p) => p.id === id) + 1;
      return { place, label: field === "kind" ? `Site ${n}` : field === "provenance" ? `Where pKa ${n} comes from` : `pKa ${n}`, unit: null };
    }
    if (field === "") return { place, label: null, unit: null };
    return { place, label: COMPONENT_LABELS[field] ?? null, unit: field === "amount" ? unitWords(c.amount.unit) : null };
  }
  if (kind === "mix") {
    const solvent = state.mixture.solvents.findIndex((r) => r.id === id);
    const reagent = state.mixture.reagents.findIndex((r) => r.id === id);
    const row = solvent >= 0 ? state.mixture.solvents[solvent] : state.mixture.reagents[reagent];
    const what = solvent >= 0 ? `solvent ${solvent + 1}` : `aqueous reagent ${reagent + 1}`;
    const label = field === "volume" ? `Volume of ${what}` : field === "" ? null : what.charAt(0).toUpperCase() + what.slice(1);
    return { place: "Starting mixture", label, unit: field === "volume" ? unitWords(row?.volume.unit) : null };
  }
  return { place: null, label: null, unit: null };
}

/** The words a verdict starts with in the schemas' messages ("volume must be > 0", "reagent is required"). */
const VERDICT = /\b(must|is required|is not|are not|cannot|should|needs?)\b/;

/** The label without a trailing unit in brackets: "Purity (mass %)" → "Purity". */
export const bareLabel = (label: string) => label.replace(/\s*\([^)]*\)\s*$/, "");

/**
 * A message in the form's words. The schemas name a field by its key ("targetPh must be …", "volume per portion
 * must be > 0"); the subject is replaced by the field's label and a bound ending in a bare number gets the unit typed
 * beside the field. A message that already starts with the label, or does not start with the field's name, is kept.
 */
export function inFormWords(message: string, name: FieldLabel, fieldName: string): string {
  const text = message.trim();
  const label = name.label ? bareLabel(name.label) : null;
  const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
  if (!label) return capital(text);
  if (text.toLowerCase().startsWith(label.toLowerCase())) return withUnit(label + text.slice(label.length), name.unit);
  const verdict = VERDICT.exec(text);
  const subject = verdict ? text.slice(0, verdict.index).trim() : "";
  const last = fieldName.split(".").at(-1) ?? "";
  const squash = (s: string) => s.toLowerCase().replace(/[^a-z0-9]/g, "");
  const named = [last, fieldName].map(squash).filter((n) => n !== "");
  if (verdict && subject !== "" && named.some((n) => squash(subject).startsWith(n))) {
    return withUnit(`${label} ${text.slice(verdict.index)}`, name.unit);
  }
  return capital(text);
}

/**
 * "must be > 0" → "must be > 0 mL" and "must be a number" → "must be a number (mL)" for a quantity typed in mL; a
 * bound that names its own unit is left alone.
 */
function withUnit(text: string, unit: string | null): string {
  if (!unit) return text;
  if (/\bmust be a number$/.test(text)) return `${text} (${unit})`;
  return /\d$/.test(text) ? `${text} ${unit}` : text;
}

/** "Step 2 (Wash): Volume per portion must be > 0 mL", or the message alone when the label says it all. */
export function summaryLine(message: string, name: FieldLabel): string {
  return name.place ? `${name.place}: ${message}` : message;
}

/** Every message of one field key in the form's words. */
export function wordedMessages(key: string, messages: readonly string[], state: EditorState): string[] {
  const name = fieldLabel(key, state);
  return [...new Set(messages.map((m) => inFormWords(m, name, splitKey(key)[1])))];
}

const SECTION_ORDER = ["header", "settings", "components", "comp", "pka", "mixture", "mix", "operations", "op"];

/** Where a field key sits in the form, top to bottom, for ordering the error summary like the form. */
export function formOrder(key: string, state: EditorState): number[] {
  const [head, field] = splitKey(key);
  const [kind, id] = head.includes(":") ? head.split(":") : [head, ""];
  const section = SECTION_ORDER.indexOf(kind ?? "");
  const rank = section < 0 ? SECTION_ORDER.length : section;
  if (kind === "header") return [rank, Object.keys(HEADER_LABELS).indexOf(field)];
  if (kind === "comp" || kind === "pka") {
    const i = state.components.findIndex((c) => (kind === "comp" ? c.id === id : c.pKas.some((p) => p.id === id)));
    return [SECTION_ORDER.indexOf("comp"), i, kind === "pka" ? 1 : 0];
  }
  if (kind === "mix") return [rank, state.mixture.solvents.findIndex((r) => r.id === id), state.mixture.reagents.findIndex((r) => r.id === id)];
  if (kind === "op") return [rank, state.operations.findIndex((o) => o.id === id)];
  return [rank];
}

export function compareFormOrder(a: number[], b: number[]): number {
  for (let i = 0; i < Math.max(a.length, b.length); i++) {
    const d = (a[i] ?? -1) - (b[i] ?? -1);
    if (d !== 0) return d;
  }
  return 0;
}
