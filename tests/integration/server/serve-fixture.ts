// A server started through the production entry's serve() (scripts/serve.mjs) on a real embedded database, with a
// slow write route, for the shutdown test, and a slow read (/hold) and a handler count (/handled) for the overload
// test. The shutdown hook is the one instrumentation.ts installs: close the database.
import { createDb } from "@/lib/db/client";
import { serve } from "@/scripts/serve.mjs";

const dir = process.argv[2];
if (!dir) throw new Error("usage: serve-fixture.ts <data dir>");
const { db, close } = await createDb({ url: `pglite:${dir}` });
(globalThis as typeof globalThis & { __layerwiseShutdown?: () => Promise<void> }).__layerwiseShutdown = close;

let handled = 0;
const limit = (name: string) => (process.env[name] ? Number(process.env[name]) : undefined);
await serve({
  graceMs: 5000,
  maxInFlight: limit("FIXTURE_MAX_IN_FLIGHT"),
  queueWaitMs: limit("FIXTURE_QUEUE_WAIT_MS"),
  maxQueue: limit("FIXTURE_MAX_QUEUE"),
  handler: async (req, res) => {
    handled++;
    if (req.url?.startsWith("/hold")) {
      await new Promise((r) => setTimeout(r, 1500));
      res.writeHead(200, { "content-type": "application/json" });
      res.end(JSON.stringify({ handled }));
      return;
    }
    if (req.url?.startsWith("/handled")) {
      res.writeHead(200, { "content-type": "application/json" });
      res.end(JSON.stringify({ handled }));
      return;
    }
    if (req.url?.startsWith("/slow")) {
      await new Promise((r) => setTimeout(r, 1500));
      const group = await db.group.create({ data: { name: "Written while stopping", slug: `stopping-${Date.now()}` } });
      res.writeHead(200, { "content-type": "application/json" });
      res.end(JSON.stringify({ id: group.id, forwardedFor: req.headers["x-forwarded-for"] }));
      return;
    }
    res.writeHead(200, { "content-type": "application/json" });
    res.end(JSON.stringify({ forwardedFor: req.headers["x-forwarded-for"] }));
  },
});
