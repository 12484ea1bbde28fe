// Starts an engine thread (pool.ts): registers tsx's loader for this thread, as bin/layerwise.mjs does for the CLI,
// then loads the TypeScript body named in workerData.
import path from "node:path";
import { pathToFileURL } from "node:url";
import { workerData } from "node:worker_threads";
import { register } from "tsx/esm/api";

register({ tsconfig: path.join(path.dirname(workerData.entry), "..", "..", "tsconfig.json") });
await import(pathToFileURL(workerData.entry).href);
