// Reads for the partition pages and the partition API, scoped by group.
import { resolveLibrary } from "@/lib/chem/library";
import { isHBondDonor, solventLogK } from "@/lib/chem/partition";
import { type PKa } from "@/lib/chem/schema";
import { readStoredPKas } from "@/lib/compounds/schemas";
import { type Db } from "@/lib/db/client";
import { NotFoundError } from "@/lib/errors";
import { groupLibrary } from "@/lib/workups/library";
import { pooledValues } from "./group-values";
import { estimateLabel } from "./overlay";
import { poolHistory, poolObservations, type PooledPoint, type PooledValue } from "./pooled";

export interface PartitionSummaryRow {
  compoundId: string;
  compoundName: string;
  solventKey: string;
  solventName: string;
  pooled: PooledValue;
  excluded: number;
  lastRecorded: Date;
}

/** Every compound × solvent pair of the group with observations, by compound name. */
export async function partitionSummary(db: Db, groupId: string): Promise<PartitionSummaryRow[]> {
  const pairs = await db.partitionObservation.groupBy({
    by: ["compoundId", "solventKey", "excluded"],
    where: { groupId },
    _count: { _all: true },
    _max: { createdAt: true },
  });
  const compoundIds = [...new Set(pairs.map((p) => p.compoundId))];
  if (compoundIds.length === 0) return [];
  const [compounds, pooled, library] = await Promise.all([
    db.compound.findMany({ where: { groupId, id: { in: compoundIds } }, select: { id: true, name: true } }),
    pooledValues(db, groupId, compoundIds),
    groupLibrary(db, groupId),
  ]);
  const solvents = resolveLibrary(library).solvents;
  const names = new Map(compounds.map((c) => [c.id, c.name]));
  const rows = new Map<string, PartitionSummaryRow>();
  for (const p of pairs) {
    const key = `${p.compoundId}\u0000${p.solventKey}`;
    const row = rows.get(key) ?? {
      compoundId: p.compoundId, compoundName: names.get(p.compoundId) ?? "Unknown compound", solventKey: p.solventKey,
      solventName: solvents[p.solventKey]?.name ?? p.solventKey,
      pooled: pooled.get(p.compoundId)?.get(p.solventKey) ?? poolObservations([]), excluded: 0, lastRecorded: new Date(0),
    };
    if (p.excluded) row.excluded += p._count._all;
    if (p._max.createdAt && p._max.createdAt > row.lastRecorded) row.lastRecorded = p._max.createdAt;
    rows.set(key, row);
  }
  return [...rows.values()].sort((a, b) => a.compoundName.localeCompare(b.compoundName) || a.solventName.localeCompare(b.solventName));
}

export interface ObservationRow {
  id: string;
  solventKey: string;
  aqueousPh: number | null;
  temperatureC: number;
  logK: number;
  logKSe: number | null;
  kind: "measured" | "inferred";
  bound: "value" | "lower" | "upper";
  method: string;
  weight: number;
  excluded: boolean;
  outlier: boolean;
  workup: { id: string; title: string } | null;
  createdBy: string | null;
  createdAt: Date;
  details: Record<string, unknown>;
}

export interface SolventPartition {
  solventKey: string;
  solventName: string;
  pooled: PooledValue;
  history: PooledPoint[];
  /**
   * What the engine would use without group data: the Abraham model from the compound's descriptors (measured ones
   * looked up by its structure), else the Collander line from its log P; with the estimate's standard error.
   */
  structureEstimate: { value: number; se: number; origin: "abraham" | "collander"; label: string } | null;
}

export interface CompoundPartition {
  compound: { id: string; name: string; logP: number | null; crippenLogP: number | null; hasAcidSite: boolean };
  observations: ObservationRow[];
  solvents: SolventPartition[];
  /** Water-immiscible solvents of the group's library, for the measurement form. */
  solventChoices: { key: string; name: string }[];
}

