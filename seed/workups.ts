/**
 * Saves the generated demo workups through the same service the editor and the API use (validation, prediction,
 * versions, outcome analysis), so the demo exercises the real path. Each save's interval job (lib/jobs/interval.ts)
 * is run to completion before its outcome is reported, so every outcome is judged against its interval, in order. The reported mass is what a chemist would have
 * weighed by the story (seed/scenario.ts): the product the reaction gave, carried through the written procedure (the
 * engine's point recovery on the scenario's literature values, no Monte Carlo spread), less handling and any mishap.
 */
import type { Db } from "@/lib/db/client";
import { recordFoundCause } from "@/lib/workups/found-cause";
import { drainQueue } from "@/lib/jobs/worker";
import { reportOutcome } from "@/lib/workups/outcome";
import { createWorkup } from "@/lib/workups/service";
import { generateWorkups, type CompoundFacts, type GeneratedWorkup } from "./generate";

/** Mishaps older than this (before the newest workup) have had their cause found at a group meeting. */
const REVIEWED_AFTER_MS = 14 * 24 * 3600 * 1000;

/** Fewer Monte Carlo draws than an interactive save: the demo loads 60 workups on first start. */
const SEED_DRAWS = 200;

export async function seedWorkups(
  db: Db,
  groupId: string,
  users: ReadonlyMap<string, string>,
  compounds: ReadonlyMap<string, CompoundFacts>,
): Promise<GeneratedWorkup[]> {
  const generated = generateWorkups(compounds);
  const newest = Math.max(...generated.map((w) => w.performedOn.getTime()));
  for (const w of generated) {
    const chemistId = users.get(w.chemistEmail) ?? null;
    const actor = { groupId, userId: chemistId ?? [...users.values()][0]! };
    const saved = await createWorkup(db, actor, {
      header: {
        title: w.title,
        performedOn: w.performedOn.toISOString().slice(0, 10),
        chemistId,
        notebookRef: w.notebookRef,
        scaleMmol: w.scaleMmol,
        expectedProductMmol: w.expectedProductMmol,
      },
      spec: w.spec,
      links: Object.entries(w.componentCompoundIds).map(([key, compoundId]) => ({ key, compoundId })),
    }, { draws: SEED_DRAWS });
    await drainQueue(db, { kinds: ["interval"], schedule: false });
    if (!w.outcome) continue;
    const product = w.spec.components.find((c) => c.role === "product")!;
    const procedure = saved.prediction.productRecovery ?? 0;
    const o = w.outcome;
    const productMg = w.expectedProductMmol * product.molarMass * o.reactionYield * procedure * (1 - o.handlingLoss) * (1 - o.mishapLoss);
    const weighedMg = o.method === "weight_only" ? productMg * (1 + o.weighedExcess) : (productMg * 100) / o.purityPct;
    await reportOutcome(db, actor, saved.id, {
      isolatedMassMg: Number(Math.max(0.1, weighedMg).toFixed(1)),
      purityPct: w.outcome.method === "weight_only" ? null : Number(w.outcome.purityPct.toFixed(1)),
      purityMethod: w.outcome.method,
      notes: w.outcome.note,
    });
    // The group meeting has gone through the mishaps of all but the last fortnight and recorded what it found.
    if (w.poor?.kind === "mishap" && newest - w.performedOn.getTime() > REVIEWED_AFTER_MS) {
      await recordFoundCause(db, actor, saved.id, { cause: w.poor.cause, note: `Found at the group meeting: ${w.poor.words}` });
    }
  }
  return generated;
}
