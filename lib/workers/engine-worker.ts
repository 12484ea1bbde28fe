// The body of an engine thread (pool.ts): runs one task at a time and answers with its result or its error.
import { parentPort } from "node:worker_threads";
import { loadRDKit } from "@/lib/chem/structure";
import { describeEntries, splitInput } from "@/lib/compounds/import-records";
import { AppError, ValidationError } from "@/lib/errors";
import { readImportTable } from "@/lib/workups/csv-table";
import { planGroupImportBytes } from "@/lib/workups/group-import-plan";
import { computePrediction } from "@/lib/workups/prediction";
import { type TaskMessage, type Tasks, type ThreadError, type WorkerReply } from "./protocol";

type Handlers = { [N in keyof Tasks]: (args: Tasks[N]["args"]) => Tasks[N]["result"] | Promise<Tasks[N]["result"]> };

const handlers: Handlers = {
  predict: ({ spec, options }) => computePrediction(spec, options),
  compoundsSplit: ({ format, text }) => splitInput(format, text),
  compoundsDescribe: async ({ format, entries }) => describeEntries(await loadRDKit(), format, entries),
  csvTable: ({ text }) => readImportTable(text),
  groupImportPlan: ({ bytes, groupId }) => planGroupImportBytes(bytes, groupId),
};

/** Buffers of a result that move to the event loop instead of being copied. */
function transferOf(name: keyof Tasks, value: unknown): ArrayBuffer[] {
  if (name !== "groupImportPlan") return [];
  return (value as Tasks["groupImportPlan"]["result"]).chunks.map((c) => c.data.buffer as ArrayBuffer);
}

function threadError(error: unknown): ThreadError {
  if (error instanceof ValidationError) return { name: "ValidationError", code: error.code, message: error.message, fieldErrors: error.fieldErrors };
  if (error instanceof AppError) return { name: error.name, code: error.code, message: error.message };
  const e = error instanceof Error ? error : new Error(String(error));
  return { name: e.name, message: e.message, ...(e.stack ? { stack: e.stack } : {}) };
}

async function run(message: TaskMessage): Promise<void> {
  let reply: WorkerReply;
  let transfer: ArrayBuffer[] = [];
  try {
    const handler = handlers[message.name] as (args: unknown) => unknown;
    const value = await handler(message.args);
    reply = { id: message.id, ok: true, value };
    transfer = transferOf(message.name, value);
  } catch (error) {
    reply = { id: message.id, ok: false, error: threadError(error) };
  }
  parentPort?.postMessage(reply, transfer);
}

parentPort?.on("message", (message: TaskMessage) => void run(message));
