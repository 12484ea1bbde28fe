#!/usr/bin/env node
// `npm start`: build if the sources changed since the last build, migrate the database, load the demo scenario
// into an empty embedded database, then serve on http://127.0.0.1:$PORT (default 3000; HOST to serve other machines).
// The server runs in THIS process (scripts/serve.mjs), so a signal sent to it reaches the server, which drains its
// requests and closes the database before exiting.
import { spawnSync } from "node:child_process";
import path from "node:path";
import { ensureBuild } from "./ensure-build.mjs";
import { serve } from "./serve.mjs";

const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), "..");
process.chdir(root);
// Nothing may call out of the machine: Next.js would otherwise send anonymous usage telemetry.
process.env.NEXT_TELEMETRY_DISABLED ??= "1";
process.env.NODE_ENV ??= "production";

function run(cmd, args) {
  const r = spawnSync(cmd, args, { stdio: "inherit" });
  if (r.status !== 0) process.exit(r.status ?? 1);
}

ensureBuild();

// Migrations and the demo seed run in a short-lived process before the server opens the database (an embedded data
// directory may be open in one process only). It also validates the settings and refuses to go on when the server
// would be reachable from other machines while a demo account keeps the published password.
run("npx", ["tsx", "scripts/prepare-db.ts"]);

await serve();
