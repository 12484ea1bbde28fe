/**
 * One RDKit (MinimalLib, WebAssembly) instance per process or browser tab. The first caller's init function wins;
 * every later caller shares the same promise, so the 7 MB module is fetched and compiled once.
 *
 * Node needs no arguments (`loadRDKit()` imports @rdkit/rdkit, which reads its .wasm from beside itself). A browser
 * bundle passes its own init, e.g. one that calls `window.initRDKitModule({ locateFile: () => "/RDKit_minimal.wasm" })`
 * after loading the script from /public, or `createRDKitInit({ locateFile })`.
 */
import type { MainModule, Mol } from "@rdkit/rdkit";

export type RDKitModule = MainModule;
export type RDKitMol = Mol;
export type RDKitInit = () => Promise<RDKitModule>;

export interface RDKitInitOptions {
  /** Maps "RDKit_minimal.wasm" to the URL or path the runtime should fetch it from. */
  locateFile?: (file: string, scriptDirectory: string) => string;
}

/** An init that imports the npm package; suitable for Node and for bundlers that serve the .wasm themselves. */
export function createRDKitInit(options: RDKitInitOptions = {}): RDKitInit {
  return async () => {
    const factory = (await import("@rdkit/rdkit")).default;
    const rdkit = await factory(options.locateFile ? { locateFile: options.locateFile } : {});
    return rdkit;
  };
}

let pending: Promise<RDKitModule> | undefined;

/** Loads RDKit once; a failed load is forgotten so the next call can retry. */
export function loadRDKit(init: RDKitInit = createRDKitInit()): Promise<RDKitModule> {
  pending ??= init().then(
    (rdkit) => {
      startLogCapture(rdkit);
      return rdkit;
    },
    (error: unknown) => {
      pending = undefined;
      throw error;
    },
  );
  return pending;
}

type LogBuffer = NonNullable<ReturnType<RDKitModule["set_log_capture"]>>;
const logs = new WeakMap<RDKitModule, LogBuffer>();

/** Routes RDKit's messages into a buffer (instead of stderr) so a parse failure can say why it failed. */
function startLogCapture(rdkit: RDKitModule): LogBuffer | undefined {
  let log = logs.get(rdkit);
  if (!log) {
    log = rdkit.set_log_capture("rdApp.*") ?? undefined;
    if (log) logs.set(rdkit, log);
  }
  return log;
}

/** Runs `fn` with an empty log buffer and returns what RDKit logged during it. */
export function withRDKitLog<T>(rdkit: RDKitModule, fn: () => T): { result: T; log: string } {
  const log = startLogCapture(rdkit);
  log?.clear_buffer();
  const result = fn();
  const text = log?.get_buffer() ?? "";
  log?.clear_buffer();
  return { result, log: text };
}

/** Calls `fn` with `mol` and always frees the molecule's WebAssembly memory afterwards. */
export function usingMol<T>(mol: RDKitMol, fn: (mol: RDKitMol) => T): T {
  try {
    return fn(mol);
  } finally {
    mol.delete();
  }
}
