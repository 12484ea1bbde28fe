/**
 * The editor state as the input of the shared schemas (createWorkupSchema / updateWorkupSchema): the same object the
 * server action receives, so the browser and the server judge it with the same rules and the same messages.
 * Blank optional fields are left out; a blank required quantity is sent without its value so the schema names it.
 */
import { type OperationFieldMeta } from "@/lib/chem/operation-types";
import type { CreateWorkupInput } from "@/lib/workups/schemas";
import type { JsonObject, JsonValue } from "@/lib/workups/record";
import { COMMON_FIELDS, operationMeta } from "./operation-forms";
import { unitKey, type ComponentState, type EditorState, type HeaderState, type OperationState, type Quantity } from "./editor-types";

/** "1,5" and "1.5" both mean one and a half (decimal commas are common on lab notebooks); blank → undefined. */
export function parseNumber(text: string): number | undefined {
  const t = text.trim().replace(/\s/g, "").replace(",", ".");
  if (t === "") return undefined;
  return t === "-" ? Number.NaN : Number(t);
}

function quantity(q: Quantity, required: boolean): JsonObject | undefined {
  const value = parseNumber(q.value);
  if (value === undefined) return required ? { unit: q.unit } : undefined;
  return { value, unit: q.unit };
}

const numberOrNull = (text: string) => parseNumber(text) ?? null;

export function headerInput(h: HeaderState): CreateWorkupInput["header"] {
  return {
    title: h.title,
    performedOn: h.performedOn,
    chemistId: h.chemistId === "" ? null : h.chemistId,
    notebookRef: h.notebookRef,
    notebookUrl: h.notebookUrl,
    scaleMmol: numberOrNull(h.scaleMmol),
    expectedProductMmol: numberOrNull(h.expectedProductMmol),
    assayedProductMmol: numberOrNull(h.assayedProductMmol),
  };
}

function set(target: JsonObject, path: string, value: JsonValue | undefined): void {
  if (value === undefined) return;
  const parts = path.split(".");
  let node = target;
  for (const part of parts.slice(0, -1)) {
    const next = node[part];
    node = next !== null && typeof next === "object" && !Array.isArray(next) ? next : (node[part] = {});
  }
  node[parts.at(-1) as string] = value;
}

function scalar(field: OperationFieldMeta, text: string): JsonValue | undefined {
  if (text.trim() === "") return undefined;
  switch (field.kind) {
    case "integer": case "fraction": case "pH": return parseNumber(text) ?? null;
    case "boolean": return text === "true";
    default: return text.trim();
  }
}

function nestedQuantity(op: OperationState, path: string, required: boolean): JsonObject | undefined {
  return quantity({ value: op.values[path] ?? "", unit: op.values[unitKey(path)] ?? "" }, required);
}

/** A composite (rinse, reactive species) is sent only when any of its parts is filled in. */
function composite(op: OperationState, field: OperationFieldMeta): JsonObject | undefined {
  const prefix = `${field.name}.`;
  const filled = Object.entries(op.values).some(([k, v]) => k.startsWith(prefix) && !k.endsWith(":unit") && v.trim() !== "");
  if (!filled) return undefined;
  const out: JsonObject = {};
  if (field.kind === "rinse") {
    set(out, "solvent", (op.values[`${prefix}solvent`] ?? "").trim());
    set(out, "volume", nestedQuantity(op, `${prefix}volume`, true));
  } else {
    set(out, "name", (op.values[`${prefix}name`] ?? "").trim());
    set(out, "amount", nestedQuantity(op, `${prefix}amount`, true));
    const gas = parseNumber(op.values[`${prefix}gasPerMol`] ?? "");
    if (gas !== undefined) out.gasPerMol = gas;
  }
  return out;
}

export function operationInput(op: OperationState): JsonObject {
  // The step's id is saved with it, so merges and the history follow the step wherever it moves.
  const out: JsonObject = { ...op.extra, id: op.id, type: op.type };
  for (const field of [...operationMeta(op.type).fields, ...COMMON_FIELDS]) {
    delete out[field.name];
    switch (field.kind) {
      case "quantity": set(out, field.name, nestedQuantity(op, field.name, field.required)); break;
      case "rinse": case "reactive": set(out, field.name, composite(op, field)); break;
      case "streamNames": case "components": {
        const list = op.lists[field.name] ?? [];
        if (list.length > 0 || field.required) out[field.name] = list;
        break;
      }
      default: set(out, field.name, scalar(field, op.values[field.name] ?? ""));
    }
  }
  return out;
}

export function componentInput(c: ComponentState): JsonObject {
  const out: JsonObject = {
    ...c.extra,
    key: c.key,
    name: c.name,
    role: c.role,
    molarMass: parseNumber(c.molarMass) ?? null,
    amount: { ...(parseNumber(c.amount.value) !== undefined ? { value: parseNumber(c.amount.value) as number } : {}), unit: c.amount.unit },
    pKas: c.pKas.map((p) => ({
      value: parseNumber(p.value) ?? null, kind: p.kind, provenance: p.provenance,
      ...(p.source.trim() ? { source: p.source.trim() } : {}), ...(p.se !== undefined ? { se: p.se } : {}),
    })),
  };
  if (c.smiles.trim()) out.smiles = c.smiles.trim();
  else delete out.smiles;
  if (c.logP && c.logP.value.trim() !== "") {
    out.logP = {
      value: parseNumber(c.logP.value) ?? null, provenance: c.logP.provenance,
      ...(c.logP.source.trim() ? { source: c.logP.source.trim() } : {}),
      ...(c.logP.se !== undefined ? { se: c.logP.se } : {}), ...(c.logP.n !== undefined ? { n: c.logP.n } : {}),
    };
  } else delete out.logP;
  return out;
}

/** The engine's spec (units at every quantity) as the schema's raw input. */
export function specInput(state: EditorState): JsonObject {
  const s = state.settings;
  const spec: JsonObject = {
    ...s.extra,
    components: state.components.map(componentInput),
    mixture: {
      solvents: state.mixture.solvents.map((m) => ({ solvent: m.solvent, volume: quantity(m.volume, true) ?? null })),
      reagents: state.mixture.reagents.map((m) => ({ reagent: m.reagent, volume: quantity(m.volume, true) ?? null })),
    },
    operations: state.operations.map(operationInput),
  };
  set(spec, "name", s.name.trim() || undefined);
  set(spec, "temperature", quantity(s.temperature, false));
  set(spec, "funnel", quantity(s.funnel, false));
  return spec;
}

export function linksInput(state: EditorState): { key: string; compoundId: string | null }[] {
  return state.components.filter((c) => c.compoundId !== null).map((c) => ({ key: c.key, compoundId: c.compoundId }));
}

export function saveInput(state: EditorState): CreateWorkupInput {
  // The spec is built from strings the user typed; the schema, not the type system, decides whether it is valid.
  return { header: headerInput(state.header), spec: specInput(state) as unknown as CreateWorkupInput["spec"], links: linksInput(state) };
}
