/**
 * A stored workup (header, the spec as saved, compound links) as editor state. Read defensively: a spec saved by an
 * older version, an import or a script may not fit today's schema, and the editor is where it gets fixed.
 */
import { PROVENANCES, ROLES, workupInputSchema, type ComponentRole, type OperationType, type Provenance } from "@/lib/chem/schema";
import { withoutUnknownKeys } from "@/lib/chem/schema-strict";
import type { JsonObject, JsonValue, SnapshotHeader } from "@/lib/workups/record";
import { stepIdOf, withStepIds } from "@/lib/workups/step-ids";
import { newClientId } from "./ids";
import { COMMON_FIELDS, OPERATION_TYPES, defaultUnit, operationMeta } from "./operation-forms";
import { unitKey, type ComponentState, type EditorState, type HeaderState, type LogValueState, type OperationState, type Quantity } from "./editor-types";

const asRecord = (v: JsonValue | undefined): JsonObject => (v !== null && typeof v === "object" && !Array.isArray(v) ? v : {});
const asList = (v: JsonValue | undefined): JsonValue[] => (Array.isArray(v) ? v : []);
const text = (v: JsonValue | undefined): string => (typeof v === "string" ? v : typeof v === "number" ? String(v) : "");
const num = (v: JsonValue | undefined): number | undefined => (typeof v === "number" ? v : undefined);

function quantityOf(v: JsonValue | undefined, fallbackUnit: string): Quantity {
  const q = asRecord(v);
  return { value: text(q.value), unit: text(q.unit) || fallbackUnit };
}

const provenanceOf = (v: JsonValue | undefined): Provenance =>
  (PROVENANCES as readonly string[]).includes(text(v)) ? (text(v) as Provenance) : "estimated";

function logValueOf(v: JsonValue | undefined): LogValueState | null {
  if (v === undefined || v === null) return null;
  const r = asRecord(v);
  const se = num(r.se);
  const n = num(r.n);
  return { value: text(r.value), provenance: provenanceOf(r.provenance), source: text(r.source), ...(se !== undefined ? { se } : {}), ...(n !== undefined ? { n } : {}) };
}

const COMPONENT_FIELDS = ["key", "name", "role", "molarMass", "amount", "smiles", "logP", "pKas"];

function componentOf(v: JsonValue, links: Map<string, string | null>): ComponentState {
  const c = asRecord(v);
  const extra = Object.fromEntries(Object.entries(c).filter(([k]) => !COMPONENT_FIELDS.includes(k)));
  const role = (ROLES as readonly string[]).includes(text(c.role)) ? (text(c.role) as ComponentRole) : "other";
  return {
    id: newClientId("c"),
    key: text(c.key),
    name: text(c.name),
    role,
    molarMass: text(c.molarMass),
    amount: quantityOf(c.amount, "mmol"),
    smiles: text(c.smiles),
    compoundId: links.get(text(c.key)) ?? null,
    logP: logValueOf(c.logP),
    pKas: asList(c.pKas).map((p) => {
      const r = asRecord(p);
      const se = num(r.se);
      return { id: newClientId("p"), value: text(r.value), kind: text(r.kind) === "base" ? "base" : "acid", provenance: provenanceOf(r.provenance), source: text(r.source), ...(se !== undefined ? { se } : {}) };
    }),
    extra,
  };
}

const KNOWN_TYPES = new Set<string>(OPERATION_TYPES.map((m) => m.type));

/** `index`: the step's position, which names a step saved without an id (lib/workups/step-ids.ts). */
export function operationOf(v: JsonValue, index = 0): OperationState | null {
  const o = asRecord(v);
  if (!KNOWN_TYPES.has(text(o.type))) return null;
  const type = text(o.type) as OperationType;
  const values: Record<string, string> = {};
  const lists: Record<string, string[]> = {};
  const handled = new Set(["type", "id"]);
  for (const field of [...operationMeta(type).fields, ...COMMON_FIELDS]) {
    handled.add(field.name);
    const raw = o[field.name];
    if (field.kind === "quantity") {
      const q = quantityOf(raw, defaultUnit(field));
      values[field.name] = q.value;
      values[unitKey(field.name)] = q.unit;
    } else if (field.kind === "rinse" || field.kind === "reactive") {
      const r = asRecord(raw);
      const inner = field.kind === "rinse" ? ["solvent", "volume"] : ["name", "amount", "gasPerMol"];
      for (const part of inner) {
        const path = `${field.name}.${part}`;
        if (part === "volume" || part === "amount") {
          const q = quantityOf(r[part], part === "volume" ? "mL" : "mmol");
          values[path] = q.value;
          values[unitKey(path)] = q.unit;
        } else values[path] = text(r[part]);
      }
    } else if (field.kind === "streamNames" || field.kind === "components") {
      lists[field.name] = asList(raw).map(text).filter((s) => s !== "");
    } else if (typeof raw === "boolean") {
      values[field.name] = raw ? "true" : "false";
    } else values[field.name] = text(raw);
  }
  const extra = Object.fromEntries(Object.entries(o).filter(([k]) => !handled.has(k)));
  return { id: stepIdOf(o, index), type, values, lists, extra };
}

export function headerOf(h: SnapshotHeader): HeaderState {
  const mmol = (v: number | null) => (v === null ? "" : String(v));
  return {
    title: h.title, performedOn: h.performedOn, chemistId: h.chemistId ?? "", notebookRef: h.notebookRef,
    notebookUrl: h.notebookUrl ?? "",
    scaleMmol: mmol(h.scaleMmol), expectedProductMmol: mmol(h.expectedProductMmol), assayedProductMmol: mmol(h.assayedProductMmol),
  };
}

export function editorStateOf(header: SnapshotHeader, stored: JsonObject, links: { key: string; compoundId: string | null }[]): EditorState {
  // Keys the schema does not know (accepted by an older version) are left behind: a save would refuse them, and no
  // field of the editor could show or remove them.
  const spec = asRecord(withoutUnknownKeys(workupInputSchema, stored).value as JsonValue);
  const linkMap = new Map(links.map((l) => [l.key, l.compoundId]));
  const mixture = asRecord(spec.mixture);
  const { components: _c, mixture: _m, operations: _o, name, temperature, funnel, ...extra } = spec;
  return {
    header: headerOf(header),
    components: asList(spec.components).map((c) => componentOf(c, linkMap)),
    mixture: {
      solvents: asList(mixture.solvents).map((s) => ({ id: newClientId("m"), solvent: text(asRecord(s).solvent), volume: quantityOf(asRecord(s).volume, "mL") })),
      reagents: asList(mixture.reagents).map((s) => ({ id: newClientId("m"), reagent: text(asRecord(s).reagent), volume: quantityOf(asRecord(s).volume, "mL") })),
    },
    operations: withStepIds(spec.operations).map((op, i) => operationOf(op, i)).filter((op): op is OperationState => op !== null),
    settings: { name: text(name), temperature: quantityOf(temperature, "°C"), funnel: quantityOf(funnel, "mL"), extra },
  };
}

/** A blank record for a new workup, dated today. */
export function emptyEditorState(today: string, chemistId: string): EditorState {
  return {
    header: { title: "", performedOn: today, chemistId, notebookRef: "", notebookUrl: "", scaleMmol: "", expectedProductMmol: "", assayedProductMmol: "" },
    components: [],
    mixture: { solvents: [{ id: newClientId("m"), solvent: "etoac", volume: { value: "50", unit: "mL" } }], reagents: [] },
    operations: [],
    settings: { name: "", temperature: { value: "", unit: "°C" }, funnel: { value: "", unit: "mL" }, extra: {} },
  };
}
