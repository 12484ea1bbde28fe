/**
 * The library editor's form: every field of a solvent or reagent entry as a labelled path, and the conversion
 * between an entry and the form's strings. Blank optional groups (solubilities of a miscible solvent, partition
 * lines, cosolvency) become null, so the schema can say which ones a given entry needs. Browser-safe.
 */
import { ACID_SYSTEM_KEYS, CONFIDENCES, REAGENT_PURPOSES, SOLVENT_FAMILIES, STRONG_IONS } from "./schemas";

export type FormFieldKind = "text" | "number" | "bool" | "select" | "sourced";

export interface FormField {
  path: string;
  label: string;
  kind: FormFieldKind;
  options?: readonly string[];
  hint?: string;
  /** Blank means null (sourced values and groups) or absent (optional). */
  blank?: "null" | "omit";
  section: string;
}

const f = (section: string, path: string, label: string, kind: FormFieldKind, extra: Partial<FormField> = {}): FormField => ({ section, path, label, kind, ...extra });

export const SOLVENT_FIELDS: FormField[] = [
  f("Identity", "key", "Key (as written in workup records)", "text", { hint: "Cannot change once saved; a new key makes a new entry." }),
  f("Identity", "name", "Name", "text"),
  f("Identity", "family", "Family", "select", { options: SOLVENT_FAMILIES }),
  f("Physical data", "density", "Density (g/mL)", "sourced"),
  f("Physical data", "bpC", "Boiling point (°C)", "sourced"),
  f("Physical data", "logP", "log P of the solvent (octanol–water)", "sourced"),
  f("Physical data", "waterMiscible", "Mixes with water in all proportions", "bool"),
  f("Physical data", "solventInWaterWtPct", "Solvent dissolved in the aqueous layer (wt %)", "sourced", { blank: "null" }),
  f("Physical data", "waterInSolventWtPct", "Water dissolved in the solvent layer (wt %)", "sourced", { blank: "null" }),
  f("Hazards and behaviour", "chlorinated", "Chlorinated (halogenated waste)", "bool"),
  f("Hazards and behaviour", "peroxideFormer", "Forms peroxides", "bool"),
  f("Hazards and behaviour", "reproductiveToxicant", "Reproductive toxicant", "bool"),
  f("Hazards and behaviour", "dipolarAprotic", "Dipolar aprotic (DMF-like)", "bool"),
  f("Hazards and behaviour", "ionPairCapable", "Extracts lipophilic ion pairs", "bool"),
  f("Partition lines: log K = a·log P + b", "partition.donor.a", "H-bond donors: slope a", "number", { blank: "null" }),
  f("Partition lines: log K = a·log P + b", "partition.donor.b", "H-bond donors: intercept b", "number", { blank: "null" }),
  f("Partition lines: log K = a·log P + b", "partition.acceptor.a", "Others: slope a", "number", { blank: "null" }),
  f("Partition lines: log K = a·log P + b", "partition.acceptor.b", "Others: intercept b", "number", { blank: "null" }),
  f("Partition lines: log K = a·log P + b", "partition.se", "Standard error of a predicted log K", "number", { blank: "null" }),
  f("Partition lines: log K = a·log P + b", "partition.source", "Source of the lines", "text", { blank: "null" }),
  f("Partition lines: log K = a·log P + b", "partition.confidence", "Confidence", "select", { options: CONFIDENCES, blank: "null" }),
  f("Ions", "ionLogKOffset", "log K of an ion minus that of the neutral form", "number"),
  f("Ions", "ionPairLogKOffset", "Same, for a lipophilic ion pair", "number"),
  f("Co-solvent (water-miscible solvents)", "cosolvency.m", "Cosolvency slope m", "number", { blank: "null" }),
  f("Co-solvent (water-miscible solvents)", "cosolvency.n", "Cosolvency intercept n", "number", { blank: "null" }),
  f("Co-solvent (water-miscible solvents)", "cosolvency.source", "Source", "text", { blank: "null" }),
  f("Co-solvent (water-miscible solvents)", "cosolvency.confidence", "Confidence", "select", { options: CONFIDENCES, blank: "null" }),
];

