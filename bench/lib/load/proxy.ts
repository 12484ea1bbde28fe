/**
 * A tiny round-robin HTTP proxy (node:http) for the scale-out benchmark: each request goes to the next instance in
 * turn over kept-alive connections, and the client's address is appended to X-Forwarded-For as any load balancer does.
 * Sessions need no stickiness: every instance reads them from the shared database with the shared secret.
 */
import http from "node:http";
import { type AddressInfo } from "node:net";

export interface RoundRobinProxy { url: URL; close: () => Promise<void> }

export async function startProxy(targets: URL[], port = 0): Promise<RoundRobinProxy> {
  if (targets.length === 0) throw new Error("the proxy needs at least one instance");
  const agent = new http.Agent({ keepAlive: true, maxSockets: 256 });
  let next = 0;
  const server = http.createServer((req, res) => {
    const target = targets[next++ % targets.length]!;
    const peer = req.socket.remoteAddress ?? "unknown";
    const sent = req.headers["x-forwarded-for"];
    const headers = { ...req.headers, "x-forwarded-for": sent ? `${String(sent)}, ${peer}` : peer };
    const upstream = http.request(
      { host: target.hostname, port: target.port, method: req.method, path: req.url, headers, agent },
      (answer) => {
        res.writeHead(answer.statusCode ?? 502, answer.headers);
        answer.pipe(res);
      },
    );
    upstream.on("error", () => {
      if (!res.headersSent) res.writeHead(502, { "content-type": "text/plain" });
      res.end("upstream failed");
    });
    req.pipe(upstream);
  });
  await new Promise<void>((resolve) => server.listen(port, "127.0.0.1", resolve));
  const { port: bound } = server.address() as AddressInfo;
  return {
    url: new URL(`http://127.0.0.1:${bound}`),
    close: () => new Promise((resolve) => {
      agent.destroy();
      server.closeAllConnections();
      server.close(() => resolve());
    }),
  };
}
