// Web Worker: computes the preview interval off the main thread so typing never waits for the Monte Carlo.
import { computeInterval, type IntervalRequest } from "./interval";

interface WorkerScope {
  onmessage: ((event: MessageEvent<IntervalRequest>) => void) | null;
  postMessage(message: unknown): void;
}

const scope = self as unknown as WorkerScope;
scope.onmessage = (event) => {
  scope.postMessage(computeInterval(event.data));
};
