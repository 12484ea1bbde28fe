// The app's background worker runs the engine on the request path's engine threads (lib/workers/pool.ts), so a
// job's Monte Carlo draws never hold the event loop that answers requests. When requests keep every thread busy the
// pool refuses with 503; a job is not a request and has no one to answer, so it waits and asks again.
import { ServiceUnavailableError } from "@/lib/errors";
import { predictInPool } from "@/lib/workers/engine";
import { type Predictor } from "./repredict";

/** Refusals waited out before the batch fails (and is retried by the worker with its own backoff). */
const BUSY_TRIES = 6;

export const predictOnEngineThread: Predictor = async (spec, options) => {
  for (let attempt = 1; ; attempt++) {
    try {
      return await predictInPool(spec, options);
    } catch (error) {
      if (!(error instanceof ServiceUnavailableError) || attempt >= BUSY_TRIES) throw error;
      await new Promise((resolve) => setTimeout(resolve, error.retryAfterSeconds * 1000));
    }
  }
};