export async function compoundPartition(db: Db, groupId: string, compoundId: string): Promise<CompoundPartition> {
  const compound = await db.compound.findFirst({ where: { id: compoundId, groupId }, select: { id: true, name: true, canonicalSmiles: true, logP: true, crippenLogP: true, pKas: true } });
  if (!compound) throw new NotFoundError("compound");
  const [rows, library] = await Promise.all([
    db.partitionObservation.findMany({ where: { groupId, compoundId }, orderBy: [{ createdAt: "desc" }, { id: "desc" }] }),
    groupLibrary(db, groupId),
  ]);
  const workupIds = [...new Set(rows.map((r) => r.workupId).filter((id): id is string => id !== null))];
  const userIds = [...new Set(rows.map((r) => r.createdById).filter((id): id is string => id !== null))];
  const [workups, users] = await Promise.all([
    db.workup.findMany({ where: { groupId, id: { in: workupIds } }, select: { id: true, title: true } }),
    db.user.findMany({ where: { id: { in: userIds }, memberships: { some: { groupId } } }, select: { id: true, name: true } }),
  ]);
  const workupTitle = new Map(workups.map((w) => [w.id, w.title]));
  const userName = new Map(users.map((u) => [u.id, u.name]));
  const solvents = resolveLibrary(library).solvents;
  const keys = [...new Set(rows.map((r) => r.solventKey))].sort((a, b) => (solvents[a]?.name ?? a).localeCompare(solvents[b]?.name ?? b));
  const pooledBySolvent = new Map(keys.map((k) => [k, poolObservations(rows.filter((r) => r.solventKey === k))]));
  const outliers = new Set([...pooledBySolvent.values()].flatMap((p) => p.outliers));
  const pKas: PKa[] = readStoredPKas(compound.pKas).map((p) => ({ value: p.value, kind: p.kind, provenance: p.provenance }));
  const donor = isHBondDonor({ pKas });
  // The compound as the engine would see it: its structure, and its log P (measured/literature, else Crippen's).
  const logP = compound.logP !== null ? { value: compound.logP, provenance: "literature" as const }
    : compound.crippenLogP !== null ? { value: compound.crippenLogP, provenance: "estimated" as const } : undefined;
  const asComponent = { smiles: compound.canonicalSmiles, logK: {}, pKas, ...(logP ? { logP } : {}) };
  return {
    compound: { id: compound.id, name: compound.name, logP: compound.logP, crippenLogP: compound.crippenLogP, hasAcidSite: donor },
    observations: rows.map((r) => ({
      id: r.id, solventKey: r.solventKey, aqueousPh: r.aqueousPh, temperatureC: r.temperatureC, logK: r.logK, logKSe: r.logKSe, kind: r.kind,
      bound: r.bound, method: r.method, weight: r.weight, excluded: r.excluded, outlier: outliers.has(r.id),
      workup: r.workupId ? { id: r.workupId, title: workupTitle.get(r.workupId) ?? "deleted workup" } : null,
      createdBy: r.createdById ? (userName.get(r.createdById) ?? null) : null, createdAt: r.createdAt,
      details: (r.details ?? {}) as Record<string, unknown>,
    })),
    solvents: keys.map((k) => {
      const solvent = solvents[k];
      const estimate = solvent && !solvent.waterMiscible ? solventLogK(asComponent, solvent, solvents) : null;
      return {
        solventKey: k, solventName: solvent?.name ?? k, pooled: pooledBySolvent.get(k) ?? poolObservations([]),
        history: poolHistory(rows.filter((r) => r.solventKey === k)),
        structureEstimate: estimate === null || estimate.origin === "component" ? null
          : { value: estimate.value, se: estimate.se, origin: estimate.origin,
            label: estimate.origin === "abraham" ? estimateLabel(estimate) : `${estimateLabel(estimate)}, ±${estimate.se.toFixed(2)}` },
      };
    }),
    solventChoices: Object.values(solvents).filter((s) => !s.waterMiscible && s.partition).map((s) => ({ key: s.key, name: s.name })).sort((a, b) => a.name.localeCompare(b.name)),
  };
}
