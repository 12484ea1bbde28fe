/**
 * CSV import of past workups and their outcomes (columns: csv-columns.ts). Every row is checked and predicted first,
 * with its errors named by row, line and column; only when no row has an error is anything written, all rows in one
 * transaction. Progress is reported per row through `onProgress` (the route streams it as NDJSON).
 */
import { type Db } from "@/lib/db/client";
import { ValidationError } from "@/lib/errors";
import { analyzeOutcome, type OutcomeAnalysis } from "./analysis";
import { audit } from "./audit";
import { LONG_TRANSACTION, type Actor } from "./context";
import { parseCsv } from "./csv";
import { newRecordId } from "./ids";
import { groupLibrary } from "./library";
import { asJson, checkReferences, writeVersion } from "./persist";
import { computePrediction, IMPORT_DRAWS, seedFromId, type ComputedPrediction } from "./prediction";
import { headerColumns, plainJson, searchTextOf, snapshotHeader, solventKeysOf, type JsonObject } from "./record";
import { createWorkupSchema, outcomeInputSchema, type CreateWorkup, type OutcomeInput } from "./schemas";
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

/** Largest import in one request; larger files should be split (each row runs the Monte Carlo engine). */
export const MAX_IMPORT_ROWS = 5000;

interface CheckedRow {
  row: number;
  id: string;
  input: CreateWorkup;
  rawSpec: JsonObject;
  prediction: ComputedPrediction;
  outcome: OutcomeInput | null;
  analysis: OutcomeAnalysis | null;
}

const COLUMN_OF_HEADER: Record<string, string> = {
  title: "title", performedOn: "performed_on", chemistId: "chemist_email", notebookRef: "notebook_ref",
  scaleMmol: "scale_mmol", expectedProductMmol: "expected_product_mmol", assayedProductMmol: "assayed_product_mmol",
};
const COLUMN_OF_OUTCOME: Record<string, string> = {
  isolatedMassMg: "isolated_mass_mg", purityPct: "purity_pct", purityMethod: "purity_method", notes: "outcome_notes",
};

/** "" → absent; a number → number; anything else stays text so the schema names it ("must be a number"). */
function numeric(cell: string | undefined): number | string | undefined {
  if (cell === undefined || cell === "") return undefined;
  const n = Number(cell);
  return Number.isFinite(n) ? n : cell;
}

/** Turns a ValidationError's field paths into CSV columns. */
function columnErrors(error: ValidationError, specColumn: string): { column: string; message: string }[] {
  return Object.entries(error.fieldErrors).flatMap(([path, messages]) => {
    const [head, field, ...rest] = path.split(".");
    const column =
      head === "header" ? (COLUMN_OF_HEADER[field ?? ""] ?? path)
        : head === "spec" || head === "links" ? specColumn
          : (COLUMN_OF_OUTCOME[head ?? ""] ?? path);
    const where = head === "spec" && field ? `${[field, ...rest].join(".")}: ` : "";
    return messages.map((m) => ({ column, message: `${where}${m}` }));
  });
}

