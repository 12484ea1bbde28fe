// The one worker of this app process, kept on globalThis so that development-mode module reloads do not start a
// second one beside it. Its engine work runs on the process's engine threads (engine.ts).
import { getDb } from "@/lib/db/client";
import { predictOnEngineThread } from "./engine";
import { setWorkerWake } from "./wake";
import { startWorker, type RunningWorker } from "./worker";

const shared = globalThis as typeof globalThis & { __layerwiseWorker?: RunningWorker };

export function startAppWorker(): RunningWorker {
  shared.__layerwiseWorker ??= startWorker(getDb, { predict: predictOnEngineThread });
  setWorkerWake(shared.__layerwiseWorker.wake);
  return shared.__layerwiseWorker;
}

export async function stopAppWorker(): Promise<void> {
  const worker = shared.__layerwiseWorker;
  shared.__layerwiseWorker = undefined;
  setWorkerWake(undefined);
  await worker?.stop();
}
