/**
 * Live prediction while editing: the engine runs in the browser on the form's spec, debounced (DEBOUNCE_MS after the
 * last keystroke). The point prediction takes milliseconds and runs here; the Monte Carlo interval runs in a Web
 * Worker (main thread only when workers are unavailable), and a reply for an older form is dropped.
 * While the form is invalid the last good prediction stays on screen, marked as stale.
 */
import { useCallback, useEffect, useRef, useState } from "react";
import { simulateWorkup } from "@/lib/chem/predict";
import { type LibraryOverrides } from "@/lib/chem/library";
import { type WorkupPrediction } from "@/lib/chem/types";
import { applyGroupValues, type GroupValues } from "@/lib/partition/overlay";
import { computeInterval, PREVIEW_DRAWS, type IntervalReply, type IntervalRequest, type PreviewInterval } from "./interval";
import { checkSpec, type Issue } from "./validate";

/** Quiet time after the last edit before the engine runs (fast enough to feel live, slow enough not to run per key). */
export const DEBOUNCE_MS = 250;

export interface LivePrediction {
  /** "waiting" until the first run; "invalid" when the current form cannot be predicted. */
  status: "waiting" | "ready" | "invalid" | "failed";
  /** The latest successful prediction (possibly for an earlier, valid state of the form). */
  prediction: WorkupPrediction | null;
  stale: boolean;
  issues: Issue[];
  failure: string | null;
  interval: PreviewInterval | null;
  intervalStatus: "idle" | "computing" | "ready" | "failed";
  /** Increases with every new prediction; shown in the panel so a reader (or a test) can see it update. */
  revision: number;
  elapsedMs: number | null;
}

const INITIAL: LivePrediction = {
  status: "waiting", prediction: null, stale: false, issues: [], failure: null, interval: null, intervalStatus: "idle", revision: 0, elapsedMs: null,
};

function useIntervalRunner(onReply: (reply: IntervalReply) => void) {
  const worker = useRef<Worker | null>(null);
  const busy = useRef(false);
  const inFlight = useRef<IntervalRequest | null>(null);
  const pending = useRef<IntervalRequest | null>(null);
  const reply = useRef(onReply);
  useEffect(() => {
    reply.current = onReply;
  });
  useEffect(() => {
    let w: Worker | null = null;
    try {
      w = new Worker(new URL("./uncertainty-worker.ts", import.meta.url), { type: "module" });
    } catch {
      w = null; // no workers (old browser, strict CSP): the fallback below runs on the main thread
    }
    const next = () => {
      const queued = pending.current;
      pending.current = null;
      busy.current = queued !== null;
      inFlight.current = queued;
      if (queued) w?.postMessage(queued);
    };
    if (w) {
      w.onmessage = (event: MessageEvent<IntervalReply>) => {
        reply.current(event.data);
        next();
      };
      // A worker that fails to load (blocked script, old browser) hands its work to the main thread from then on.
      w.onerror = (event) => {
        event.preventDefault();
        worker.current = null;
        busy.current = false;
        const lost = pending.current ?? inFlight.current;
        pending.current = null;
        inFlight.current = null;
        if (lost) setTimeout(() => reply.current(computeInterval(lost)), 0);
      };
    }
    worker.current = w;
    return () => {
      w?.terminate();
      worker.current = null;
    };
  }, []);
  return useCallback((request: IntervalRequest) => {
    const w = worker.current;
    if (!w) {
      setTimeout(() => reply.current(computeInterval(request)), 0);
      return;
    }
    if (busy.current) pending.current = request;
    else {
      busy.current = true;
      inFlight.current = request;
      w.postMessage(request);
    }
  }, []);
}

/**
 * `options.groupValues`: the group's values for the linked compounds (use-group-values.ts), laid over the spec as a
 * save does, so the preview matches the stored prediction. Keep the object stable between renders.
 */
export function useLivePrediction(rawSpec: unknown, library: LibraryOverrides, options: { draws?: number; delayMs?: number; groupValues?: GroupValues } = {}): LivePrediction {
  const [live, setLive] = useState<LivePrediction>(INITIAL);
  const latest = useRef(0);
  const specJson = JSON.stringify(rawSpec);
  const draws = options.draws ?? PREVIEW_DRAWS;
  const delay = options.delayMs ?? DEBOUNCE_MS;
  const groupValues = options.groupValues;
  const runInterval = useIntervalRunner((reply) => {
    if (reply.id !== latest.current) return;
    setLive((l) => (reply.ok ? { ...l, interval: reply.interval, intervalStatus: "ready" } : { ...l, intervalStatus: "failed" }));
  });

  useEffect(() => {
    const timer = setTimeout(() => {
      const id = ++latest.current;
      const check = checkSpec(JSON.parse(specJson) as unknown, library);
      if (!check.ok) {
        setLive((l) => ({ ...l, status: "invalid", stale: l.prediction !== null, issues: check.issues, failure: null }));
        return;
      }
      const started = performance.now();
      try {
        const spec = applyGroupValues(check.spec, groupValues);
        const prediction = simulateWorkup(spec, library);
        const elapsedMs = performance.now() - started;
        setLive((l) => ({
          status: "ready", prediction, stale: false, issues: [], failure: null, interval: l.interval,
          intervalStatus: draws > 0 ? "computing" : "idle", revision: l.revision + 1, elapsedMs,
        }));
        if (draws > 0) runInterval({ id, spec, library, draws });
      } catch (error) {
        setLive((l) => ({ ...l, status: "failed", stale: l.prediction !== null, failure: error instanceof Error ? error.message : "the engine could not run this workup" }));
      }
    }, delay);
    return () => clearTimeout(timer);
  }, [specJson, library, draws, delay, runInterval, groupValues]);

  return live;
}