export async function importWorkupsCsv(db: Db, actor: Actor, text: string, options: CsvImportOptions = {}): Promise<CsvImportResult> {
  const table = parseCsv(text);
  for (const required of ["title", "performed_on"]) {
    if (!table.columns.includes(required)) throw new ValidationError({ csv: [`the header needs a '${required}' column`] });
  }
  if (!table.columns.includes("spec_json") && !table.columns.includes("template")) {
    throw new ValidationError({ csv: ["the header needs a 'spec_json' or a 'template' column"] });
  }
  if (table.rows.length > MAX_IMPORT_ROWS) throw new ValidationError({ csv: [`at most ${MAX_IMPORT_ROWS} rows per import; split the file`] });
  const total = table.rows.length;
  const library = await groupLibrary(db, actor.groupId);
  const members = await db.membership.findMany({ where: { groupId: actor.groupId }, select: { user: { select: { id: true, email: true } } } });
  const memberByEmail = new Map(members.map((m) => [m.user.email.toLowerCase(), m.user.id]));
  const templates = await templateLookup(db, actor.groupId, table.rows.map((r) => r.cells["template"] ?? "").filter((t) => t !== ""));
  const errors: RowError[] = [];
  const checked: CheckedRow[] = [];
  for (const [index, { line, cells }] of table.rows.entries()) {
    const row = index + 1;
    const fail = (column: string, message: string) => errors.push({ row, line, column, message });
    const before = errors.length;
    const email = cells["chemist_email"] ?? "";
    const chemistId = email === "" ? null : (memberByEmail.get(email.toLowerCase()) ?? null);
    if (email !== "" && !chemistId) fail("chemist_email", `no member of this group has the email ${email}`);
    const templateName = cells["template"] ?? "";
    const specText = cells["spec_json"] ?? "";
    let spec: unknown;
    let links: unknown[] = [];
    const specColumn = templateName !== "" ? "template" : "spec_json";
    if ((templateName === "") === (specText === "")) fail("spec_json", "give either spec_json or template (one of the two)");
    else if (templateName !== "") {
      const found = templates.get(templateName);
      if (!found) fail("template", `no workup of this group has the title or id '${templateName}'`);
      else if (found === "ambiguous") fail("template", `several workups are titled '${templateName}'; use the id`);
      else ({ spec, links } = found);
    } else {
      try {
        spec = JSON.parse(specText) as unknown;
      } catch (e) {
        fail("spec_json", `not valid JSON (${e instanceof Error ? e.message : "parse error"})`);
      }
    }
    const header = {
      title: cells["title"] ?? "", performedOn: cells["performed_on"] ?? "", chemistId, notebookRef: cells["notebook_ref"] ?? "",
      scaleMmol: numeric(cells["scale_mmol"]), expectedProductMmol: numeric(cells["expected_product_mmol"]), assayedProductMmol: numeric(cells["assayed_product_mmol"]),
    };
    const parsed = createWorkupSchema.safeParse({ header, spec: spec ?? {}, links });
    if (!parsed.success) for (const e of columnErrors(ValidationError.fromZod(parsed.error), specColumn)) if (spec !== undefined || e.column !== specColumn) fail(e.column, e.message);
    let outcome: OutcomeInput | null = null;
    if ((cells["isolated_mass_mg"] ?? "") !== "") {
      const o = outcomeInputSchema.safeParse({
        isolatedMassMg: numeric(cells["isolated_mass_mg"]), purityPct: numeric(cells["purity_pct"]) ?? null,
        purityMethod: cells["purity_method"] ?? "", notes: cells["outcome_notes"] ?? "",
      });
      if (o.success) outcome = o.data;
      else for (const e of columnErrors(ValidationError.fromZod(o.error), specColumn)) fail(e.column, e.message);
    }
    if (errors.length === before && parsed.success) {
      const id = newRecordId();
      try {
        const prediction = computePrediction(spec, { library, seed: seedFromId(id), draws: options.draws ?? IMPORT_DRAWS });
        const analysis = outcome
          ? analyzeOutcome({
              outcome, spec: prediction.parsed, library,
              header: { assayedProductMmol: parsed.data.header.assayedProductMmol ?? null, expectedProductMmol: parsed.data.header.expectedProductMmol ?? null },
              prediction: { ...prediction, workupVersion: 1, flags: prediction.result.prediction.flags },
            })
          : null;
        checked.push({ row, id, input: parsed.data, rawSpec: plainJson(spec), prediction, outcome, analysis });
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

type Template = { spec: unknown; links: unknown[] } | "ambiguous";

async function templateLookup(db: Db, groupId: string, names: string[]): Promise<Map<string, Template>> {
  const wanted = [...new Set(names)];
  if (wanted.length === 0) return new Map();
  const rows = await db.workup.findMany({
    where: { groupId, OR: [{ id: { in: wanted } }, { title: { in: wanted } }] },
    select: { id: true, title: true, spec: true, components: { select: { key: true, compoundId: true } } },
  });
  const map = new Map<string, Template>();
  for (const w of rows) {
    const template = { spec: w.spec, links: w.components.filter((c) => c.compoundId !== null).map((c) => ({ key: c.key, compoundId: c.compoundId })) };
    map.set(w.id, template);
    if (wanted.includes(w.title)) map.set(w.title, map.has(w.title) ? "ambiguous" : template);
  }
  return map;
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
      await options.onProgress?.({ phase: "writing", done: created.length, total: rows.length });
    }
  }, LONG_TRANSACTION);
  return created;
}
