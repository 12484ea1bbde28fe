/**
 * A pool of worker threads (node:worker_threads) for the engine's heavy work, so that a prediction with its Monte
 * Carlo draws never runs on the event loop that answers every other request. One thread per core but one (the event
 * loop keeps a core), at least one. A task waits in a bounded queue: when no thread comes free within `maxWaitMs`,
 * or the queue is full, it is refused with ServiceUnavailableError (503 + Retry-After) before anything is written.
 *
 * Threads start on first use and stay; a thread that dies fails only its own task and is replaced. The threads run
 * the TypeScript sources through tsx (a pinned dependency, as bin/layerwise.mjs does), started from boot.mjs.
 */
import os from "node:os";
import path from "node:path";
import { Worker, type WorkerOptions } from "node:worker_threads";
import { BadRequestError, ConflictError, PayloadTooLargeError, ServiceUnavailableError, ValidationError, type AppError } from "@/lib/errors";
import { type TaskName, type TaskResult, type TaskArgs, type ThreadError, type WorkerReply } from "./protocol";

export interface PoolOptions {
  /** Threads. Default: cores − 1, at least 1. */
  size?: number;
  /** Longest wait for a free thread before 503. Default 20 s. */
  maxWaitMs?: number;
  /** Tasks waiting at most; more are refused at once with 503. Default 64. */
  maxQueue?: number;
}

export const defaultPoolSize = () => Math.max(1, (os.availableParallelism?.() ?? os.cpus().length) - 1);
export const DEFAULT_MAX_WAIT_MS = 20_000;
export const DEFAULT_MAX_QUEUE = 64;

interface Pending {
  id: number;
  name: TaskName;
  args: unknown;
  transfer: ArrayBuffer[];
  resolve: (value: unknown) => void;
  reject: (error: unknown) => void;
  timer?: ReturnType<typeof setTimeout>;
}

interface Thread {
  worker: Worker;
  busy: Pending | null;
}

/** Resolved from the project folder at run time (the server runs there), so no bundler rewrites the path. */
function bootFile(): string {
  return path.join(process.cwd(), "lib", "workers", "boot.mjs");
}

function entryFile(): string {
  return path.join(process.cwd(), "lib", "workers", "engine-worker.ts");
}

export class EnginePool {
  readonly size: number;
  readonly maxWaitMs: number;
  readonly maxQueue: number;
  private threads: Thread[] = [];
  private queue: Pending[] = [];
  private nextId = 1;
  private closed = false;

  constructor(options: PoolOptions = {}) {
    this.size = Math.max(1, Math.floor(options.size ?? defaultPoolSize()));
    this.maxWaitMs = options.maxWaitMs ?? DEFAULT_MAX_WAIT_MS;
    this.maxQueue = options.maxQueue ?? DEFAULT_MAX_QUEUE;
  }

  /** Tasks running and waiting (tests and the overload figures read it). */
  get load(): { running: number; waiting: number } {
    return { running: this.threads.filter((t) => t.busy).length, waiting: this.queue.length };
  }

  /** Runs a task on a thread. Buffers in `transfer` move to the thread (they are unusable here afterwards). */
  run<N extends TaskName>(name: N, args: TaskArgs<N>, transfer: ArrayBuffer[] = []): Promise<TaskResult<N>> {
    if (this.closed) return Promise.reject(new ServiceUnavailableError("The server is stopping; nothing was saved. Try again in a moment."));
    return new Promise<TaskResult<N>>((resolve, reject) => {
      const task: Pending = { id: this.nextId++, name, args, transfer, resolve: resolve as (v: unknown) => void, reject };
      const idle = this.idleThread();
      if (idle) return this.dispatch(idle, task);
      if (this.queue.length >= this.maxQueue) return reject(this.busyError());
      task.timer = setTimeout(() => {
        const at = this.queue.indexOf(task);
        if (at >= 0) {
          this.queue.splice(at, 1);
          reject(this.busyError());
        }
      }, this.maxWaitMs);
      this.queue.push(task);
    });
  }

