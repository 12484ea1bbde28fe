/**
 * Keeps a process's index in step with the database when several app instances share one PostgreSQL: before a
 * search, fetch rows whose updatedAt is at or after (watermark − overlap) and apply them. The overlap re-reads a
 * short window because a transaction that started earlier can commit a row with an older updatedAt after a newer one
 * was already seen; re-applying an unchanged row is a no-op. Deleted rows arrive as tombstones (`deleted: true`);
 * for hard deletes the app can call `reconcileGroup` with the ids that still exist.
 */
import { type CompoundSearchIndex, type IndexedCompound } from "./search-index";

export interface CompoundChange<Meta> {
  compound: IndexedCompound & { updatedAt: Date };
  meta?: Meta;
  deleted?: boolean;
}

export interface CompoundChangeFeed<Meta> {
  /** Every row with updatedAt ≥ `since` (every row when `since` is undefined), across all groups. */
  changedSince(since: Date | undefined): Promise<CompoundChange<Meta>[]>;
}

export interface IndexSyncOptions {
  /** How far before the watermark to re-read, ms; default 5000. */
  overlapMs?: number;
}

export class IndexSync<Meta> {
  private inFlight: Promise<number> | undefined;
  private readonly overlapMs: number;
  private since: Date | undefined;

  constructor(
    readonly index: CompoundSearchIndex<Meta>,
    private readonly feed: CompoundChangeFeed<Meta>,
    options: IndexSyncOptions = {},
  ) {
    this.overlapMs = options.overlapMs ?? 5000;
  }

  /** Applies outstanding changes; concurrent callers share one database round trip. Returns rows applied. */
  refresh(): Promise<number> {
    this.inFlight ??= this.pull().finally(() => {
      this.inFlight = undefined;
    });
    return this.inFlight;
  }

  private async pull(): Promise<number> {
    const from = this.since === undefined ? undefined : new Date(this.since.getTime() - this.overlapMs);
    const changes = await this.feed.changedSince(from);
    let newest = this.since?.getTime();
    for (const change of changes) {
      if (change.deleted) this.index.remove(change.compound.id);
      else this.index.upsert(change.compound, change.meta);
      const t = change.compound.updatedAt.getTime();
      if (newest === undefined || t > newest) newest = t;
    }
    if (newest !== undefined) this.since = new Date(newest);
    return changes.length;
  }

  /** Removes index entries of `groupId` whose rows no longer exist (hard deletes made by another instance). */
  reconcileGroup(groupId: string, liveIds: Iterable<string>): number {
    return this.index.retainOnly(groupId, liveIds);
  }
}
