/**
 * Data for the latency benchmark (bench/latency.bench.ts): a fresh embedded database with one group, one lead, the
 * 10k-compound set of the shared benchmark data registered through the data layer (the app's own registration, so the
 * search index sees them exactly as it would after an import), and a few saved workups to edit and report on.
 *
 *   npx tsx bench/latency-prepare.ts <data dir under .tmp/>      (about a minute; run by the benchmark when missing)
 */
import fs from "node:fs";
import path from "node:path";
import { hashPassword } from "@/lib/auth/password";
import { loadRDKit } from "@/lib/chem/structure/rdkit";
import { registerCompounds } from "@/lib/compounds/service";
import { MAX_REGISTER_RECORDS } from "@/lib/compounds/schemas";
import { createDb } from "@/lib/db/client";
import { createWorkup } from "@/lib/workups/service";
import { BENCH_DIR } from "./lib/dataset";

export const BENCH_PERSON = { name: "Ilse Vandermeer", email: "ilse.vandermeer@example.org", password: "latency-bench-Quartz-41" };
export const BENCH_WORKUPS = 5;

const dataDir = process.argv[2] ?? "";
if (!dataDir.includes(`${path.sep}.tmp${path.sep}`)) throw new Error(`Refusing to prepare ${dataDir}: not a folder under .tmp/`);
fs.rmSync(dataDir, { recursive: true, force: true });

// Ethyl 4-nitrobenzoate (C9H9NO4, 195.17 g/mol from standard atomic weights; log P 2.3, PhysProp, from memory).
const spec = (i: number) => ({
  components: [{ key: "ester", name: "Ethyl 4-nitrobenzoate", role: "product", molarMass: 195.17, amount: { value: 5, unit: "mmol" },
    logP: { value: 2.3, provenance: "literature", source: "PhysProp (from memory)" }, pKas: [] }],
  mixture: { solvents: [{ solvent: "etoac", volume: { value: 30 + i, unit: "mL" } }] },
  operations: [
    { type: "wash", reagent: "nahco3_sat", volume: { value: 20, unit: "mL" }, portions: 2 },
    { type: "wash", reagent: "brine", volume: { value: 20, unit: "mL" } },
    { type: "dry", agent: "mgso4" },
    { type: "concentrate" },
  ],
});

const { db, close } = await createDb({ url: `pglite:${dataDir}` });
let exitCode = 0;
try {
  const group = await db.group.create({ data: { name: "Latency Bench Lab", slug: "latency-bench" } });
  const user = await db.user.create({ data: { name: BENCH_PERSON.name, email: BENCH_PERSON.email, passwordHash: await hashPassword(BENCH_PERSON.password) } });
  await db.membership.create({ data: { groupId: group.id, userId: user.id, role: "lead" } });
  const lines = fs.readFileSync(path.join(BENCH_DIR, "compounds-10k.smi"), "utf8").split("\n").filter((l) => l.trim());
  const rdkit = await loadRDKit();
  const actor = { groupId: group.id, userId: user.id };
  for (let i = 0; i < lines.length; i += MAX_REGISTER_RECORDS) {
    const text = lines.slice(i, i + MAX_REGISTER_RECORDS).join("\n");
    await registerCompounds(db, actor, { format: "smiles", text, tags: [], onDuplicate: "skip" }, rdkit);
    process.stderr.write(`registered ${Math.min(i + MAX_REGISTER_RECORDS, lines.length)} of ${lines.length}\n`);
  }
  const member = { groupId: group.id, userId: user.id };
  for (let i = 0; i < BENCH_WORKUPS; i++) {
    await createWorkup(db, member, {
      header: { title: `Nitro ester washes ${i + 1}`, performedOn: "2026-11-03", notebookRef: `LB-${100 + i}`, scaleMmol: 5, expectedProductMmol: 5 },
      spec: spec(i),
    });
  }
  console.log(`latency bench database ready in ${dataDir}: ${await db.compound.count()} compounds, ${BENCH_WORKUPS} workups`);
} catch (e) {
  console.error(e);
  exitCode = 1;
} finally {
  await close();
}
// Closing PGlite resets process.exitCode (emscripten exit), so exit explicitly.
process.exit(exitCode);
