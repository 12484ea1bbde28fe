/**
 * Keeps the inferred observations in step with the workups' outcomes: for each workup, the product's log K is fitted
 * from the reported recovery (inferred.ts decides whether the record can carry it) and stored as an inferred
 * observation of the linked compound, replacing the one from an earlier version. A lead's exclusion survives the
 * replacement. Fits run outside transactions; writes for a batch go in the caller's transaction.
 */
import { type Prisma } from "@/generated/prisma/client";
import { simulateWorkup } from "@/lib/chem/predict";
import { type Db, type DbTransaction } from "@/lib/db/client";
import { type OutcomeAnalysis } from "@/lib/workups/analysis";
import { groupLibrary } from "@/lib/workups/library";
import { parseSpec, type StoredPredictionResult } from "@/lib/workups/prediction";
import { productOf } from "@/lib/workups/record";
import { groupValuesForWorkups } from "./group-values";
import { inferFromOutcome, type Inference } from "./inferred";
import { applyGroupValues } from "./overlay";

export const INFERRED_METHOD = "Inverse fit of a workup";

export interface InferencePlan {
  workupId: string;
  compoundId: string | null;
  temperatureC: number;
  inference: Inference | null;
  details: Record<string, unknown>;
}

const yieldToEventLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

export async function planInferences(db: Db, groupId: string, workupIds: readonly string[]): Promise<InferencePlan[]> {
  const library = await groupLibrary(db, groupId);
  const workups = await db.workup.findMany({
    where: { groupId, id: { in: [...workupIds] } },
    orderBy: { id: "asc" },
    select: {
      id: true, version: true, spec: true,
      components: { where: { groupId }, select: { key: true, compoundId: true } },
      outcome: { select: { purityMethod: true, analysis: true } },
      predictions: { orderBy: [{ workupVersion: "desc" }, { createdAt: "desc" }], take: 1, select: { result: true } },
    },
  });
  const values = await groupValuesForWorkups(db, groupId, workups.map((w) => ({ id: w.id, links: w.components })));
  const simulate: Parameters<typeof inferFromOutcome>[1] = (input, options) => simulateWorkup(input, { ...library, ...options });
  const plans: InferencePlan[] = [];
  for (const w of workups) {
    await yieldToEventLoop();
    const analysis = w.outcome?.analysis as Partial<OutcomeAnalysis> | undefined;
    let spec;
    try {
      spec = applyGroupValues(parseSpec(w.spec, library, "spec", true), values.get(w.id));
    } catch {
      plans.push({ workupId: w.id, compoundId: null, temperatureC: 25, inference: null, details: {} });
      continue;
    }
    const product = productOf(spec, analysis?.productKey ?? null);
    const compoundId = product ? (w.components.find((c) => c.key === product.key)?.compoundId ?? null) : null;
    const reported = analysis?.reported;
    if (!w.outcome || !product || !compoundId || !reported) {
      plans.push({ workupId: w.id, compoundId, temperatureC: spec.temperatureC, inference: null, details: {} });
      continue;
    }
    const flags = ((w.predictions[0]?.result as Partial<StoredPredictionResult> | undefined)?.prediction?.flags ?? []);
    const inference = inferFromOutcome({ spec, productKey: product.key, recovery: reported.recovery, basis: reported.basis, purityMethod: w.outcome.purityMethod, flags }, simulate);
    const fit = inference.fit;
    plans.push({
      workupId: w.id, compoundId, temperatureC: spec.temperatureC, inference,
      details: {
        workupVersion: w.version, component: product.key, recovery: reported.recovery, basis: reported.basis, purityMethod: w.outcome.purityMethod,
        reason: inference.reason, ...(fit ? { fitKind: fit.kind, interval: fit.interval ?? null, logD: fit.logD ?? null, step: fit.step ?? null } : {}),
      },
    });
  }
  return plans;
}

const close = (a: number | null, b: number | null) => (a === null || b === null ? a === b : Math.abs(a - b) < 1e-6);

/** Writes the plans; returns the compounds whose observations changed (their pooled values may have moved). */
export async function applyInferences(tx: DbTransaction, groupId: string, plans: readonly InferencePlan[]): Promise<string[]> {
  if (plans.length === 0) return [];
  const existing = await tx.partitionObservation.findMany({
    where: { groupId, kind: "inferred", workupId: { in: plans.map((p) => p.workupId) } },
    select: { id: true, workupId: true, compoundId: true, solventKey: true, logK: true, logKSe: true, bound: true, excluded: true },
  });
  const changed = new Set<string>();
  for (const plan of plans) {
    const old = existing.filter((o) => o.workupId === plan.workupId);
    const inf = plan.inference?.use ? plan.inference : null;
    const wanted = inf && plan.compoundId ? { compoundId: plan.compoundId, solventKey: inf.solvent, logK: inf.logK, logKSe: inf.se, bound: inf.bound } : null;
    const same = wanted && old.length === 1 && old[0] && old[0].compoundId === wanted.compoundId && old[0].solventKey === wanted.solventKey
      && old[0].bound === wanted.bound && close(old[0].logK, wanted.logK) && close(old[0].logKSe, wanted.logKSe);
    if (same || (!wanted && old.length === 0)) continue;
    old.forEach((o) => changed.add(o.compoundId));
    if (old.length > 0) await tx.partitionObservation.deleteMany({ where: { groupId, id: { in: old.map((o) => o.id) } } });
    if (!wanted || !inf) continue;
    changed.add(wanted.compoundId);
    const keptExclusion = old.some((o) => o.excluded && o.compoundId === wanted.compoundId && o.solventKey === wanted.solventKey);
    await tx.partitionObservation.create({
      data: {
        groupId, compoundId: wanted.compoundId, solventKey: wanted.solventKey, aqueousPh: inf.fit.pH ?? null, temperatureC: plan.temperatureC,
        logK: wanted.logK, logKSe: wanted.logKSe, kind: "inferred", bound: wanted.bound, method: INFERRED_METHOD, weight: inf.weight,
        excluded: keptExclusion, workupId: plan.workupId, details: JSON.parse(JSON.stringify(plan.details)) as Prisma.InputJsonObject,
      },
      select: { id: true },
    });
  }
  return [...changed];
}

/** Drops inferred observations whose workup has been deleted; returns the compounds affected. */
export async function dropOrphanInferences(tx: DbTransaction, groupId: string): Promise<string[]> {
  const orphans = await tx.$queryRaw<{ id: string; compoundId: string }[]>`
    SELECT o.id, o."compoundId" FROM "PartitionObservation" o
     WHERE o."groupId" = ${groupId} AND o.kind = 'inferred' AND o."workupId" IS NOT NULL
       AND NOT EXISTS (SELECT 1 FROM "Workup" w WHERE w.id = o."workupId" AND w."groupId" = o."groupId")`;
  if (orphans.length === 0) return [];
  await tx.partitionObservation.deleteMany({ where: { groupId, id: { in: orphans.map((o) => o.id) } } });
  return [...new Set(orphans.map((o) => o.compoundId))];
}
