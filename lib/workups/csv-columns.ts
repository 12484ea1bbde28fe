/**
 * The workup CSV: one row per workup, the same columns for export and import, so an exported list can be edited in
 * a spreadsheet and imported into another group. Column names are case-insensitive and may come in any order;
 * columns the importer does not know (id, status, predicted_* …, which it recomputes) are ignored.
 */
export interface CsvColumn {
  name: string;
  /** Read by the importer. */
  imported: boolean;
  doc: string;
}

export const CSV_COLUMNS: readonly CsvColumn[] = [
  { name: "id", imported: false, doc: "export only: the workup id" },
  { name: "title", imported: true, doc: "required" },
  { name: "performed_on", imported: true, doc: "required, YYYY-MM-DD" },
  { name: "chemist_email", imported: true, doc: "optional; must be a member of the importing group" },
  { name: "chemist_name", imported: false, doc: "export only" },
  { name: "notebook_ref", imported: true, doc: "optional" },
  { name: "notebook_url", imported: true, doc: "optional, the http(s) address of the electronic notebook entry" },
  { name: "scale_mmol", imported: true, doc: "optional, mmol of the limiting reagent" },
  { name: "expected_product_mmol", imported: true, doc: "optional, theoretical product" },
  { name: "assayed_product_mmol", imported: true, doc: "optional, product assayed before the workup" },
  { name: "template", imported: true, doc: "the title or id of a workup of the group whose spec and compound links are reused; give this or spec_json" },
  { name: "isolated_mass_mg", imported: true, doc: "optional; when present the row also reports an outcome" },
  { name: "purity_pct", imported: true, doc: "required with an outcome unless purity_method is weight_only" },
  { name: "purity_method", imported: true, doc: "qnmr, hplc, gc or weight_only" },
  { name: "outcome_notes", imported: true, doc: "optional" },
  { name: "version", imported: false, doc: "export only" },
  { name: "status", imported: false, doc: "export only: as_expected, below, above, inconclusive or unknown" },
  { name: "flagged", imported: false, doc: "export only" },
  { name: "reported_recovery_pct", imported: false, doc: "export only" },
  { name: "predicted_recovery_pct", imported: false, doc: "export only" },
  { name: "predicted_low_pct", imported: false, doc: "export only: 2.5th percentile" },
  { name: "predicted_high_pct", imported: false, doc: "export only: 97.5th percentile" },
  { name: "deviation_pct", imported: false, doc: "export only: reported − predicted, percentage points" },
  { name: "solvents", imported: false, doc: "export only: solvent keys separated by spaces" },
  { name: "engine_version", imported: false, doc: "export only" },
  { name: "spec_json", imported: true, doc: "the workup spec as JSON (the editor's and the API's format, units included); give this or template" },
];

export const CSV_EXPORT_COLUMNS = CSV_COLUMNS.map((c) => c.name);

export const CSV_COLUMNS_DOC = CSV_COLUMNS.map((c) => `${c.name}: ${c.doc}`).join("; ");
