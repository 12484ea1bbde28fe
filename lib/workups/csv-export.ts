// CSV export of any filtered list: the list's filters, every matching row (keyset batches, so memory stays flat),
// the columns of csv-columns.ts. Yields text chunks for a streamed response.
import { type Prisma } from "@/generated/prisma/client";
import { type Db } from "@/lib/db/client";
import { parseInput } from "@/lib/errors";
import { csvLine, type CsvCell } from "./csv";
import { CSV_EXPORT_COLUMNS } from "./csv-columns";
import { afterCursor, LIST_ORDER, resolveWhere } from "./queries";
import { dayOf } from "./record";
import { workupListFilterSchema } from "./schemas";

const BATCH = 500;

const exportSelect = {
  id: true, title: true, performedOn: true, chemistId: true, notebookRef: true, notebookUrl: true, scaleMmol: true, expectedProductMmol: true,
  assayedProductMmol: true, version: true, status: true, flagged: true, deviationPct: true, solventKeys: true, spec: true,
  outcome: { select: { isolatedMassMg: true, purityPct: true, purityMethod: true, notes: true, recoveryPct: true } },
  predictions: {
    orderBy: [{ workupVersion: "desc" }, { createdAt: "desc" }], take: 1,
    select: { productRecovery: true, recoveryLow: true, recoveryHigh: true, engineVersion: true },
  },
} as const satisfies Prisma.WorkupSelect;

type ExportRecord = Prisma.WorkupGetPayload<{ select: typeof exportSelect }>;

const pct = (f: number | null | undefined) => (f === null || f === undefined ? null : f * 100);

function cells(w: ExportRecord, people: Map<string, { name: string; email: string }>): Record<string, CsvCell> {
  const p = w.predictions[0];
  const chemist = w.chemistId ? people.get(w.chemistId) : undefined;
  return {
    id: w.id, title: w.title, performed_on: dayOf(w.performedOn), chemist_email: chemist?.email, chemist_name: chemist?.name,
    notebook_ref: w.notebookRef, notebook_url: w.notebookUrl, scale_mmol: w.scaleMmol, expected_product_mmol: w.expectedProductMmol, assayed_product_mmol: w.assayedProductMmol,
    isolated_mass_mg: w.outcome?.isolatedMassMg, purity_pct: w.outcome?.purityPct, purity_method: w.outcome?.purityMethod,
    outcome_notes: w.outcome?.notes || null, version: w.version, status: w.status, flagged: w.flagged,
    reported_recovery_pct: w.outcome?.recoveryPct, predicted_recovery_pct: pct(p?.productRecovery), predicted_low_pct: pct(p?.recoveryLow),
    predicted_high_pct: pct(p?.recoveryHigh), deviation_pct: w.deviationPct, solvents: w.solventKeys.join(" "),
    engine_version: p?.engineVersion, spec_json: JSON.stringify(w.spec),
  };
}

/** Validates the filters first (so a bad filter is a 422, not a broken download), then yields the CSV. */
export function exportWorkupsCsv(db: Db, groupId: string, input: unknown): AsyncGenerator<string> {
  const filter = parseInput(workupListFilterSchema, input);
  const rowsOf = async (batch: ExportRecord[]): Promise<string> => {
    const ids = [...new Set(batch.map((w) => w.chemistId).filter((id): id is string => id !== null))];
    const people = new Map((await db.user.findMany({ where: { id: { in: ids } }, select: { id: true, name: true, email: true } })).map((u) => [u.id, u]));
    return batch.map((w) => { const c = cells(w, people); return csvLine(CSV_EXPORT_COLUMNS.map((name) => c[name])); }).join("");
  };
  return (async function* () {
    const where = await resolveWhere(db, groupId, filter);
    let header: string | null = csvLine(CSV_EXPORT_COLUMNS);
    let after: { performedOn: Date; id: string } | null = null;
    for (;;) {
      const batch: ExportRecord[] = await db.workup.findMany({
        where: after ? { AND: [where, afterCursor(after)] } : where,
        orderBy: LIST_ORDER,
        take: BATCH,
        select: exportSelect,
      });
      // The header goes out with the first batch, so the first query has run before anything is sent.
      if (header !== null) {
        const first: string = header;
        header = null;
        if (batch.length === 0) {
          yield first;
          return;
        }
        yield first + (await rowsOf(batch));
        if (batch.length < BATCH) return;
        after = batch.at(-1)!;
        continue;
      }
      if (batch.length === 0) return;
      yield await rowsOf(batch);
      if (batch.length < BATCH) return;
      after = batch.at(-1)!;
    }
  })();
}
