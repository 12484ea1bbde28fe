/**
 * Substructure timings for one data set: the index (own screen + graph matcher) in SMILES-as-query and SMARTS modes,
 * and RDKit's own SubstructLibrary in WebAssembly on the same machine as baseline and as the exactness reference.
 */
import { type KeySet } from "./dataset";
import { nowMs, passStats, round, type Timing } from "./stats";
import { type RDKitModule } from "@/lib/chem/structure/rdkit";
import { CompoundSearchIndex, compileSubstructureQuery, type SubstructureQuery } from "@/lib/search";

export interface SubstructureReport {
  n: number;
  build_ms: number;
  wasm_mb: number;
  graph_mb: number;
  smiles: { first100: Timing; all: Timing; exact: boolean; hits_median: number };
  smarts: { first100: Timing; all: Timing; exact: boolean; hits_median: number };
  rdkit_substruct_library: { first100: Timing; all: Timing; build_ms: number } | null;
}

export function benchSubstructure(rdkit: RDKitModule, keys: KeySet, queries: [string, string][], options: { passes: number; baseline: boolean; log: (m: string) => void }): SubstructureReport {
  const { graphs } = keys;
  if (!graphs) throw new Error("substructure keys missing");
  const t0 = nowMs();
  const index = new CompoundSearchIndex();
  keys.records.forEach((r, i) =>
    index.upsert({
      id: r.id,
      groupId: "bench",
      morganFingerprint: keys.morgan.subarray(i * 256, i * 256 + 256),
      searchGraph: graphs[i],
      canonicalSmiles: r.smiles,
    }),
  );
  const buildMs = nowMs() - t0;

  let library: ReturnType<typeof buildLibrary> | null = null;
  if (options.baseline) library = buildLibrary(rdkit, keys);

  const run = (mode: "smiles" | "smarts") => {
    const compiled = queries.map(([, text]) => compileSubstructureQuery(rdkit, text, mode));
    const first100 = passStats(compiled, (q) => index.substructure("bench", q, { limit: 100 }), options.passes);
    const all = passStats(compiled, (q) => index.substructure("bench", q), options.passes);
    const hitCounts = compiled.map((q) => index.substructure("bench", q).hits.length).sort((a, b) => a - b);
    let exact = true;
    if (library) {
      compiled.forEach((q, i) => {
        const ours = index.substructure("bench", q).hits.map((h) => h.id);
        const theirs = library?.matches(queries[i]?.[1] ?? "", mode, 1e9) ?? [];
        if (ours.length !== theirs.length || ours.some((id, k) => id !== theirs[k])) {
          exact = false;
          options.log(`  MISMATCH ${mode} ${queries[i]?.[0] ?? ""}: ${ours.length} vs RDKit ${theirs.length}`);
        }
      });
    }
    compiled.forEach((q: SubstructureQuery) => q.dispose());
    return { first100, all, exact, hits_median: hitCounts[hitCounts.length >> 1] ?? 0 };
  };
  const smiles = run("smiles");
  const smarts = run("smarts");
  let baseline: SubstructureReport["rdkit_substruct_library"] = null;
  if (library) {
    const lib = library;
    const texts = queries.map(([, t]) => t);
    baseline = {
      first100: passStats(texts, (t) => lib.matches(t, "smiles", 100), options.passes),
      all: passStats(texts, (t) => lib.matches(t, "smiles", 1e9), options.passes),
      build_ms: round(lib.buildMs, 1),
    };
    lib.dispose();
  }
  const usage = index.memoryUsage();
  return {
    n: keys.records.length,
    build_ms: round(buildMs, 1),
    wasm_mb: round(usage.wasmBytes / 1e6, 1),
    graph_mb: round(usage.graphBytes / 1e6, 1),
    smiles,
    smarts,
    rdkit_substruct_library: baseline,
  };
}

/** RDKit SubstructLibrary over trusted SMILES with its own 2048-bit pattern fingerprints; ids sorted like ours. */
function buildLibrary(rdkit: RDKitModule, keys: KeySet) {
  const t0 = nowMs();
  const lib = new rdkit.SubstructLibrary(2048);
  keys.records.forEach((r) => lib.add_trusted_smiles(r.smiles));
  const buildMs = nowMs() - t0;
  const ids = keys.records.map((r) => r.id);
  return {
    buildMs,
    matches(text: string, mode: "smiles" | "smarts", limit: number): string[] {
      const q = mode === "smiles" ? rdkit.get_mol(text) : rdkit.get_qmol(text);
      if (!q) throw new Error(`RDKit cannot parse ${text}`);
      try {
        const found = lib.get_matches_as_uint32array(q, false, 1, limit) as Uint32Array;
        return Array.from(found, (i) => ids[i] ?? "").sort();
      } finally {
        q.delete();
      }
    },
    dispose: () => lib.delete(),
  };
}
