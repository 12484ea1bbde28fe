// Search over a group's compounds: similarity (exact top-k Tanimoto on the Morgan fingerprint), substructure (SMILES
// or SMARTS, fingerprint-screened) on this process's in-memory index, kept current by index-sync.ts; text (name,
// synonyms, tags) in the database. Hits come back with their summaries and the workups that used them.
import { Prisma } from "@/generated/prisma/client";
import { loadRDKit, morganFingerprint, readStructure, StructureError, usingMol, type RDKitModule } from "@/lib/chem/structure";
import { CompoundSearchIndex, compileSubstructureQuery } from "@/lib/search";
import { type Db } from "@/lib/db/client";
import { ValidationError } from "@/lib/errors";
import { GroupIndexSync, type IndexSyncOptions } from "./index-sync";
import { workupsUsing, type CompoundWorkup } from "./queries";
import { type SearchQuery } from "./schemas";

export interface SearchHit {
  id: string;
  name: string;
  formula: string;
  canonicalSmiles: string;
  tags: string[];
  synonyms: string[];
  /** Tanimoto similarity to the query (similarity search only). */
  similarity?: number;
  /** Most recent first, at most WORKUPS_PER_HIT. */
  workups: CompoundWorkup[];
  workupCount: number;
}

export interface SearchResult {
  mode: SearchQuery["mode"];
  hits: SearchHit[];
  /** More hits exist beyond the limit (substructure and text). */
  more: boolean;
}

export const WORKUPS_PER_HIT = 5;

export class CompoundSearchService {
  private readonly index = new CompoundSearchIndex();
  private readonly sync: GroupIndexSync;

  constructor(options: IndexSyncOptions & { rdkit?: () => Promise<RDKitModule> } = {}) {
    this.sync = new GroupIndexSync(this.index, options.rdkit ?? (() => loadRDKit()), options);
  }

  /** Ranked ids only, without summaries (for tests and the API's compact form). */
  async searchIds(db: Db, groupId: string, query: SearchQuery): Promise<{ ids: { id: string; similarity?: number }[]; more: boolean }> {
    if (query.mode === "text") return textSearch(db, groupId, query.query, query.limit);
    const rdkit = await loadRDKit();
    await this.sync.refresh(db, groupId);
    if (query.mode === "similarity") {
      const fingerprint = asQueryError(() => usingMol(readStructure(rdkit, query.query), morganFingerprint));
      const hits = this.index.similar(groupId, fingerprint, { k: query.topK, threshold: query.threshold });
      return { ids: hits.map((h) => ({ id: h.id, similarity: h.score })), more: false };
    }
    const compiled = asQueryError(() => compileSubstructureQuery(rdkit, query.query, query.queryType));
    try {
      const result = this.index.substructure(groupId, compiled, { limit: query.limit });
      return { ids: result.hits.map((h) => ({ id: h.id })), more: result.more };
    } finally {
      compiled.dispose();
    }
  }

  async search(db: Db, groupId: string, query: SearchQuery): Promise<SearchResult> {
    const { ids, more } = await this.searchIds(db, groupId, query);
    return { mode: query.mode, hits: await summaries(db, groupId, ids), more };
  }

  /** For tests and diagnostics: what this process has indexed for a group. */
  indexedIds(groupId: string): string[] {
    return this.sync.indexedIds(groupId);
  }
}

function asQueryError<T>(fn: () => T): T {
  try {
    return fn();
  } catch (error) {
    if (error instanceof StructureError) throw new ValidationError({ query: [error.message] }, `The query cannot be read: ${error.message}`);
    throw error;
  }
}

/** Escapes LIKE's wildcards so a name with % or _ is searched literally. */
function likeLiteral(text: string): string {
  return text.replace(/[\\%_]/g, (c) => `\\${c}`);
}

/**
 * Name, synonym or tag containing the text, case-insensitive. Exact names first, then names starting with the
 * text, then the rest; ties by lower-cased name in byte order (COLLATE "C", the same on every server) and id.
 */
async function textSearch(db: Db, groupId: string, text: string, limit: number) {
  const contains = `%${likeLiteral(text)}%`;
  const prefix = `${likeLiteral(text)}%`;
  const rows = await db.$queryRaw<{ id: string }[]>(Prisma.sql`
    SELECT c."id" FROM "Compound" c
    WHERE c."groupId" = ${groupId}
      AND (c."name" ILIKE ${contains}
        OR EXISTS (SELECT 1 FROM unnest(c."synonyms") s WHERE s ILIKE ${contains})
        OR EXISTS (SELECT 1 FROM unnest(c."tags") t WHERE t ILIKE ${contains}))
    ORDER BY (lower(c."name") = lower(${text})) DESC, (c."name" ILIKE ${prefix}) DESC, lower(c."name") COLLATE "C", c."id" COLLATE "C"
    LIMIT ${limit + 1}`);
  return { ids: rows.slice(0, limit).map((r) => ({ id: r.id })), more: rows.length > limit };
}

async function summaries(db: Db, groupId: string, ranked: { id: string; similarity?: number }[]): Promise<SearchHit[]> {
  const ids = ranked.map((r) => r.id);
  const rows = await db.compound.findMany({
    where: { groupId, id: { in: ids } },
    select: { id: true, name: true, formula: true, canonicalSmiles: true, tags: true, synonyms: true },
  });
  const byId = new Map(rows.map((r) => [r.id, r]));
  const workups = await workupsUsing(db, groupId, ids);
  return ranked.flatMap((r) => {
    const row = byId.get(r.id);
    if (!row) return []; // deleted between the index read and this one
    const used = workups.get(r.id) ?? [];
    return [{ ...row, ...(r.similarity !== undefined ? { similarity: r.similarity } : {}), workups: used.slice(0, WORKUPS_PER_HIT), workupCount: used.length }];
  });
}

// One service per server process, cached on globalThis so Next's dev-mode reloads keep the index.
const shared = globalThis as typeof globalThis & { __layerwiseCompoundSearch?: CompoundSearchService };

export function compoundSearch(): CompoundSearchService {
  return (shared.__layerwiseCompoundSearch ??= new CompoundSearchService());
}
