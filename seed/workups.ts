/**
 * Saves the generated demo workups through the same service the editor and the API use (validation, prediction,
 * versions, outcome analysis), so the demo exercises the real path. The reported mass is what a chemist would have
 * weighed: the predicted recovery times the family's outcome factor, at the reported purity.
 */
import type { Db } from "@/lib/db/client";
import { reportOutcome } from "@/lib/workups/outcome";
import { createWorkup } from "@/lib/workups/service";
import { generateWorkups, type CompoundFacts } from "./generate";

/** Fewer Monte Carlo draws than an interactive save: the demo loads 60 workups on first start. */
const SEED_DRAWS = 200;

export async function seedWorkups(
  db: Db,
  groupId: string,
  users: ReadonlyMap<string, string>,
  compounds: ReadonlyMap<string, CompoundFacts>,
): Promise<number> {
  const generated = generateWorkups(compounds);
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
    if (!w.outcome) continue;
    const product = w.spec.components.find((c) => c.role === "product")!;
    const predicted = saved.prediction.productRecovery ?? 0;
    const productMg = w.expectedProductMmol * product.molarMass * predicted * w.outcome.factor;
    const purity = w.outcome.method === "weight_only" ? 100 : w.outcome.purityPct;
    await reportOutcome(db, actor, saved.id, {
      isolatedMassMg: Number(((productMg * 100) / purity).toFixed(1)),
      purityPct: w.outcome.method === "weight_only" ? null : Number(purity.toFixed(1)),
      purityMethod: w.outcome.method,
      notes: w.outcome.note,
    });
  }
  return generated.length;
}
