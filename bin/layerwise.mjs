#!/usr/bin/env node
// Plain-Node entry point for `npx layerwise …` / `npm run layerwise -- …`: registers tsx's loader (a pinned
// dependency) for this process and runs the TypeScript CLI beside this file.
import { fileURLToPath } from "node:url";
import { register } from "tsx/esm/api";

register({ tsconfig: fileURLToPath(new URL("../tsconfig.json", import.meta.url)) });
const { main } = await import("./cli.ts");
process.exitCode = await main(process.argv.slice(2));
