import type { IncomingMessage, Server, ServerResponse } from "node:http";

export function appendPeer(req: IncomingMessage): void;
export function undecodablePath(url: string | undefined): boolean;
export function serve(options?: {
  handler?: (req: IncomingMessage, res: ServerResponse) => unknown;
  host?: string;
  port?: number;
  graceMs?: number;
  onStopped?: (code: number) => void;
  log?: (line: string) => void;
  /** Requests run at once (default LAYERWISE_MAX_IN_FLIGHT or 64). */
  maxInFlight?: number;
  /** Longest wait for a place before 503 (default LAYERWISE_QUEUE_WAIT_SECONDS × 1000 or 10 s). */
  queueWaitMs?: number;
  /** Requests waiting at most; more are answered 503 at once (default 4 × maxInFlight). */
  maxQueue?: number;
}): Promise<Server>;
