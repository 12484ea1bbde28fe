import { describe, expect, it } from "vitest";
import { ValidationError } from "@/lib/errors";
import { csvLine, parseCsv, parseCsvRecords } from "./csv";

describe("CSV (RFC 4180)", () => {
  it("round-trips commas, quotes, line breaks, JSON and numbers", () => {
    const cells = ["Wash, then dry", 'the "good" run', "line one\nline two", '{"a":[1,2],"b":"x"}', 42.5, "", null];
    const table = parseCsv(csvLine(["a", "b", "c", "d", "e", "f", "g"]) + csvLine(cells));
    expect(table.rows[0]!.cells).toEqual({ a: "Wash, then dry", b: 'the "good" run', c: "line one\nline two", d: '{"a":[1,2],"b":"x"}', e: "42.5", f: "", g: "" });
  });

  it("defuses cells a spreadsheet would run as formulas, and reading restores them", () => {
    expect(csvLine(["=HYPERLINK(1)", "+1", "-3", "@x", -3])).toBe("'=HYPERLINK(1),'+1,'-3,'@x,-3\r\n");
    const table = parseCsv("t\r\n" + csvLine(["=SUM(A1)"]));
    expect(table.rows[0]!.cells["t"]).toBe("=SUM(A1)");
  });

  it("reads LF or CRLF, a byte-order mark, header names in any case, and skips blank lines", () => {
    const table = parseCsv("\uFEFFTitle,Performed_On\n\nA,2026-01-02\r\nB,2026-01-03\n");
    expect(table.columns).toEqual(["title", "performed_on"]);
    expect(table.rows.map((r) => [r.line, r.cells["title"]])).toEqual([[3, "A"], [4, "B"]]);
  });

  it("counts lines inside quoted fields so row errors point at the right line", () => {
    expect(parseCsvRecords('a\n"x\ny"\nz\n').map((r) => r.line)).toEqual([1, 2, 4]);
  });

  it("refuses an unterminated quote, an empty file and a repeated column", () => {
    expect(() => parseCsv('a\n"open')).toThrow(ValidationError);
    expect(() => parseCsv("")).toThrow(ValidationError);
    const error = (() => { try { parseCsv("a,A\n1,2"); } catch (e) { return e as ValidationError; } })();
    expect(error?.fieldErrors["csv"]).toEqual(["column 'a' appears twice in the header"]);
  });
});
