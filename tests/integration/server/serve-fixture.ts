// A server started through the production entry's serve() (scripts/serve.mjs) on a real embedded database, with a
// slow write route, for the shutdown test. The shutdown hook is the one instrumentation.ts installs: close the database.
import { createDb } from "@/lib/db/client";
import { serve } from "@/scripts/serve.mjs";

const dir = process.argv[2];
if (!dir) throw new Error("usage: serve-fixture.ts <data dir>");
const { db, close } = await createDb({ url: `pglite:${dir}` });
(globalThis as typeof globalThis & { __layerwiseShutdown?: () => Promise<void> }).__layerwiseShutdown = close;

await serve({
  graceMs: 5000,
  handler: async (req, res) => {
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
