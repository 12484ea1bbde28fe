// The whole-file checks and the split into rows of a CSV import (csv-import.ts), on their own so that an engine
// thread can run them (lib/workers): a 10 MB file is split off the event loop. Pure: no database.
import { ValidationError } from "@/lib/errors";
import { parseCsv, type CsvTable } from "./csv";

/** Largest import in one request; larger files should be split (each row runs the Monte Carlo engine). */
export const MAX_IMPORT_ROWS = 5000;

export type ImportTable = CsvTable;

/** The file's rows, or ValidationError (422 on `csv`) for a problem of the whole file; no row is read yet. */
export function readImportTable(text: string): ImportTable {
  // A NUL cannot be stored in any text column; refused for the whole file before a row is read (it reached the
  // database and answered 500). Broken UTF-16 cannot occur here: the body was decoded as strict UTF-8.
  if (text.includes("\u0000")) throw new ValidationError({ csv: ["the file contains a NUL character (U+0000); remove it and import again"] });
  const table = parseCsv(text);
  for (const required of ["title", "performed_on"]) {
    if (!table.columns.includes(required)) throw new ValidationError({ csv: [`the header needs a '${required}' column`] });
  }
  if (!table.columns.includes("spec_json") && !table.columns.includes("template")) {
    throw new ValidationError({ csv: ["the header needs a 'spec_json' or a 'template' column"] });
  }
  if (table.rows.length > MAX_IMPORT_ROWS) throw new ValidationError({ csv: [`at most ${MAX_IMPORT_ROWS} rows per import; split the file`] });
  return table;
}
