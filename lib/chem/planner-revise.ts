/**
 * Applies a plan to the input's operation list: the revised, parsed sequence for the simulator's check, and
 * the same edits in input units (1-based steps of the input) for the user.
 */
import { type AqueousWashPlan } from "./planner-aqueous";
import { type ExtractionPlan } from "./planner-extraction";
import { type WashGroupPlan } from "./planner-washes";
import { operationSchema, type Operation, type OperationRaw } from "./schema";

export interface PlanChange {
  action: "insert_before" | "append" | "replace" | "remove";
  /** 1-based step of the input the edit applies to (absent for append). */
  step?: number;
  operation?: OperationRaw;
}

export interface Revision {
  ops: readonly Operation[];
  /** 0-based index before which the washes go (ops.length: at the end). */
  insertAt: number;
  /** 0-based indices of the input's acid/base washes the plan replaces. */
  removed: readonly number[];
  extractIndex: number;
  washes: readonly WashGroupPlan[];
  extraction: ExtractionPlan | null;
  aqueousWashes: readonly AqueousWashPlan[];
}

type ExtractOp = Extract<Operation, { type: "extract" }>;

function extractRaw(op: ExtractOp, volumeMl: number, portions: number): OperationRaw {
  return {
    type: "extract", solvent: op.solvent, volume: { value: volumeMl, unit: "mL" }, portions, keep: op.keep,
    ...(op.saveAs ? { saveAs: op.saveAs } : {}), ...(op.label ? { label: op.label } : {}),
  };
}

export function reviseOperations(r: Revision): { operations: Operation[]; changes: PlanChange[] } {
  const changes: PlanChange[] = [];
  const out: Operation[] = [];
  const washRaw: OperationRaw[] = r.washes.filter((w) => w.reagent && w.portions > 0).map((w) => ({
    type: "wash", reagent: w.reagent?.key ?? "", volume: { value: w.volumeMl, unit: "mL" }, portions: w.portions,
    label: `remove ${w.impurities.join(", ")}`,
  }));
  const insertWashes = (step?: number) => {
    for (const raw of washRaw) {
      out.push(operationSchema.parse(raw));
      changes.push(step === undefined ? { action: "append", operation: raw } : { action: "insert_before", step, operation: raw });
    }
  };
  const x = r.extraction;
  r.ops.forEach((op, i) => {
    if (i === r.insertAt) insertWashes(i + 1);
    if (r.removed.includes(i)) { changes.push({ action: "remove", step: i + 1 }); return; }
    const aqueousWash = r.aqueousWashes.find((a) => a.step === i + 1);
    if (aqueousWash && op.type === "extract" && aqueousWash.portions !== op.portions) {
      const raw = extractRaw(op, op.volumeMl, aqueousWash.portions);
      out.push(operationSchema.parse(raw));
      changes.push({ action: "replace", step: i + 1, operation: raw });
      return;
    }
    if (i === r.extractIndex && x && op.type === "extract" && (x.adjust || x.portions !== op.portions || x.volumeMl !== op.volumeMl)) {
      if (x.adjust) {
        const adjust: OperationRaw = { type: "adjust_ph", reagent: x.adjust.reagent, targetPh: Number(x.adjust.targetPh.toFixed(1)), label: "set the pH before extracting" };
        if (r.ops[i - 1]?.type === "adjust_ph" && out[out.length - 1] === r.ops[i - 1]) {
          out.pop();
          changes.push({ action: "replace", step: i, operation: adjust });
        } else changes.push({ action: "insert_before", step: i + 1, operation: adjust });
        out.push(operationSchema.parse(adjust));
      }
      const raw = extractRaw(op, x.volumeMl, x.portions);
      out.push(operationSchema.parse(raw));
      changes.push({ action: "replace", step: i + 1, operation: raw });
      return;
    }
    out.push(op);
  });
  if (r.insertAt >= r.ops.length) insertWashes();
  return { operations: out, changes };
}
