/**
 * CSV import of past workups and their outcomes (columns: csv-columns.ts). Every row is checked and predicted first,
 * with its errors named by row, line and column; only when no row has an error is anything written, all rows in one
 * transaction. Progress is reported per row through `onProgress` (the route streams it as NDJSON). The file is checked
 * and split into rows on an engine thread (csv-table.ts); each row's engine work is checked against the engine budget
 * (a row beyond it is that row's error) and runs on an engine thread too; the caller holds the importing user's
 * heavy slot for the whole import.
 */
import { type Db } from "@/lib/db/client";
import { ValidationError } from "@/lib/errors";
import { groupValuesForLinks } from "@/lib/partition/group-values";
import { analyzeOutcome, type OutcomeAnalysis } from "./analysis";
import { audit } from "./audit";
import { LONG_TRANSACTION, type Actor } from "./context";
import { newRecordId } from "./ids";
import { loadGroupJudgement } from "./group-model";
import { groupLibrary } from "./library";
import { asJson, checkReferences, writeVersion } from "./persist";
import { IMPORT_DRAWS, seedFromId, type ComputedPrediction } from "./prediction";
import { assertEngineBudget, predictInPool } from "@/lib/workers/engine";
import { nextTurn } from "@/lib/workers/next-turn";
import { enginePool } from "@/lib/workers/pool";
import { headerColumns, plainJson, searchTextOf, snapshotHeader, solventKeysOf, type JsonObject } from "./record";
import { columnErrors, readRow, templateLookup, type RowContext } from "./csv-rows";
import { type CreateWorkup, type OutcomeInput } from "./schemas";
import { isFlagged } from "./deviation";

export interface ImportProgress {
  phase: "checking" | "writing";
  done: number;
  total: number;
}

export interface RowError {
  /** 1-based data row (the header is not counted) and the file line it starts on. */
  row: number;
  line: number;
  column: string;
  message: string;
}

export type CsvImportResult =
  | { ok: true; created: { row: number; id: string; title: string }[] }
  | { ok: false; rows: number; errors: RowError[] };

export interface CsvImportOptions {
  onProgress?: (progress: ImportProgress) => void | Promise<void>;
  draws?: number;
}

export { MAX_IMPORT_ROWS } from "./csv-table";

interface CheckedRow {
  row: number;
  id: string;
  input: CreateWorkup;
  rawSpec: JsonObject;
  prediction: ComputedPrediction;
  outcome: OutcomeInput | null;
  analysis: OutcomeAnalysis | null;
}

export async function importWorkupsCsv(db: Db, actor: Actor, text: string, options: CsvImportOptions = {}): Promise<CsvImportResult> {
  // Checked and split on an engine thread: a file of several MB would hold the event loop.
  const table = await enginePool().run("csvTable", { text });
  const total = table.rows.length;
  const library = await groupLibrary(db, actor.groupId);
  const judgement = await loadGroupJudgement(db, actor.groupId);
  const members = await db.membership.findMany({ where: { groupId: actor.groupId }, select: { user: { select: { id: true, email: true } } } });
  const context: RowContext = {
    memberByEmail: new Map(members.map((m) => [m.user.email.toLowerCase(), m.user.id])),
    templates: await templateLookup(db, actor.groupId, table.rows.map((r) => r.cells["template"] ?? "").filter((t) => t !== "")),
  };
  const errors: RowError[] = [];
  const checked: CheckedRow[] = [];
  for (const [index, { line, cells }] of table.rows.entries()) {
    const row = index + 1;
    const fail = (column: string, message: string) => errors.push({ row, line, column, message });
    const { spec, specColumn, input, outcome, errors: problems } = readRow(cells, context);
    for (const p of problems) fail(p.column, p.message);
    if (problems.length === 0 && input) {
      const id = newRecordId();
      try {
        const groupValues = await groupValuesForLinks(db, actor.groupId, input.links);
        const draws = options.draws ?? IMPORT_DRAWS;
        assertEngineBudget(spec, draws);
        const prediction = await predictInPool(spec, { library, seed: seedFromId(id), draws, groupValues });
        const analysis = outcome
          ? analyzeOutcome({
              outcome, spec: prediction.parsed, library, model: judgement.model, causeFrequencies: judgement.causeFrequencies,
              header: { assayedProductMmol: input.header.assayedProductMmol ?? null, expectedProductMmol: input.header.expectedProductMmol ?? null },
              prediction: { ...prediction, workupVersion: 1, flags: prediction.result.prediction.flags },
            })
          : null;
        checked.push({ row, id, input, rawSpec: plainJson(spec), prediction, outcome, analysis });
      } catch (error) {
        if (!(error instanceof ValidationError)) throw error;
        for (const e of columnErrors(error, specColumn)) fail(e.column, e.message);
      }
    }
    await options.onProgress?.({ phase: "checking", done: row, total });
  }
  if (errors.length > 0) return { ok: false, rows: total, errors };
  return { ok: true, created: await writeRows(db, actor, checked, options) };
}

async function writeRows(db: Db, actor: Actor, rows: CheckedRow[], options: CsvImportOptions) {
  const created: { row: number; id: string; title: string }[] = [];
  await db.$transaction(async (tx) => {
    for (const r of rows) {
      const { header, links } = r.input;
      const names = await checkReferences(tx, actor.groupId, header, links);
      const status = r.analysis?.deviation.status ?? "unknown";
      await tx.workup.create({
        data: {
          id: r.id, groupId: actor.groupId, ...headerColumns(header), spec: asJson(r.rawSpec), version: 1,
          searchText: searchTextOf(header, r.prediction.parsed, names), solventKeys: solventKeysOf(r.prediction.parsed),
          flagged: r.analysis?.flagged ?? isFlagged("unknown", r.prediction.result.prediction.flags), status,
          deviationPct: r.analysis?.deviation.deviationPct ?? null, createdById: actor.userId, updatedById: actor.userId,
        },
        select: { id: true },
      });
      await writeVersion(tx, actor, { workupId: r.id, version: 1, snapshot: { header: snapshotHeader(header), spec: r.rawSpec, links }, prediction: r.prediction, links });
      if (r.outcome && r.analysis) {
        await tx.outcome.create({
          data: {
            groupId: actor.groupId, workupId: r.id, isolatedMassMg: r.outcome.isolatedMassMg, purityPct: r.outcome.purityPct ?? null,
            purityMethod: r.outcome.purityMethod, layerAssays: [], notes: r.outcome.notes, reportedById: actor.userId,
            recoveryPct: r.analysis.reported ? r.analysis.reported.recovery * 100 : null, analysis: asJson(r.analysis),
          },
          select: { id: true },
        });
      }
      await audit(tx, actor, "workup.import", r.id, { title: header.title, row: r.row });
      created.push({ row: r.row, id: r.id, title: header.title });
      await nextTurn();
      await options.onProgress?.({ phase: "writing", done: created.length, total: rows.length });
    }
  }, LONG_TRANSACTION);
  return created;
}
