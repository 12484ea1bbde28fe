// The body of an engine thread (pool.ts): runs one task at a time and answers with its result or its error.
import { parentPort } from "node:worker_threads";
import { ValidationError } from "@/lib/errors";
import { computePrediction } from "@/lib/workups/prediction";
import { type TaskMessage, type Tasks, type WorkerReply } from "./protocol";

const handlers: { [N in keyof Tasks]: (args: Tasks[N]["args"]) => Tasks[N]["result"] } = {
  predict: ({ spec, options }) => computePrediction(spec, options),
};

function replyOf(message: TaskMessage): WorkerReply {
  try {
    const handler = handlers[message.name] as (args: unknown) => unknown;
    return { id: message.id, ok: true, value: handler(message.args) };
  } catch (error) {
    if (error instanceof ValidationError) return { id: message.id, ok: false, error: { name: "ValidationError", message: error.message, fieldErrors: error.fieldErrors } };
    const e = error instanceof Error ? error : new Error(String(error));
    return { id: message.id, ok: false, error: { name: e.name, message: e.message, ...(e.stack ? { stack: e.stack } : {}) } };
  }
}

parentPort?.on("message", (message: TaskMessage) => parentPort?.postMessage(replyOf(message)));
