import { listOperationTypes } from "@/lib/chem/operation-types";

const STEP_TYPE_WORDS = new Map(listOperationTypes().map((t) => [t.type as string, t.label]));

/** An operation type as the editor names it ("Adjust pH", "Back-extract"), never its key. */
export function stepTypeWords(type: string): string {
  return STEP_TYPE_WORDS.get(type) ?? type.replace(/_/g, " ");
}

/** How the record's fields are named on screen (history, merge panel): the form's labels, never the stored keys. */
const FIELD_WORDS: Record<string, string> = {
  title: "Title", performedOn: "Date", chemistId: "Chemist", notebookRef: "Notebook reference", notebookUrl: "Notebook entry address", scaleMmol: "Scale (mmol)",
  expectedProductMmol: "Expected product (mmol)", assayedProductMmol: "Assayed before the workup (mmol)", compoundId: "Registered compound",
  molarMass: "Molar mass", logP: "log P", pKas: "pKa values", saveAs: "Saved as", targetPh: "Target pH", mixture: "Starting mixture",
};

export function fieldWords(field: string): string {
  return FIELD_WORDS[field] ?? field.replace(/([a-z])([A-Z])/g, "$1 $2").replace(/_/g, " ");
}
