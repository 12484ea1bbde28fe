// What the event loop and the engine threads (pool.ts, engine-worker.ts) send each other. Everything crosses by
// structured clone, so arguments and results are plain data.
import { type FieldErrors } from "@/lib/errors";
import { type ComputedPrediction, type PredictionOptions } from "@/lib/workups/prediction";

export interface Tasks {
  /** lib/workups/prediction.ts computePrediction: point prediction and, when draws > 0, the Monte Carlo interval. */
  predict: { args: { spec: unknown; options: PredictionOptions }; result: ComputedPrediction };
}

export type TaskName = keyof Tasks;
export type TaskArgs<N extends TaskName> = Tasks[N]["args"];
export type TaskResult<N extends TaskName> = Tasks[N]["result"];

export interface TaskMessage {
  id: number;
  name: TaskName;
  args: unknown;
}

export type WorkerReply =
  | { id: number; ok: true; value: unknown }
  | { id: number; ok: false; error: { name: string; message: string; fieldErrors?: FieldErrors; stack?: string } };
