#!/usr/bin/env node
// `npm start`: build if the sources changed since the last build, migrate the database, load the demo scenario
// into an empty embedded database, then serve on http://localhost:$PORT (default 3000).
import { spawnSync, spawn } from "node:child_process";
import path from "node:path";
import { ensureBuild } from "./ensure-build.mjs";

const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), "..");
process.chdir(root);
// Nothing may call out of the machine: Next.js would otherwise send anonymous usage telemetry.
process.env.NEXT_TELEMETRY_DISABLED ??= "1";

function run(cmd, args) {
  const r = spawnSync(cmd, args, { stdio: "inherit" });
  if (r.status !== 0) process.exit(r.status ?? 1);
}

ensureBuild();

// Migrations and the demo seed run in a short-lived process before the server opens the database:
// an embedded data directory may be open in one process only.
run("npx", ["tsx", "scripts/prepare-db.ts"]);

const port = process.env.PORT ?? "3000";
const server = spawn("npx", ["next", "start", "-p", port], { stdio: "inherit" });
for (const sig of ["SIGINT", "SIGTERM"]) process.on(sig, () => server.kill(sig));
server.on("exit", (code) => process.exit(code ?? 0));
