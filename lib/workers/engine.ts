// The server's one way to run the engine for a request: the work is estimated first and refused beyond the budget
// (422, the limit stated, nothing run), then counted against the user's heavy slots (429) and run on an engine thread
// (503 when every thread stays busy), never on the event loop.
import { ValidationError } from "@/lib/errors";
import { type ComputedPrediction, type PredictionOptions } from "@/lib/workups/prediction";
import { engineCost, overBudgetField, overBudgetMessage } from "./cost";
import { withHeavySlot } from "./limits";
import { enginePool } from "./pool";

export interface BudgetFields {
  /** Field path of the spec in the request (default "spec"). */
  spec?: string;
  /** Field path of the draw count, or null when the caller does not choose it (default null). */
  draws?: string | null;
}

/**
 * Throws ValidationError (422) when `spec` with `draws` Monte Carlo draws is more engine work than one request may
 * ask for. `draws` is the work the request sets in motion, including an interval computed later in the background.
 */
export function assertEngineBudget(spec: unknown, draws: number, fields: BudgetFields = {}): void {
  const message = overBudgetMessage(engineCost(spec, draws));
  if (message === null) return;
  const field = overBudgetField(spec, draws, fields.spec ?? "spec", fields.draws ?? null);
  throw new ValidationError({ [field]: [message] }, "This prediction is more work than one request may ask for.");
}

/** computePrediction on an engine thread (the caller holds the user's heavy slot, e.g. for a whole import). */
export function predictInPool(spec: unknown, options: PredictionOptions): Promise<ComputedPrediction> {
  return enginePool().run("predict", { spec, options });
}

/** computePrediction on an engine thread, in one of the user's heavy slots. Check the budget first. */
export function predictOffThread(userKey: string, spec: unknown, options: PredictionOptions): Promise<ComputedPrediction> {
  return withHeavySlot(userKey, () => predictInPool(spec, options));
}
