// The group's editable copy of the solvent and aqueous-reagent library, handed to the engine as overrides of the
// shipped tables (lib/chem/library.ts replaces or adds entries by key).
//
// Every page and engine run needs it, and it changes rarely, so each instance keeps the last copy per group with the
// group's library stamp (Group.libraryVersion). A database trigger raises the stamp in the same transaction as any
// change to the group's rows, whichever instance or tool writes them, so one small read of the stamp tells whether
// the copy is current. The copy is shared between requests: callers treat it as read-only.
import { type LibraryOverrides } from "@/lib/chem/library";
import { type SolventProps } from "@/lib/chem/data/solvents";
import { type ReagentProps } from "@/lib/chem/data/reagents";
import { type Client } from "./context";

/** Groups whose library one instance keeps (least recently used dropped first). */
const CACHED_GROUPS = 256;

const cache = new Map<string, { version: number; overrides: LibraryOverrides }>();

async function libraryVersion(db: Client, groupId: string): Promise<number | null> {
  const rows = await db.$queryRaw<{ libraryVersion: number }[]>`SELECT "libraryVersion" FROM "Group" WHERE "id" = ${groupId}`;
  return rows[0]?.libraryVersion ?? null;
}

async function loadLibrary(db: Client, groupId: string): Promise<LibraryOverrides> {
  const [solvents, reagents] = await Promise.all([
    db.solvent.findMany({ where: { groupId }, select: { key: true, props: true } }),
    db.aqueousReagent.findMany({ where: { groupId }, select: { key: true, props: true } }),
  ]);
  // The props columns hold the engine's own record types, written through the library editor's schema.
  return {
    ...(solvents.length > 0
      ? { solvents: Object.fromEntries(solvents.map((s) => [s.key, { ...(s.props as unknown as SolventProps), key: s.key }])) }
      : {}),
    ...(reagents.length > 0
      ? { reagents: Object.fromEntries(reagents.map((r) => [r.key, { ...(r.props as unknown as ReagentProps), key: r.key }])) }
      : {}),
  };
}

/**
 * An interactive transaction's client, whose reads may yet roll back. Prisma leaves $connect off that client (it
 * keeps $transaction, for nested transactions).
 */
const inTransaction = (db: Client) => typeof (db as { $connect?: unknown }).$connect !== "function";

export async function groupLibrary(db: Client, groupId: string): Promise<LibraryOverrides> {
  if (inTransaction(db)) return loadLibrary(db, groupId);
  const version = await libraryVersion(db, groupId);
  const hit = cache.get(groupId);
  if (hit && version !== null && hit.version === version) {
    cache.delete(groupId); // re-inserted below: Map order is the recency order
    cache.set(groupId, hit);
    return hit.overrides;
  }
  const overrides = await loadLibrary(db, groupId);
  if (version === null) return overrides; // no such group: nothing to keep
  // The rows were read after the stamp: if a change slipped in between, the copy is newer than its stamp and the
  // next read reloads it once; it is never older than its stamp.
  cache.delete(groupId);
  cache.set(groupId, { version, overrides });
  if (cache.size > CACHED_GROUPS) cache.delete(cache.keys().next().value as string);
  return overrides;
}
