#!/usr/bin/env node
// `npm start`: build if the sources changed since the last build, migrate the database, load the demo scenario
// into an empty embedded database, then serve on http://localhost:$PORT (default 3000).
import { spawnSync, spawn } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";

const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), "..");
process.chdir(root);
// Nothing may call out of the machine: Next.js would otherwise send anonymous usage telemetry.
process.env.NEXT_TELEMETRY_DISABLED ??= "1";

function run(cmd, args, extraEnv = {}) {
  const r = spawnSync(cmd, args, { stdio: "inherit", env: { ...process.env, ...extraEnv } });
  if (r.status !== 0) process.exit(r.status ?? 1);
}

// The build stamp fingerprints every source file (path, size, mtime) so a fresh clone or an edit triggers a build.
function sourceStamp() {
  const hash = createHash("sha256");
  const roots = ["app", "lib", "components", "prisma/schema.prisma", "next.config.mjs", "package-lock.json", "postcss.config.mjs"];
  const walk = (p) => {
    if (!existsSync(p)) return;
    const st = statSync(p);
    if (st.isDirectory()) { for (const e of readdirSync(p).sort()) walk(path.join(p, e)); return; }
    hash.update(`${p}:${st.size}:${st.mtimeMs}\n`);
  };
  roots.forEach(walk);
  return hash.digest("hex");
}

if (!existsSync("generated/prisma/client.ts")) run("npx", ["prisma", "generate"]);

const stampFile = ".next/layerwise-build-stamp";
const stamp = sourceStamp();
if (!existsSync(".next/BUILD_ID") || !existsSync(stampFile) || readFileSync(stampFile, "utf8") !== stamp) {
  console.log("Building the app (first start or sources changed)...");
  run("npx", ["next", "build"]);
  writeFileSync(stampFile, stamp);
}

// Migrations and the demo seed run in a short-lived process before the server opens the database:
// an embedded data directory may be open in one process only.
run("npx", ["tsx", "scripts/prepare-db.ts"]);

const port = process.env.PORT ?? "3000";
const server = spawn("npx", ["next", "start", "-p", port], { stdio: "inherit" });
for (const sig of ["SIGINT", "SIGTERM"]) process.on(sig, () => server.kill(sig));
server.on("exit", (code) => process.exit(code ?? 0));
