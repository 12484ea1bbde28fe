/**
 * CSV as RFC 4180 describes it: comma-separated, fields with commas, quotes or line breaks in double quotes, quotes
 * doubled inside them; CRLF or LF line ends; a header row naming the columns. Text cells that a spreadsheet would
 * run as a formula (starting with = + - @) are written with a leading apostrophe, which reading removes again.
 */
import { ValidationError } from "@/lib/errors";

export type CsvCell = string | number | boolean | null | undefined;

const FORMULA_START = /^[=+\-@\t\r]/;

/** One cell. Numbers are written as they are; text that looks like a formula is defused (OWASP CSV injection). */
export function csvCell(value: CsvCell): string {
  if (value === null || value === undefined) return "";
  if (typeof value === "number") return Number.isFinite(value) ? String(value) : "";
  if (typeof value === "boolean") return value ? "true" : "false";
  const text = FORMULA_START.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(text) || text !== text.trim() ? `"${text.replace(/"/g, '""')}"` : text;
}

export function csvLine(cells: readonly CsvCell[]): string {
  return `${cells.map(csvCell).join(",")}\r\n`;
}

export interface CsvTable {
  /** Column names as written in the header row, trimmed and lower-cased. */
  columns: string[];
  /** Data rows as objects keyed by column name, with the line each row starts on (1-based, header = line 1). */
  rows: { line: number; cells: Record<string, string> }[];
}

/** Undoes csvCell's formula defusing. */
function restore(cell: string): string {
  return /^'[=+\-@\t\r]/.test(cell) ? cell.slice(1) : cell;
}

/** Splits CSV text into records of raw fields. Throws ValidationError for an unterminated quoted field. */
export function parseCsvRecords(text: string): { line: number; fields: string[] }[] {
  const records: { line: number; fields: string[] }[] = [];
  let fields: string[] = [];
  let field = "";
  let quoted = false;
  let line = 1;
  let recordLine = 1;
  let i = text.charCodeAt(0) === 0xfeff ? 1 : 0; // a byte-order mark from spreadsheet exports
  const endRecord = () => {
    fields.push(field);
    if (!(fields.length === 1 && fields[0] === "")) records.push({ line: recordLine, fields });
    fields = [];
    field = "";
  };
  for (; i < text.length; i++) {
    const ch = text[i]!;
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') { field += '"'; i++; }
      else if (ch === '"') quoted = false;
      else { if (ch === "\n") line++; field += ch; }
    } else if (ch === '"' && field === "") quoted = true;
    else if (ch === ",") { fields.push(field); field = ""; }
    else if (ch === "\n" || ch === "\r") {
      if (ch === "\r" && text[i + 1] === "\n") i++;
      endRecord();
      line++;
      recordLine = line;
    } else field += ch;
  }
  if (quoted) throw new ValidationError({ csv: [`line ${recordLine}: a quoted field is never closed`] });
  if (field !== "" || fields.length > 0) endRecord();
  return records;
}

export function parseCsv(text: string): CsvTable {
  const [head, ...body] = parseCsvRecords(text);
  if (!head) throw new ValidationError({ csv: ["the file is empty: the first line must name the columns"] });
  const columns = head.fields.map((c) => c.trim().toLowerCase());
  const duplicate = columns.find((c, i) => c !== "" && columns.indexOf(c) !== i);
  if (duplicate) throw new ValidationError({ csv: [`column '${duplicate}' appears twice in the header`] });
  const rows = body.map(({ line, fields }) => {
    const cells: Record<string, string> = {};
    columns.forEach((column, k) => {
      if (column !== "") cells[column] = restore((fields[k] ?? "").trim());
    });
    return { line, cells };
  });
  return { columns, rows };
}
