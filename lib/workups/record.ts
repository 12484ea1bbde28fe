// The stored shape of a workup version and the derived columns the list filters on. Pure functions.
import { type WorkupInput } from "@/lib/chem/schema";
import { type ComponentLink, type WorkupHeader } from "./schemas";

/** Header as stored in a version snapshot and sent to clients: dates as YYYY-MM-DD, absent amounts as null. */
export interface SnapshotHeader {
  title: string;
  performedOn: string;
  chemistId: string | null;
  notebookRef: string;
  /** Address of the electronic notebook entry, "" when none; absent from versions saved before the field existed. */
  notebookUrl?: string;
  scaleMmol: number | null;
  expectedProductMmol: number | null;
  assayedProductMmol: number | null;
}

/** What one WorkupVersion keeps: the header, the spec exactly as entered (units included) and the compound links. */
export interface WorkupSnapshot {
  header: SnapshotHeader;
  spec: JsonObject;
  links: ComponentLink[];
}

export type JsonValue = string | number | boolean | null | JsonValue[] | { [key: string]: JsonValue };
export type JsonObject = { [key: string]: JsonValue };

export function dayOf(date: Date): string {
  return date.toISOString().slice(0, 10);
}

export function snapshotHeader(header: WorkupHeader): SnapshotHeader {
  return {
    title: header.title,
    performedOn: dayOf(header.performedOn),
    chemistId: header.chemistId ?? null,
    notebookRef: header.notebookRef,
    notebookUrl: header.notebookUrl,
    scaleMmol: header.scaleMmol ?? null,
    expectedProductMmol: header.expectedProductMmol ?? null,
    assayedProductMmol: header.assayedProductMmol ?? null,
  };
}

/** A JSON-only deep copy of what the client sent (drops undefined, functions, prototypes). */
export function plainJson(value: unknown): JsonObject {
  const copy = JSON.parse(JSON.stringify(value ?? {})) as unknown;
  return copy !== null && typeof copy === "object" && !Array.isArray(copy) ? (copy as JsonObject) : {};
}

/** Header columns of the Workup row. */
export function headerColumns(header: WorkupHeader) {
  return {
    title: header.title,
    performedOn: header.performedOn,
    chemistId: header.chemistId ?? null,
    notebookRef: header.notebookRef,
    notebookUrl: header.notebookUrl,
    scaleMmol: header.scaleMmol ?? null,
    expectedProductMmol: header.expectedProductMmol ?? null,
    assayedProductMmol: header.assayedProductMmol ?? null,
  };
}

/** Every solvent key the spec names: reaction mixture, charges, extractions, co-solvent removals and rinses. */
export function solventKeysOf(spec: WorkupInput): string[] {
  const keys = new Set<string>(spec.mixture.solvents.map((s) => s.solvent.toLowerCase()));
  for (const op of spec.operations) {
    if (op.type === "charge" || op.type === "extract" || op.type === "remove_cosolvent") keys.add(op.solvent.toLowerCase());
    if ((op.type === "dry" || op.type === "filter") && op.rinse) keys.add(op.rinse.solvent.toLowerCase());
  }
  return [...keys].sort();
}

/** Lower-case text the list's word search runs over: title, notebook reference, component and compound names. */
export function searchTextOf(header: WorkupHeader, spec: WorkupInput, compoundNames: readonly string[]): string {
  const parts = [header.title, header.notebookRef, spec.name ?? "", ...spec.components.map((c) => c.name), ...compoundNames];
  return [...new Set(parts.map((p) => p.trim().toLowerCase()).filter((p) => p.length > 0))].join(" | ");
}

/** Component rows for WorkupComponent, with the registered compound each key is linked to. */
export function componentRows(spec: WorkupInput, links: readonly ComponentLink[]) {
  const linked = new Map(links.map((l) => [l.key, l.compoundId]));
  return spec.components.map((c) => ({
    key: c.key,
    name: c.name,
    role: c.role,
    amountMmol: c.amountMmol,
    compoundId: linked.get(c.key) ?? null,
  }));
}

/** The product component the recovery refers to: the engine's product key, else the first product. */
export function productOf(spec: WorkupInput, productKey: string | null) {
  return spec.components.find((c) => c.key === productKey) ?? spec.components.find((c) => c.role === "product") ?? null;
}
