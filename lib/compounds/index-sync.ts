/**
 * Keeps this process's in-memory search index (lib/search) in step with the database, one group at a time, when
 * several app instances share one PostgreSQL. Before each structure search the group is brought up to date:
 *
 * - First search of a group in this process: load all its compounds.
 * - Later searches: one REPEATABLE READ snapshot reads the database clock W, the group's compounds with
 *   updatedAt ≥ (previous W − window) and deletion tombstones (AuditEvent "compound.delete") from the same window.
 *   Compound writes are stamped with the database's transaction start time (clock.ts) and may stay open at most
 *   WRITE_TIMEOUT_MS, so a row not yet committed at the previous read carries a stamp later than (previous W −
 *   window): a compound registered through any instance is found by the next search on every other. Re-reading
 *   the window is idempotent.
 * - Every `countCheckMs` the group's row count is compared with the index; a difference (rows written or deleted
 *   outside this module, e.g. by a script with its own clock) reloads the group.
 *
 * The same SQL runs on PGlite and PostgreSQL, so both behave identically.
 */
import { searchKeys, StructureError, type RDKitModule } from "@/lib/chem/structure";
import { type CompoundSearchIndex } from "@/lib/search";
import { type Db } from "@/lib/db/client";
import { WRITE_TIMEOUT_MS } from "./clock";
import { COMPOUND_DELETED } from "./edits";

export interface IndexSyncOptions {
  /** How far before the previous read to look again, ms; default WRITE_TIMEOUT_MS + 10 s of slack. */
  windowMs?: number;
  /** How often the group's row count is compared with the index, ms; default 60 s (0: on every search). */
  countCheckMs?: number;
}

interface GroupState {
  /** Database clock at the last completed read. */
  readAt: Date;
  /** Database clock at the last count comparison. */
  countedAt: Date;
  /** canonicalSmiles per indexed id: keys are recomputed only when the structure changed. */
  structures: Map<string, string>;
  /** Rows whose stored SMILES RDKit no longer reads (written by other code); counted so they do not force reloads. */
  unreadable: Set<string>;
}

const row = { id: true, canonicalSmiles: true, fingerprint: true } as const;
type Row = { id: string; canonicalSmiles: string; fingerprint: Uint8Array | null };

/** Rows whose keys RDKit computes between yields to the event loop, so a large first load does not stall requests. */
const KEYS_PER_SLICE = 250;

export class GroupIndexSync {
  private readonly groups = new Map<string, GroupState>();
  private readonly flights = new Map<string, { running: Promise<void>; queued?: Promise<void> }>();
  private readonly windowMs: number;
  private readonly countCheckMs: number;

  constructor(
    private readonly index: CompoundSearchIndex,
    private readonly rdkit: () => Promise<RDKitModule>,
    options: IndexSyncOptions = {},
  ) {
    this.windowMs = options.windowMs ?? WRITE_TIMEOUT_MS + 10_000;
    this.countCheckMs = options.countCheckMs ?? 60_000;
  }

  /**
   * Brings one group up to date. A caller arriving while a read is in flight cannot use that read (its snapshot may
   * predate the caller's request), so it waits for one follow-up read, shared by everyone who arrived meanwhile.
   */
  refresh(db: Db, groupId: string): Promise<void> {
    const flight = this.flights.get(groupId);
    if (!flight) return this.start(db, groupId);
    flight.queued ??= flight.running.catch(() => undefined).then(() => this.start(db, groupId));
    return flight.queued;
  }

  private start(db: Db, groupId: string): Promise<void> {
    const running: Promise<void> = this.pull(db, groupId).finally(() => {
      const flight = this.flights.get(groupId);
      if (flight?.running === running && !flight.queued) this.flights.delete(groupId);
    });
    this.flights.set(groupId, { running });
    return running;
  }

