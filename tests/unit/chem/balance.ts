/** Mass balance over a prediction: what is on the main line plus every stream that left it (and was not combined back). */
import { type WorkupInput } from "@/lib/chem/schema";
import { type WorkupPrediction } from "@/lib/chem/types";

export function totalsAfterStep(pred: WorkupPrediction, input: WorkupInput, step: number): Record<string, number> {
  const combinedBy = new Map<string, number>();
  input.operations.forEach((op, i) => {
    if (op.type === "combine") for (const s of op.streams) combinedBy.set(s, i + 1);
  });
  const out: Record<string, number> = { ...pred.steps[step - 1]?.kept.components };
  for (const s of pred.steps.slice(0, step)) {
    for (const side of s.sideStreams) {
      const combinedAt = side.fate === "saved" ? combinedBy.get(side.name) : undefined;
      if (combinedAt !== undefined && combinedAt <= step) continue;
      for (const [k, v] of Object.entries(side.components)) out[k] = (out[k] ?? 0) + v;
    }
  }
  return out;
}
