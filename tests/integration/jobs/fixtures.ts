// A compound and workups that use it, written through the real services (no mocks). The lab and its people are
// invented; acetanilide and its properties are real (values and sources in tests/integration/workups/fixtures.ts).
import { simulateWorkup, validateWorkup } from "@/lib/chem/predict";
import { withLogK } from "@/lib/chem/fit";
import { type WorkupInputRaw } from "@/lib/chem/schema";
import { type Db } from "@/lib/db/client";
import { reportOutcome } from "@/lib/workups/outcome";
import { createWorkup } from "@/lib/workups/service";
import { acetanilideSpec, completeIntervals, header, type Lab } from "@/tests/integration/workups/fixtures";

export const ACETANILIDE = { key: "acetanilide", molarMass: 135.17, smiles: "CC(=O)Nc1ccccc1" } as const; // M as in acetanilideSpec

/** Fewer Monte Carlo draws than an interactive save: the tests compare states, not interval edges. */
export const TEST_DRAWS = 60;

export async function makeAcetanilide(db: Db, groupId: string) {
  return db.compound.create({
    data: {
      groupId, name: "Acetanilide", canonicalSmiles: ACETANILIDE.smiles, formula: "C8H9NO", molarMass: ACETANILIDE.molarMass,
      // log P 1.16: PhysProp experimental log Kow (from memory), the value acetanilideSpec carries.
      logP: 1.16, logPSource: "literature: PhysProp experimental log Kow (from memory)", pKas: [],
    },
    select: { id: true },
  });
}

/**
 * Acetanilide from 60 mL water into 2 × 30 mL EtOAc, with a stated log K(EtOAc) of 1.3 ± 0.1 (a value chosen for the
 * test, not from literature): the interval is narrow, so a recovery that a log K near 0.5 gives falls below it
 * without the engine calling the extraction itself dangerous.
 */
export function extractionSpec(): WorkupInputRaw {
  const spec = acetanilideSpec(2);
  const extract = spec.operations[0] as { volume: { value: number; unit: string } };
  extract.volume = { value: 30, unit: "mL" };
  spec.components[0]!.logK = { etoac: { value: 1.3, provenance: "literature", se: 0.1, source: "test value" } };
  return spec;
}

/** The product recovery the engine predicts for extractionSpec() if the neutral log K in EtOAc were `logK`. */
export function recoveryAt(logK: number): number {
  const checked = validateWorkup(extractionSpec());
  if (!checked.success) throw new Error(JSON.stringify(checked.issues));
  return simulateWorkup(withLogK(checked.data, ACETANILIDE.key, "etoac", logK)).recovery[ACETANILIDE.key] ?? NaN;
}

/**
 * A workup extracting 5 mmol acetanilide (assayed before the workup, so the reported recovery is the work-up's own)
 * whose reported qNMR outcome is what the engine gives at `trueLogK`.
 */
export async function workupWithOutcome(db: Db, lab: Lab, compoundId: string | null, trueLogK: number | null, title = "Acetanilide into EtOAc", headerOverrides: Record<string, unknown> = {}) {
  const saved = await createWorkup(db, lab.member, {
    header: header({ title, assayedProductMmol: 5, ...headerOverrides }),
    spec: extractionSpec(),
    links: compoundId ? [{ key: ACETANILIDE.key, compoundId }] : [],
  }, { draws: TEST_DRAWS });
  await completeIntervals(db);
  if (trueLogK !== null) {
    const mg = recoveryAt(trueLogK) * 5 * ACETANILIDE.molarMass;
    await reportOutcome(db, lab.member, saved.id, { isolatedMassMg: mg / 0.99, purityPct: 99, purityMethod: "qnmr" });
  }
  return saved;
}