export const REAGENT_FIELDS: FormField[] = [
  f("Identity", "key", "Key (as written in workup records)", "text", { hint: "Cannot change once saved; a new key makes a new entry." }),
  f("Identity", "name", "Name", "text"),
  f("Identity", "kind", "Kind", "select", { options: ["solution", "solid"] }),
  f("Identity", "purpose", "Used as", "select", { options: REAGENT_PURPOSES }),
  f("Identity", "note", "Note", "text", { blank: "omit" }),
  f("Physical data", "basis", "Concentration of the named solute (mol/L); for a solid, its molar mass (g/mol)", "sourced"),
  f("Physical data", "density", "Density of the solution (g/mL)", "sourced", { blank: "null" }),
  f("Physical data", "solubilityGPer100g", "Solid: solubility (g per 100 g water)", "sourced", { blank: "omit" }),
  ...STRONG_IONS.map((ion) => f("Composition: fully dissociated ions (mol/L, or mol per mol of solid)", `ions.${ion}`, ion, "number", { blank: "omit" })),
  ...ACID_SYSTEM_KEYS.map((s) => f("Composition: weak acid–base systems (mol/L, or mol per mol of solid)", `systems.${s}`, s, "number", { blank: "omit" })),
];

type Json = null | boolean | number | string | Json[] | { [k: string]: Json };
type JsonObject = { [k: string]: Json };

function get(o: unknown, path: string): unknown {
  return path.split(".").reduce<unknown>((node, p) => (node !== null && typeof node === "object" ? (node as Record<string, unknown>)[p] : undefined), o);
}

const str = (v: unknown) => (typeof v === "number" ? String(v) : typeof v === "string" ? v : typeof v === "boolean" ? String(v) : "");

export function toForm(fields: FormField[], entry: unknown): Record<string, string> {
  const out: Record<string, string> = {};
  for (const field of fields) {
    if (field.kind === "sourced") {
      for (const part of ["value", "source", "confidence", "tempC"]) out[`${field.path}.${part}`] = str(get(entry, `${field.path}.${part}`));
    } else out[field.path] = str(get(entry, field.path));
  }
  return out;
}

function put(target: JsonObject, path: string, value: Json | undefined): void {
  if (value === undefined) return;
  const parts = path.split(".");
  let node = target;
  for (const p of parts.slice(0, -1)) {
    const next = node[p];
    node = next !== null && typeof next === "object" && !Array.isArray(next) ? next : (node[p] = {});
  }
  node[parts.at(-1) as string] = value;
}

const num = (s: string): number | undefined => (s.trim() === "" ? undefined : Number(s.trim().replace(",", ".")));

/** The form's strings as the schema's input. */
export function fromForm(fields: FormField[], form: Record<string, string>): JsonObject {
  const out: JsonObject = {};
  const blankGroups = new Set<string>();
  for (const field of fields) {
    const v = form[field.path] ?? "";
    if (field.kind === "sourced") {
      const value = num(form[`${field.path}.value`] ?? "");
      const filled = ["value", "source", "tempC"].some((p) => (form[`${field.path}.${p}`] ?? "").trim() !== "");
      if (!filled && field.blank) {
        if (field.blank === "null") out[field.path] = null;
        continue;
      }
      const tempC = num(form[`${field.path}.tempC`] ?? "");
      put(out, field.path, {
        value: value ?? null, source: (form[`${field.path}.source`] ?? "").trim(), confidence: form[`${field.path}.confidence`] || "memory",
        ...(tempC !== undefined ? { tempC } : {}),
      });
      continue;
    }
    const group = field.path.includes(".") && field.blank === "null" ? (field.path.split(".")[0] as string) : null;
    if (v.trim() === "" && field.blank) {
      if (group) blankGroups.add(group);
      continue;
    }
    put(out, field.path, field.kind === "number" ? (num(v) ?? null) : field.kind === "bool" ? v === "true" : v.trim());
  }
  // A group left entirely blank (no partition lines, no cosolvency) is null; a half-filled one goes to the schema as is.
  for (const group of blankGroups) if (!(group in out)) out[group] = null;
  for (const field of fields) {
    const top = field.path.split(".")[0] as string;
    if ((field.path.startsWith("ions.") || field.path.startsWith("systems.")) && !(top in out)) out[top] = {};
  }
  return out;
}
