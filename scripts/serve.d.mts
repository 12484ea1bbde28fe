import type { IncomingMessage, Server, ServerResponse } from "node:http";

export function appendPeer(req: IncomingMessage): void;
export function serve(options?: {
  handler?: (req: IncomingMessage, res: ServerResponse) => unknown;
  host?: string;
  port?: number;
  graceMs?: number;
  onStopped?: (code: number) => void;
  log?: (line: string) => void;
}): Promise<Server>;