  /** Stops every thread; running and waiting tasks are refused with 503. */
  async close(): Promise<void> {
    this.closed = true;
    for (const task of this.queue.splice(0)) {
      clearTimeout(task.timer);
      task.reject(new ServiceUnavailableError("The server is stopping; nothing was saved. Try again in a moment."));
    }
    const threads = this.threads.splice(0);
    await Promise.all(threads.map((t) => t.worker.terminate()));
  }

  private busyError(): ServiceUnavailableError {
    const seconds = Math.max(1, Math.ceil(this.maxWaitMs / 1000 / 2));
    return new ServiceUnavailableError(
      `Every prediction thread of the server is busy; nothing was saved. Try again in ${seconds} s.`, seconds,
    );
  }

  private idleThread(): Thread | undefined {
    const free = this.threads.find((t) => !t.busy);
    if (free) return free;
    if (this.threads.length < this.size) return this.spawn();
    return undefined;
  }

  private spawn(): Thread {
    // Constructed by reflection so that the bundler does not follow the file into the server bundle: the thread runs
    // the sources through tsx, which must not be bundled (Turbopack fails on esbuild's binary).
    const worker = Reflect.construct<[string, WorkerOptions], Worker>(Worker, [bootFile(), { workerData: { entry: entryFile() } }]);
    worker.unref(); // an idle pool never keeps a process alive
    const thread: Thread = { worker, busy: null };
    worker.on("message", (reply: WorkerReply) => this.settle(thread, reply));
    worker.on("error", (error) => this.fail(thread, error));
    worker.on("exit", (code) => this.fail(thread, new Error(`engine thread exited with code ${code}`)));
    this.threads.push(thread);
    return thread;
  }

  private dispatch(thread: Thread, task: Pending): void {
    thread.busy = task;
    thread.worker.ref(); // a running task keeps the process alive until it answers
    thread.worker.postMessage({ id: task.id, name: task.name, args: task.args }, task.transfer);
  }

  private settle(thread: Thread, reply: WorkerReply): void {
    const task = thread.busy;
    if (!task || task.id !== reply.id) return;
    thread.busy = null;
    thread.worker.unref();
    if (reply.ok) task.resolve(reply.value);
    else task.reject(reviveError(reply.error));
    this.next(thread);
  }

  private fail(thread: Thread, error: unknown): void {
    const at = this.threads.indexOf(thread);
    if (at < 0) return;
    this.threads.splice(at, 1);
    thread.busy?.reject(error);
    thread.busy = null;
    void thread.worker.terminate().catch(() => undefined);
    const waiting = this.queue.shift();
    if (waiting && !this.closed) {
      clearTimeout(waiting.timer);
      this.dispatch(this.spawn(), waiting);
    }
  }

  private next(thread: Thread): void {
    const task = this.queue.shift();
    if (!task) return;
    clearTimeout(task.timer);
    this.dispatch(thread, task);
  }
}

/** Application errors that cross back as themselves (their messages reach the user); keyed by their code. */
const REVIVED: Record<string, (e: ThreadError) => AppError> = {
  validation: (e) => new ValidationError(e.fieldErrors ?? {}, e.message),
  bad_request: (e) => new BadRequestError(e.message),
  conflict: (e) => new ConflictError(e.message),
  payload_too_large: (e) => new PayloadTooLargeError(e.message),
};

/** A typed application error thrown in a thread comes back as itself; anything else is unexpected. */
function reviveError(error: ThreadError): Error {
  const known = error.code ? REVIVED[error.code] : undefined;
  if (known) return known(error);
  const revived = new Error(error.message);
  revived.name = error.name;
  if (error.stack) revived.stack = error.stack;
  return revived;
}

// One pool per process, kept on globalThis so that development-mode module reloads do not start a second one.
const shared = globalThis as typeof globalThis & { __layerwiseEnginePool?: EnginePool };

export function enginePool(): EnginePool {
  shared.__layerwiseEnginePool ??= new EnginePool();
  return shared.__layerwiseEnginePool;
}

export async function closeEnginePool(): Promise<void> {
  const pool = shared.__layerwiseEnginePool;
  shared.__layerwiseEnginePool = undefined;
  await pool?.close();
}
