/**
 * Editor metadata for the operation types: a label, one line of purpose and each field
 * with its kind and accepted units, so a form can be built without reading the zod schema.
 */
import { type OperationType } from "./schema";
import { unitsOf, type UnitName } from "./units";

export type OperationFieldKind = "solvent" | "reagent" | "salt" | "agent" | "quantity" | "integer" | "fraction" | "pH"
  | "layer" | "filterKeep" | "streamName" | "streamNames" | "components" | "boolean" | "method" | "rinse" | "mode" | "reactive";

export interface OperationFieldMeta {
  name: string;
  label: string;
  kind: OperationFieldKind;
  required: boolean;
  units?: UnitName[];
  default?: string | number | boolean;
  options?: string[];
  /** One line of help shown under the field. */
  hint?: string;
}

export interface OperationTypeMeta {
  type: OperationType;
  label: string;
  purpose: string;
  fields: OperationFieldMeta[];
}

const vol = (name: string, label: string, required = true): OperationFieldMeta => ({ name, label, kind: "quantity", required, units: unitsOf("volume") });
const amount = (required = false): OperationFieldMeta => ({ name: "amount", label: "Amount", kind: "quantity", required, units: unitsOf("amount") });
const mass = (name: string, label: string): OperationFieldMeta => ({ name, label, kind: "quantity", required: false, units: unitsOf("mass") });
const portions: OperationFieldMeta = { name: "portions", label: "Portions", kind: "integer", required: false, default: 1 };
const keep = (d: "organic" | "aqueous"): OperationFieldMeta => ({ name: "keep", label: "Layer kept", kind: "layer", required: false, default: d, options: ["organic", "aqueous"] });
const saveAs: OperationFieldMeta = { name: "saveAs", label: "Save the other layer as", kind: "streamName", required: false };
const rinse: OperationFieldMeta = { name: "rinse", label: "Rinse (solvent and volume)", kind: "rinse", required: false };

const TYPES: OperationTypeMeta[] = [
  { type: "charge", label: "Dilute / charge solvent", purpose: "Add solvent (or water) to the current mixture.",
    fields: [{ name: "solvent", label: "Solvent", kind: "solvent", required: true }, vol("volume", "Volume")] },
  { type: "quench", label: "Quench", purpose: "Destroy excess reactive reagent by adding an aqueous reagent.",
    fields: [{ name: "reagent", label: "Quench reagent", kind: "reagent", required: true }, vol("volume", "Volume", false), amount(),
      { name: "mode", label: "Mode", kind: "mode", required: false, default: "normal", options: ["normal", "inverse"] },
      { name: "reactive", label: "Reactive species quenched", kind: "reactive", required: false }] },
  { type: "wash", label: "Wash", purpose: "Shake the organic layer with portions of an aqueous reagent; the organic layer is kept.",
    fields: [{ name: "reagent", label: "Aqueous reagent", kind: "reagent", required: true }, vol("volume", "Volume per portion"), portions, keep("organic"), saveAs] },
  { type: "extract", label: "Extract", purpose: "Extract the aqueous layer with portions of organic solvent; the extracts are combined.",
    fields: [{ name: "solvent", label: "Extraction solvent", kind: "solvent", required: true }, vol("volume", "Volume per portion"), portions, keep("organic"), saveAs] },
  { type: "back_extract", label: "Back-extract", purpose: "Take an ionizable compound from the organic layer into aqueous acid or base; the aqueous layer is kept.",
    fields: [{ name: "reagent", label: "Aqueous reagent", kind: "reagent", required: true }, vol("volume", "Volume per portion"), portions, keep("aqueous"), saveAs] },
  { type: "separate", label: "Separate layers", purpose: "Let the layers settle and keep one of them.", fields: [{ ...keep("organic"), required: true }, saveAs] },
  { type: "combine", label: "Combine streams", purpose: "Pool saved layers or extracts with the current one.",
    fields: [{ name: "streams", label: "Saved streams", kind: "streamNames", required: true }] },
  { type: "adjust_ph", label: "Adjust pH", purpose: "Add acid or base: a volume, an amount, or enough to reach a target pH.",
    fields: [{ name: "reagent", label: "Acid or base", kind: "reagent", required: true }, vol("volume", "Volume", false), amount(),
      { name: "targetPh", label: "Target pH", kind: "pH", required: false }] },
  { type: "add_salt", label: "Add salt", purpose: "Salt out: add solid salt by mass, or to saturation.",
    fields: [{ name: "salt", label: "Salt", kind: "salt", required: true }, mass("mass", "Mass"), { name: "saturate", label: "To saturation", kind: "boolean", required: false, default: false }] },
  { type: "remove_cosolvent", label: "Remove reaction solvent", purpose: "Evaporate a water-miscible reaction solvent before the work-up.",
    fields: [{ name: "solvent", label: "Solvent", kind: "solvent", required: true }, { name: "fractionRemoved", label: "Fraction removed", kind: "fraction", required: false, default: 0.95 }] },
  { type: "dry", label: "Dry", purpose: "Remove dissolved water with a drying agent; the agent holds back some solution.",
    fields: [{ name: "agent", label: "Drying agent", kind: "agent", required: true }, mass("mass", "Mass (default: 3.5× the need)"),
      { ...rinse, hint: "Left blank, the spent agent is taken as rinsed with two portions of the layer's solvent, each twice the solution it holds (common practice)." }] },
  { type: "filter", label: "Filter", purpose: "Collect a solid or remove fines; the cake holds back some solution.",
    fields: [{ name: "keep", label: "Keep", kind: "filterKeep", required: false, default: "filtrate", options: ["filtrate", "solid"] },
      { name: "solidComponents", label: "Components that are solid", kind: "components", required: false }, mass("cakeMass", "Cake or pad mass"), rinse, saveAs] },
  { type: "concentrate", label: "Concentrate", purpose: "Remove volatile solvent; high-boiling solvents and non-volatile residue stay.",
    fields: [{ name: "method", label: "Method", kind: "method", required: false, default: "rotavap", options: ["rotavap", "high_vacuum", "n2_stream", "distillation"] },
      { name: "bath", label: "Bath temperature", kind: "quantity", required: false, units: unitsOf("temperature") },
      { name: "pressure", label: "Pressure", kind: "quantity", required: false, units: unitsOf("pressure"),
        hint: "Left blank: a rotary evaporator set so the solvent boils 20 °C below the bath (rule of 20); 0.5 mbar on a high-vacuum line." },
      { name: "minutes", label: "Time (min)", kind: "integer", required: false,
        hint: "Left blank: until the solvent is gone plus 5 min (60 min on a high-vacuum line). Volatile products are lost at a rate set by their vapour pressure." },
      { name: "peroxideTested", label: "Tested for peroxides", kind: "boolean", required: false }] },
];

/** Fields every operation also accepts. */
export const COMMON_OPERATION_FIELDS: OperationFieldMeta[] = [
  { name: "label", label: "Label", kind: "streamName", required: false },
  { name: "temperature", label: "Temperature", kind: "quantity", required: false, units: unitsOf("temperature") },
];

export function listOperationTypes(): OperationTypeMeta[] {
  return TYPES;
}
