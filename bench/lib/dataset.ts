/**
 * Benchmark data: shared/bench SMILES sets with their search keys computed once by RDKit and cached as binary files
 * under .tmp/bench-cache (git-ignored), so re-runs skip the minutes of parsing.
 */
import { createReadStream, createWriteStream, existsSync, mkdirSync, readFileSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";
import { pipeline } from "node:stream/promises";
import { createGunzip } from "node:zlib";
import { morganFingerprint, patternFingerprint } from "@/lib/chem/structure/fingerprint";
import { type RDKitModule } from "@/lib/chem/structure/rdkit";
import { parseRDKitJson } from "@/lib/chem/structure/rdkit-json";
import { encodeSearchGraph } from "@/lib/chem/structure/search-graph";

export const BENCH_DIR = process.env.LAYERWISE_BENCH_DIR ?? "/work/shared/bench";
const ROOT = path.resolve(import.meta.dirname, "../..");
export const CACHE_DIR = path.join(ROOT, ".tmp/bench-cache");
const CACHE_VERSION = 1;

export interface SmilesRecord {
  id: string;
  smiles: string;
}

export function readSmi(file: string): SmilesRecord[] {
  return readFileSync(file, "utf8")
    .split("\n")
    .filter((l) => l.trim())
    .map((l) => {
      const [smiles = "", id = ""] = l.trim().split(/\s+/);
      return { id, smiles };
    });
}

/** Path of a data set's .smi file; the 1M set is gunzipped once into .tmp. */
export async function datasetFile(name: "10k" | "100k" | "1m"): Promise<string> {
  if (name !== "1m") return path.join(BENCH_DIR, `compounds-${name}.smi`);
  const out = path.join(CACHE_DIR, "compounds-1m.smi");
  if (!existsSync(out)) {
    mkdirSync(CACHE_DIR, { recursive: true });
    await pipeline(createReadStream(path.join(BENCH_DIR, "compounds-1m.smi.gz")), createGunzip(), createWriteStream(`${out}.part`));
    const { renameSync } = await import("node:fs");
    renameSync(`${out}.part`, out);
  }
  return out;
}

export interface KeySet {
  records: SmilesRecord[];
  morgan: Uint8Array;
  pattern?: Uint8Array;
  graphs?: Uint8Array[];
}

/** Morgan (and optionally pattern + graph) keys for every record, from cache or computed with RDKit. */
export function loadKeys(rdkit: RDKitModule, name: string, records: SmilesRecord[], withSubstructure: boolean, log: (m: string) => void): KeySet {
  mkdirSync(CACHE_DIR, { recursive: true });
  const base = path.join(CACHE_DIR, `${name}.v${CACHE_VERSION}`);
  const n = records.length;
  const morganFile = `${base}.morgan.bin`;
  const patternFile = `${base}.pattern.bin`;
  const graphFile = `${base}.graph.bin`;
  const graphIndex = `${base}.graph.idx`;
  const haveMorgan = existsSync(morganFile) && statSync(morganFile).size === n * 256;
  const haveSub = existsSync(patternFile) && existsSync(graphFile) && existsSync(graphIndex) && statSync(patternFile).size === n * 256;
  if (haveMorgan && (!withSubstructure || haveSub)) {
    const keys: KeySet = { records, morgan: new Uint8Array(readFileSync(morganFile)) };
    if (withSubstructure) {
      keys.pattern = new Uint8Array(readFileSync(patternFile));
      const blob = new Uint8Array(readFileSync(graphFile));
      const offsets = new Uint32Array(new Uint8Array(readFileSync(graphIndex)).buffer);
      keys.graphs = Array.from({ length: n }, (_, i) => blob.subarray(offsets[i] ?? 0, offsets[i + 1] ?? 0));
    }
    return keys;
  }
  log(`computing keys for ${name} (${n} structures; cached afterwards in ${CACHE_DIR})`);
  const morgan = new Uint8Array(n * 256);
  const pattern = withSubstructure ? new Uint8Array(n * 256) : undefined;
  const graphs: Uint8Array[] = [];
  const t0 = Date.now();
  records.forEach((r, i) => {
    const mol = rdkit.get_mol(r.smiles);
    if (!mol) throw new Error(`RDKit cannot parse ${r.id} ${r.smiles}`);
    try {
      morgan.set(morganFingerprint(mol), i * 256);
      if (pattern) {
        pattern.set(patternFingerprint(mol), i * 256);
        graphs.push(encodeSearchGraph(parseRDKitJson(mol.get_json())));
      }
    } finally {
      mol.delete();
    }
    if (i % 50_000 === 49_999) log(`  ${i + 1} / ${n} (${((Date.now() - t0) / 1000).toFixed(0)} s)`);
  });
  writeFileSync(morganFile, morgan);
  if (pattern) {
    writeFileSync(patternFile, pattern);
    const offsets = new Uint32Array(n + 1);
    graphs.forEach((g, i) => (offsets[i + 1] = (offsets[i] ?? 0) + g.length));
    const blob = new Uint8Array(offsets[n] ?? 0);
    graphs.forEach((g, i) => blob.set(g, offsets[i] ?? 0));
    writeFileSync(graphFile, blob);
    writeFileSync(graphIndex, new Uint8Array(offsets.buffer));
  }
  return { records, morgan, pattern, graphs: pattern ? graphs : undefined };
}
