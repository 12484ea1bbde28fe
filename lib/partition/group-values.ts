/**
 * The group's values a prediction must use: pooled log K per compound and organic solvent from the observations
 * that are not excluded, and the registry's measured or literature properties of each linked compound. Every query
 * is scoped by group.
 */
import { type LogValue, type PKa } from "@/lib/chem/schema";
import { type Db, type DbTransaction } from "@/lib/db/client";
import { parseLogPSource } from "@/lib/compounds/provenance";
import { readStoredPKas } from "@/lib/compounds/schemas";
import { type GroupValues } from "./overlay";
import { poolObservations, type ObservationForPool, type PooledValue } from "./pooled";

type Client = Db | DbTransaction;

const observationSelect = {
  id: true, compoundId: true, solventKey: true, logK: true, logKSe: true, kind: true, bound: true, weight: true, excluded: true, createdAt: true,
} as const;

/** Pooled value per compound and solvent (only pairs with at least one observation that is not excluded). */
export async function pooledValues(db: Client, groupId: string, compoundIds: readonly string[]): Promise<Map<string, Map<string, PooledValue>>> {
  const out = new Map<string, Map<string, PooledValue>>();
  if (compoundIds.length === 0) return out;
  const rows = await db.partitionObservation.findMany({
    where: { groupId, compoundId: { in: [...new Set(compoundIds)] }, excluded: false },
    select: observationSelect,
    orderBy: [{ createdAt: "asc" }, { id: "asc" }],
  });
  const grouped = new Map<string, Map<string, ObservationForPool[]>>();
  for (const r of rows) {
    const bySolvent = grouped.get(r.compoundId) ?? new Map<string, ObservationForPool[]>();
    grouped.set(r.compoundId, bySolvent);
    const list = bySolvent.get(r.solventKey) ?? [];
    bySolvent.set(r.solventKey, list);
    list.push(r);
  }
  for (const [compoundId, bySolvent] of grouped) {
    const pooled = new Map<string, PooledValue>();
    for (const [solvent, list] of bySolvent) pooled.set(solvent, poolObservations(list));
    out.set(compoundId, pooled);
  }
  return out;
}

/** The log K overrides predictions use: compound id → organic solvent key → group value (pairs with an estimate only). */
export async function groupPartitionValues(db: Client, groupId: string, compoundIds: readonly string[]): Promise<Map<string, Record<string, LogValue>>> {
  const pooled = await pooledValues(db, groupId, compoundIds);
  const out = new Map<string, Record<string, LogValue>>();
  for (const [compoundId, bySolvent] of pooled) {
    const values: Record<string, LogValue> = {};
    for (const [solvent, p] of bySolvent) {
      if (p.estimate === null || p.se === null || p.label === null) continue;
      values[solvent] = { value: p.estimate, se: Math.min(5, Math.max(1e-3, p.se)), n: p.n, provenance: "group", source: p.label };
    }
    if (Object.keys(values).length > 0) out.set(compoundId, values);
  }
  return out;
}

function registryLogP(logP: number | null, logPSource: string | null): LogValue | undefined {
  if (logP === null) return undefined;
  const { provenance, source } = parseLogPSource(logPSource);
  return { value: logP, provenance: provenance ?? "literature", ...(source ? { source: source.slice(0, 500) } : {}) };
}

function registryPKas(json: unknown): PKa[] {
  return readStoredPKas(json).map((p) => ({
    value: p.value, kind: p.kind, provenance: p.provenance, ...(p.source ? { source: p.source.slice(0, 500) } : {}), ...(p.se !== undefined ? { se: p.se } : {}),
  }));
}

type Link = { key: string; compoundId: string | null };

/** Group values for several workups' components at once (one pair of queries), by workup id, then component key. */
export async function groupValuesForWorkups(db: Client, groupId: string, workups: readonly { id: string; links: readonly Link[] }[]): Promise<Map<string, GroupValues>> {
  const ids = [...new Set(workups.flatMap((w) => w.links.map((l) => l.compoundId)).filter((id): id is string => id !== null))];
  const out = new Map<string, GroupValues>();
  if (ids.length === 0) {
    for (const w of workups) out.set(w.id, {});
    return out;
  }
  const [compounds, partition] = await Promise.all([
    db.compound.findMany({ where: { groupId, id: { in: ids } }, select: { id: true, logP: true, logPSource: true, pKas: true } }),
    groupPartitionValues(db, groupId, ids),
  ]);
  const byId = new Map(compounds.map((c) => {
    const logP = registryLogP(c.logP, c.logPSource);
    const pKas = registryPKas(c.pKas);
    // A registry entry without sites leaves the spec's own sites alone (someone entered them for this workup).
    return [c.id, { compoundId: c.id, logK: partition.get(c.id) ?? {}, ...(logP ? { logP } : {}), ...(pKas.length > 0 ? { pKas } : {}) }];
  }));
  for (const w of workups) {
    const values: GroupValues = {};
    for (const link of w.links) {
      const v = link.compoundId !== null ? byId.get(link.compoundId) : undefined;
      if (v) values[link.key] = v;
    }
    out.set(w.id, values);
  }
  return out;
}

/** Group values for one workup's components, by component key, from its compound links. */
export async function groupValuesForLinks(db: Client, groupId: string, links: readonly Link[]): Promise<GroupValues> {
  return (await groupValuesForWorkups(db, groupId, [{ id: "", links }])).get("") ?? {};
}
