// A save that queues a job wakes this process's idle worker at once instead of leaving the job to its next poll
// (2 s). Other instances find the job on their own poll. Nothing happens where no worker runs (scripts, tests).
const shared = globalThis as typeof globalThis & { __layerwiseWakeWorker?: () => void };

export function setWorkerWake(wake: (() => void) | undefined): void {
  shared.__layerwiseWakeWorker = wake;
}

/** Call after the transaction that queued a job has committed. */
export function wakeJobWorker(): void {
  shared.__layerwiseWakeWorker?.();
}
