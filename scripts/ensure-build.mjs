#!/usr/bin/env node
// Builds the Next.js app when no build exists or the sources changed since the last one. The stamp fingerprints every
// source file (path, size, mtime), so a fresh clone or an edit triggers a build and an unchanged tree does not.
// Used by `npm start` and by the browser tests' web server, so neither serves a stale build.
import { spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";

const STAMP_FILE = ".next/layerwise-build-stamp";
const SOURCES = ["app", "lib", "components", "public", "instrumentation.ts", "middleware.ts", "proxy.ts", "prisma/schema.prisma", "next.config.mjs", "package-lock.json", "postcss.config.mjs", "tsconfig.json"];

export function sourceStamp() {
  const hash = createHash("sha256");
  const walk = (p) => {
    if (!existsSync(p)) return;
    const st = statSync(p);
    if (st.isDirectory()) {
      for (const e of readdirSync(p).sort()) walk(path.join(p, e));
      return;
    }
    hash.update(`${p}:${st.size}:${st.mtimeMs}\n`);
  };
  SOURCES.forEach(walk);
  return hash.digest("hex");
}

export function ensureBuild() {
  process.env.NEXT_TELEMETRY_DISABLED ??= "1";
  if (!existsSync("generated/prisma/client.ts")) run("npx", ["prisma", "generate"]);
  const stamp = sourceStamp();
  if (existsSync(".next/BUILD_ID") && existsSync(STAMP_FILE) && readFileSync(STAMP_FILE, "utf8") === stamp) return;
  console.log("Building the app (first start, or the sources changed since the last build)...");
  run("npx", ["next", "build"]);
  writeFileSync(STAMP_FILE, stamp);
}

function run(cmd, args) {
  const r = spawnSync(cmd, args, { stdio: "inherit" });
  if (r.status !== 0) process.exit(r.status ?? 1);
}

if (import.meta.url === `file://${process.argv[1]}`) ensureBuild();
