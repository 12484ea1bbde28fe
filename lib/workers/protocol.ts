// What the event loop and the engine threads (pool.ts, engine-worker.ts) send each other. Everything crosses by
// structured clone, so arguments and results are plain data; byte buffers named in a transfer list move without a
// copy.
import { type FieldErrors } from "@/lib/errors";
import { type InputEntry, type ReadRecordsResult } from "@/lib/compounds/import-records";
import { type RegisterFormat } from "@/lib/compounds/schemas";
import { type ImportTable } from "@/lib/workups/csv-table";
import { type GroupImportPlan } from "@/lib/workups/group-import-plan";
import { type ComputedPrediction, type PredictionOptions } from "@/lib/workups/prediction";

export interface Tasks {
  /** lib/workups/prediction.ts computePrediction: point prediction and, when draws > 0, the Monte Carlo interval. */
  predict: { args: { spec: unknown; options: PredictionOptions }; result: ComputedPrediction };
  /** lib/compounds/import-records.ts splitInput: a registration's text as entries (whole-input problems thrown). */
  compoundsSplit: { args: { format: RegisterFormat; text: string }; result: InputEntry[] };
  /** lib/compounds/import-records.ts describeEntries: a slice of entries read and described with RDKit. */
  compoundsDescribe: { args: { format: RegisterFormat; entries: InputEntry[] }; result: ReadRecordsResult };
  /** lib/workups/csv-table.ts readImportTable: a CSV import's text checked and split into rows. */
  csvTable: { args: { text: string }; result: ImportTable };
  /** lib/workups/group-import-plan.ts: a group export's bytes parsed, checked and turned into rows to insert. */
  groupImportPlan: { args: { bytes: Uint8Array; groupId: string }; result: GroupImportPlan };
}

export type TaskName = keyof Tasks;
export type TaskArgs<N extends TaskName> = Tasks[N]["args"];
export type TaskResult<N extends TaskName> = Tasks[N]["result"];

export interface TaskMessage {
  id: number;
  name: TaskName;
  args: unknown;
}

/** An error thrown in a thread, as data: typed application errors keep their code so the user sees their message. */
export interface ThreadError {
  name: string;
  message: string;
  /** AppError code ("validation", "bad_request", …) when the error was one. */
  code?: string;
  fieldErrors?: FieldErrors;
  stack?: string;
}

export type WorkerReply =
  | { id: number; ok: true; value: unknown }
  | { id: number; ok: false; error: ThreadError };
