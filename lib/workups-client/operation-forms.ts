/**
 * Form model of the operations: the engine's field metadata (lib/chem/operation-types.ts) plus what a form needs on
 * top: the unit a new field starts in and the values a new step starts with. Defaults follow the usual bench choice
 * (common practice): a wash is one 20 mL portion of brine keeping the organic layer, an extraction three portions.
 */
import { COMMON_OPERATION_FIELDS, listOperationTypes, type OperationFieldMeta, type OperationTypeMeta } from "@/lib/chem/operation-types";
import { type OperationType } from "@/lib/chem/schema";
import { type Library } from "@/lib/chem/library";
import { newClientId } from "./ids";
import { unitKey, type MixtureSolventState, type OperationState } from "./editor-types";

const META = new Map<OperationType, OperationTypeMeta>(listOperationTypes().map((m) => [m.type, m]));

export function operationMeta(type: OperationType): OperationTypeMeta {
  const meta = META.get(type);
  if (!meta) throw new Error(`no form for operation type '${type}'`);
  return meta;
}

export const OPERATION_TYPES: OperationTypeMeta[] = listOperationTypes();
export const COMMON_FIELDS: OperationFieldMeta[] = COMMON_OPERATION_FIELDS;

/** The first unit of a quantity field's list is the one a bench chemist writes most (mL, mmol, g, °C, mbar). */
const PREFERRED_UNITS = ["mL", "mmol", "g", "°C", "mbar"];

export function defaultUnit(field: OperationFieldMeta): string {
  const units = field.units ?? [];
  return units.find((u) => PREFERRED_UNITS.includes(u)) ?? units[0] ?? "";
}

/** The solvents the mixture or the earlier steps put in the funnel, for sensible defaults of a new step. */
export interface StepContext {
  mixture: MixtureSolventState[];
  before: OperationState[];
  library: Library;
}

function organicSolventOf(ctx: StepContext): string {
  const immiscible = (key: string) => {
    const s = ctx.library.solvents[key];
    return s !== undefined && !s.waterMiscible;
  };
  const fromSteps = [...ctx.before].reverse().map((op) => (op.type === "extract" || op.type === "charge" ? (op.values.solvent ?? "") : ""));
  return [...fromSteps, ...ctx.mixture.map((m) => m.solvent)].find(immiscible) ?? "etoac";
}

function miscibleSolventOf(ctx: StepContext): string {
  return ctx.mixture.map((m) => m.solvent).find((k) => k !== "water" && ctx.library.solvents[k]?.waterMiscible) ?? "thf";
}

const qty = (name: string, value: string, unit: string): Record<string, string> => ({ [name]: value, [unitKey(name)]: unit });

/** Starting values of a new step of `type`. */
export function defaultValues(type: OperationType, ctx: StepContext): Record<string, string> {
  switch (type) {
    case "charge": return { solvent: organicSolventOf(ctx), ...qty("volume", "20", "mL") };
    case "quench": return { reagent: "nh4cl_sat", ...qty("volume", "10", "mL"), mode: "normal" };
    case "wash": return { reagent: "brine", ...qty("volume", "20", "mL"), portions: "1", keep: "organic" };
    case "extract": return { solvent: organicSolventOf(ctx), ...qty("volume", "20", "mL"), portions: "3", keep: "organic" };
    case "back_extract": return { reagent: "hcl_1m", ...qty("volume", "20", "mL"), portions: "2", keep: "aqueous" };
    case "separate": return { keep: "organic" };
    case "combine": return {};
    case "adjust_ph": return { reagent: "hcl_1m", targetPh: "2" };
    case "add_salt": return { salt: "nacl", saturate: "true" };
    case "remove_cosolvent": return { solvent: miscibleSolventOf(ctx), fractionRemoved: "0.95" };
    case "dry": return { agent: "mgso4" };
    case "filter": return { keep: "filtrate" };
    case "concentrate": return { method: "rotavap", ...qty("bath", "40", "°C") };
  }
}

/** Units of every quantity field start at the preferred unit even when the field is left blank. */
function unitDefaults(type: OperationType): Record<string, string> {
  const out: Record<string, string> = {};
  for (const f of [...operationMeta(type).fields, ...COMMON_FIELDS]) {
    if (f.kind === "quantity") out[unitKey(f.name)] = defaultUnit(f);
    if (f.kind === "rinse") out[unitKey(`${f.name}.volume`)] = "mL";
    if (f.kind === "reactive") out[unitKey(`${f.name}.amount`)] = "mmol";
  }
  return out;
}

export function newOperation(type: OperationType, ctx: StepContext): OperationState {
  return { id: newClientId("op"), type, values: { ...unitDefaults(type), ...defaultValues(type, ctx) }, lists: {}, extra: {} };
}

/** A copy with a fresh id; a saved-stream name is dropped, since two steps may not save under one name. */
export function duplicateOperation(op: OperationState): OperationState {
  const values = { ...op.values };
  delete values.saveAs;
  return { ...op, id: newClientId("op"), values, lists: Object.fromEntries(Object.entries(op.lists).map(([k, v]) => [k, [...v]])) };
}

/** Changing a step's type keeps the values the new type also has (reagent, volume, portions, label…), except the kept layer, whose default is what tells the types apart. */
export function changeOperationType(op: OperationState, type: OperationType, ctx: StepContext): OperationState {
  const fresh = newOperation(type, ctx);
  const names = new Set([...operationMeta(type).fields, ...COMMON_FIELDS].map((f) => f.name));
  const kept = Object.fromEntries(Object.entries(op.values).filter(([k, v]) => k !== "keep" && names.has(k.split(/[.:]/)[0] ?? "") && v !== ""));
  return { ...fresh, id: op.id, values: { ...fresh.values, ...kept }, extra: op.extra };
}