  private async pull(db: Db, groupId: string): Promise<void> {
    const state = this.groups.get(groupId);
    if (!state) return this.load(db, groupId);
    const since = new Date(state.readAt.getTime() - this.windowMs);
    const countDue = Date.now() - state.countedAt.getTime() >= this.countCheckMs;
    const [clock, changed, tombstones, count] = await db.$transaction(
      [
        db.$queryRaw<{ now: Date }[]>`SELECT now() AS now`,
        db.compound.findMany({ where: { groupId, updatedAt: { gte: since } }, select: row }),
        db.auditEvent.findMany({ where: { groupId, action: COMPOUND_DELETED, createdAt: { gte: since } }, select: { entityId: true } }),
        countDue ? db.compound.count({ where: { groupId } }) : db.$queryRaw<{ skipped: number }[]>`SELECT 0 AS skipped`,
      ],
      { isolationLevel: "RepeatableRead" },
    );
    for (const t of tombstones) {
      if (!t.entityId) continue;
      state.unreadable.delete(t.entityId);
      if (state.structures.delete(t.entityId)) this.index.remove(t.entityId);
    }
    await this.apply(groupId, state, changed);
    const readAt = clock[0]?.now ?? state.readAt;
    state.readAt = readAt;
    if (typeof count === "number") {
      state.countedAt = readAt;
      if (count !== this.index.groupSize(groupId) + state.unreadable.size) await this.load(db, groupId);
    }
  }

  /** Loads (or reloads) a whole group; entries whose structure is already indexed keep their keys. */
  private async load(db: Db, groupId: string): Promise<void> {
    const [clock, rows] = await db.$transaction(
      [db.$queryRaw<{ now: Date }[]>`SELECT now() AS now`, db.compound.findMany({ where: { groupId }, select: row, orderBy: { id: "asc" } })],
      { isolationLevel: "RepeatableRead" },
    );
    const readAt = clock[0]?.now ?? new Date(0);
    const state = this.groups.get(groupId) ?? { readAt, countedAt: readAt, structures: new Map<string, string>(), unreadable: new Set<string>() };
    const live = new Set(rows.map((r) => r.id));
    for (const id of state.structures.keys()) if (!live.has(id)) state.structures.delete(id);
    state.unreadable.clear();
    this.index.retainOnly(groupId, live);
    await this.apply(groupId, state, rows);
    state.readAt = readAt;
    state.countedAt = readAt;
    this.groups.set(groupId, state);
  }

  private async apply(groupId: string, state: GroupState, rows: Row[]): Promise<void> {
    const fresh = rows.filter((r) => state.structures.get(r.id) !== r.canonicalSmiles || !this.index.has(r.id));
    if (fresh.length === 0) return;
    const rdkit = await this.rdkit();
    for (let start = 0; start < fresh.length; start += KEYS_PER_SLICE) {
      if (start > 0) await new Promise((resolve) => setImmediate(resolve));
      for (const r of fresh.slice(start, start + KEYS_PER_SLICE)) {
        const keys = keysOf(rdkit, r.canonicalSmiles);
        if (!keys) {
          state.unreadable.add(r.id);
          continue;
        }
        this.index.upsert({
          id: r.id, groupId, canonicalSmiles: r.canonicalSmiles,
          // The stored fingerprint is what registration computed; older rows without one get it from the structure.
          morganFingerprint: r.fingerprint?.length === keys.morganFingerprint.length ? new Uint8Array(r.fingerprint) : keys.morganFingerprint,
          patternFingerprint: keys.patternFingerprint,
          searchGraph: keys.searchGraph,
        });
        state.structures.set(r.id, r.canonicalSmiles);
      }
    }
  }

  /** For tests and diagnostics: the indexed ids of a group. */
  indexedIds(groupId: string): string[] {
    return [...(this.groups.get(groupId)?.structures.keys() ?? [])].sort();
  }
}

function keysOf(rdkit: RDKitModule, smiles: string) {
  try {
    return searchKeys(rdkit, smiles);
  } catch (error) {
    if (error instanceof StructureError) return undefined;
    throw error;
  }
}
