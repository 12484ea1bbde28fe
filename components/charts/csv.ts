// CSV as RFC 4180 describes it (comma-separated, CRLF line ends, fields with commas, quotes or line breaks quoted,
// quotes doubled). Text that a spreadsheet would run as a formula (leading = + - @, tab or CR) is prefixed with an
// apostrophe, as OWASP's guidance on CSV injection advises. Numbers stay numbers. Pure: browser and server.

export type CsvCell = string | number | boolean | null | undefined;

function cell(value: CsvCell): string {
  if (value === null || value === undefined) return "";
  if (typeof value === "number") return Number.isFinite(value) ? String(Number.isInteger(value) ? value : Number(value.toPrecision(8))) : "";
  if (typeof value === "boolean") return value ? "true" : "false";
  const text = /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
  return /[",\r\n]|^\s|\s$/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function toCsv(rows: readonly (readonly CsvCell[])[]): string {
  return rows.map((row) => row.map(cell).join(",")).join("\r\n") + "\r\n";
}

/** A file name from free text: letters, digits and dashes only. */
export function fileSlug(text: string): string {
  return text.toLowerCase().normalize("NFKD").replace(/[^a-z0-9]+/g, "-").replace(/^-+|-+$/g, "").slice(0, 60) || "export";
}
