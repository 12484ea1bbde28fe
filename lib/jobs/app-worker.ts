// The one worker of this app process, kept on globalThis so that development-mode module reloads do not start a
// second one beside it.
import { getDb } from "@/lib/db/client";
import { startWorker, type RunningWorker } from "./worker";

const shared = globalThis as typeof globalThis & { __layerwiseWorker?: RunningWorker };

export function startAppWorker(): RunningWorker {
  shared.__layerwiseWorker ??= startWorker(getDb);
  return shared.__layerwiseWorker;
}

export async function stopAppWorker(): Promise<void> {
  const worker = shared.__layerwiseWorker;
  shared.__layerwiseWorker = undefined;
  await worker?.stop();
}
