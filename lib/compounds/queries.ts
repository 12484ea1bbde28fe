// Read-only compound queries. Every one is scoped by group inside its `where`: another group's compound is not
// found (404), never fetched and then refused.
import { found } from "@/lib/authz/guard";
import { type Db } from "@/lib/db/client";
import { type OutcomeStatus } from "@/generated/prisma/enums";
import { readStoredPKas, type ListCompounds, type StoredPKa } from "./schemas";

export interface CompoundListRow {
  id: string;
  name: string;
  formula: string;
  molarMass: number;
  canonicalSmiles: string;
  crippenLogP: number | null;
  logP: number | null;
  tags: string[];
  workupCount: number;
}

const listSelect = (groupId: string) =>
  ({
    id: true, name: true, formula: true, molarMass: true, canonicalSmiles: true, crippenLogP: true, logP: true, tags: true,
    _count: { select: { components: { where: { groupId } } } },
  }) as const;

export function encodeListCursor(row: { name: string; id: string }): string {
  return Buffer.from(JSON.stringify([row.name, row.id])).toString("base64url");
}

function decodeListCursor(raw: string | undefined): { name: string; id: string } | null {
  if (!raw) return null;
  try {
    const parsed: unknown = JSON.parse(Buffer.from(raw, "base64url").toString("utf8"));
    if (Array.isArray(parsed) && typeof parsed[0] === "string" && typeof parsed[1] === "string") return { name: parsed[0], id: parsed[1] };
  } catch {
    // A hand-edited cursor starts from the first page.
  }
  return null;
}

/** By name, keyset-paginated on (name, id) so a later page costs the same as the first. */
export async function listCompounds(db: Db, groupId: string, options: ListCompounds): Promise<{ rows: CompoundListRow[]; next: string | null }> {
  const after = decodeListCursor(options.after);
  const rows = await db.compound.findMany({
    where: {
      groupId,
      ...(options.tag ? { tags: { has: options.tag } } : {}),
      ...(after ? { OR: [{ name: { gt: after.name } }, { name: after.name, id: { gt: after.id } }] } : {}),
    },
    orderBy: [{ name: "asc" }, { id: "asc" }],
    take: options.limit + 1,
    select: listSelect(groupId),
  });
  const page = rows.slice(0, options.limit).map(({ _count, ...r }) => ({ ...r, workupCount: _count.components }));
  const last = page.at(-1);
  return { rows: page, next: rows.length > options.limit && last ? encodeListCursor(last) : null };
}

export interface CompoundWorkup {
  workupId: string;
  title: string;
  performedOn: Date;
  role: string;
  amountMmol: number;
  status: OutcomeStatus;
  /** Recovered product vs the prediction, percent points; null until an outcome and a prediction exist. */
  deviationPct: number | null;
  flagged: boolean;
  recoveryPct: number | null;
}

/** Every workup of the group that used each compound, newest first (at most `perCompound` each). */
export async function workupsUsing(db: Db, groupId: string, compoundIds: string[], perCompound = 1000): Promise<Map<string, CompoundWorkup[]>> {
  const byCompound = new Map<string, CompoundWorkup[]>(compoundIds.map((id) => [id, []]));
  if (compoundIds.length === 0) return byCompound;
  const rows = await db.workupComponent.findMany({
    where: { groupId, compoundId: { in: compoundIds }, workup: { groupId } },
    orderBy: [{ workup: { performedOn: "desc" } }, { workupId: "asc" }],
    select: {
      compoundId: true, role: true, amountMmol: true,
      workup: { select: { id: true, title: true, performedOn: true, status: true, deviationPct: true, flagged: true, outcome: { select: { recoveryPct: true } } } },
    },
  });
  for (const r of rows) {
    const list = r.compoundId ? byCompound.get(r.compoundId) : undefined;
    if (!list || list.length >= perCompound || list.some((w) => w.workupId === r.workup.id)) continue;
    const w = r.workup;
    list.push({
      workupId: w.id, title: w.title, performedOn: w.performedOn, role: r.role, amountMmol: r.amountMmol, status: w.status,
      deviationPct: w.deviationPct, flagged: w.flagged, recoveryPct: w.outcome?.recoveryPct ?? null,
    });
  }
  return byCompound;
}

export interface CompoundDetail {
  id: string;
  name: string;
  synonyms: string[];
  tags: string[];
  canonicalSmiles: string;
  /** What depictions and site atom indices refer to: the uploaded MOL block, else the canonical SMILES. */
  structureText: string;
  formula: string;
  molarMass: number;
  crippenLogP: number | null;
  tpsa: number | null;
  logP: number | null;
  logPSource: string | null;
  pKas: StoredPKa[];
  notes: string;
  createdAt: Date;
  updatedAt: Date;
}

export async function getCompound(db: Db, groupId: string, id: string): Promise<CompoundDetail> {
  const row = found(
    await db.compound.findFirst({
      where: { id, groupId },
      select: {
        id: true, name: true, synonyms: true, tags: true, canonicalSmiles: true, molfile: true, formula: true, molarMass: true,
        crippenLogP: true, tpsa: true, logP: true, logPSource: true, pKas: true, notes: true, createdAt: true, updatedAt: true,
      },
    }),
    "compound",
  );
  const { molfile, pKas, ...rest } = row;
  return { ...rest, structureText: molfile ?? row.canonicalSmiles, pKas: readStoredPKas(pKas) };
}

/** The group's partition observations for one compound (the compound must be the group's: checked by the caller). */
export async function partitionDataFor(db: Db, groupId: string, compoundId: string) {
  return db.partitionObservation.findMany({
    where: { groupId, compoundId },
    orderBy: [{ solventKey: "asc" }, { createdAt: "desc" }],
    select: {
      id: true, solventKey: true, aqueousPh: true, temperatureC: true, logK: true, logKSe: true, kind: true, bound: true,
      method: true, weight: true, excluded: true, workupId: true, createdAt: true,
    },
  });
}

/** Stored text and site atoms for drawing; null when the compound is not the group's. */
export async function structureForDepiction(db: Db, groupId: string, id: string) {
  const row = await db.compound.findFirst({ where: { id, groupId }, select: { canonicalSmiles: true, molfile: true, updatedAt: true } });
  return row ? { text: row.molfile ?? row.canonicalSmiles, updatedAt: row.updatedAt } : null;
}
