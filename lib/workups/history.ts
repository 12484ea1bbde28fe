// Version history of one workup: who saved each version and when, the snapshot itself, and what changed.
import { type Db } from "@/lib/db/client";
import { NotFoundError } from "@/lib/errors";
import { diffSnapshots, type VersionDiff } from "./diff";
import { type WorkupSnapshot } from "./record";

export interface VersionEntry {
  version: number;
  editedBy: { id: string; name: string } | null;
  createdAt: Date;
  /** Product recovery predicted for this version, fraction 0–1. */
  productRecovery: number | null;
  engineVersion: string | null;
}

async function requireWorkup(db: Db, groupId: string, workupId: string): Promise<void> {
  const found = await db.workup.findFirst({ where: { id: workupId, groupId }, select: { id: true } });
  if (!found) throw new NotFoundError("workup");
}

/**
 * Newest first. `found`: the caller looks this workup up in this group itself and answers its absence (the detail
 * page, in parallel), so it is not looked up twice; the queries stay scoped by group either way.
 */
export async function listVersions(db: Db, groupId: string, workupId: string, options: { found?: boolean } = {}): Promise<VersionEntry[]> {
  if (!options.found) await requireWorkup(db, groupId, workupId);
  const [versions, predictions] = await Promise.all([
    db.workupVersion.findMany({
      where: { workupId, groupId }, orderBy: { version: "desc" },
      select: { version: true, editedById: true, createdAt: true },
    }),
    db.prediction.findMany({
      where: { workupId, groupId }, orderBy: { createdAt: "asc" },
      select: { workupVersion: true, productRecovery: true, engineVersion: true },
    }),
  ]);
  const editorIds = [...new Set(versions.map((v) => v.editedById).filter((id): id is string => id !== null))];
  const editors = new Map(
    (await db.user.findMany({ where: { id: { in: editorIds } }, select: { id: true, name: true } })).map((u) => [u.id, u]),
  );
  const byVersion = new Map(predictions.map((p) => [p.workupVersion, p])); // the latest prediction of each version wins
  return versions.map((v) => ({
    version: v.version,
    editedBy: v.editedById ? (editors.get(v.editedById) ?? null) : null,
    createdAt: v.createdAt,
    productRecovery: byVersion.get(v.version)?.productRecovery ?? null,
    engineVersion: byVersion.get(v.version)?.engineVersion ?? null,
  }));
}

export async function getVersionSnapshot(db: Db, groupId: string, workupId: string, version: number): Promise<WorkupSnapshot> {
  const row = await db.workupVersion.findFirst({ where: { workupId, groupId, version }, select: { snapshot: true } });
  if (!row) throw new NotFoundError("version");
  return row.snapshot as unknown as WorkupSnapshot; // written by persist.ts as a WorkupSnapshot
}

/** What changed from version `from` to version `to` (either order; older first in the result). */
export async function diffVersions(db: Db, groupId: string, workupId: string, from: number, to: number): Promise<VersionDiff> {
  await requireWorkup(db, groupId, workupId);
  const [older, newer] = await Promise.all([
    getVersionSnapshot(db, groupId, workupId, Math.min(from, to)),
    getVersionSnapshot(db, groupId, workupId, Math.max(from, to)),
  ]);
  return diffSnapshots(older, newer);
}
