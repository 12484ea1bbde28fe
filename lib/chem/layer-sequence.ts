/**
 * Refuses a step that works on a layer an earlier step has already removed: a wash, back-extraction or drying
 * after the organic layer went to waste or was evaporated, an extraction after the aqueous layer is gone, a
 * separation with only one layer left. Only removals the sequence itself states count; whether the starting mixture
 * forms two layers is the simulator's question, not a reason to refuse.
 */
import { type Library } from "./library";
import { type Operation, type WorkupInput } from "./schema";

interface ValidationIssue {
  path: string;
  message: string;
}

type Layer = "organic" | "aqueous";

/** The step that removed a layer (1-based) and how, or null while the layer may be there. */
type Removal = { step: number; how: string } | null;

const describe = (op: Operation, step: number) => `step ${step} (${op.label ?? op.type.replace("_", " ")})`;

export function checkLayerSequence(w: WorkupInput, lib: Library): ValidationIssue[] {
  const issues: ValidationIssue[] = [];
  const gone: Record<Layer, Removal> = { organic: null, aqueous: null };
  /** Saved streams: the layer each holds (null when it may hold either). */
  const saved = new Map<string, Layer | null>();
  const isOrganic = (solvent: string) => {
    const s = lib.solvents[solvent];
    return s !== undefined && solvent !== "water" && !s.waterMiscible;
  };
  const need = (i: number, op: Operation, layer: Layer, why: string) => {
    const removal = gone[layer];
    if (!removal) return;
    const fix = layer === "organic" ? "charge or extract with an organic solvent first" : "add water or an aqueous reagent first";
    issues.push({
      path: `operations.${i}`,
      message: `${describe(op, i + 1)} ${why}, but there is no ${layer} layer any more: ${removal.how} at step ${removal.step}; ${fix}, or remove the step`,
    });
  };
  const keepOne = (op: Operation & { keep: Layer; saveAs?: string | undefined }, step: number) => {
    const other: Layer = op.keep === "organic" ? "aqueous" : "organic";
    gone[op.keep] = null;
    gone[other] = { step, how: `the ${other} layer ${op.saveAs ? `was saved as '${op.saveAs}'` : "went to waste"}` };
    if (op.saveAs) saved.set(op.saveAs, other);
  };
  w.operations.forEach((op, i) => {
    const step = i + 1;
    switch (op.type) {
      case "wash": case "back_extract":
        need(i, op, "organic", op.type === "wash" ? "washes the organic layer" : "extracts from the organic layer");
        gone.aqueous = null;
        keepOne(op, step);
        break;
      case "extract":
        need(i, op, "aqueous", "extracts the aqueous layer");
        gone.organic = null;
        keepOne(op, step);
        break;
      case "separate":
        need(i, op, "organic", "separates two layers");
        if (!gone.organic) need(i, op, "aqueous", "separates two layers");
        keepOne(op, step);
        break;
      case "dry":
        need(i, op, "organic", "dries the organic layer");
        break;
      case "charge":
        if (isOrganic(op.solvent)) gone.organic = null;
        else if (op.solvent === "water") gone.aqueous = null;
        break;
      case "quench": case "adjust_ph":
        gone.aqueous = null;
        break;
      case "combine":
        for (const name of op.streams) {
          const layer = saved.get(name);
          if (layer === null || layer === undefined) { gone.organic = null; gone.aqueous = null; } else gone[layer] = null;
          saved.delete(name);
        }
        break;
      case "filter":
        if (op.saveAs) saved.set(op.saveAs, null);
        if (op.keep === "solid") {
          gone.organic = { step, how: "only the solid was kept" };
          gone.aqueous = { step, how: "only the solid was kept" };
        }
        break;
      case "concentrate":
        gone.organic = { step, how: "the solvent was evaporated" };
        gone.aqueous = { step, how: "the solvent was evaporated" };
        break;
      default:
        break;
    }
  });
  return issues;
}
