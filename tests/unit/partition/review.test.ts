// The review page's numbers and rules (lib/review) and the CSV the views export (components/charts/csv.ts).
import { describe, expect, it } from "vitest";
import { toCsv, fileSlug } from "@/components/charts/csv";
import { niceTicks } from "@/components/charts/scale";
import { calibration, groupStats, histogram, rankedFlagged, type ReviewRow } from "@/lib/review/aggregate";
import { parseInput } from "@/lib/errors";
import { reviewFilterSchema, filterQuery } from "@/lib/review/filters";
import { chemistFilterFor, chemistStats, EVERYONE_ELSE, YOU } from "@/lib/review/people";

const row = (id: string, deviationPct: number | null, extra: Partial<ReviewRow> = {}): ReviewRow => ({
  id, title: id, performedOn: "2026-09-01", chemistId: "u1", solventSystem: "etoac", operationTypes: ["extract"], status: "as_expected",
  flagged: false, deviationPct, predicted: 80, low: 70, high: 90, reported: deviationPct === null ? null : 80 + deviationPct, causes: [], dangerFlags: [], ...extra,
});

describe("residuals by factor", () => {
  it("gives n, mean, median and the sample standard deviation per group, largest group first", () => {
    const stats = groupStats([row("a", -10), row("b", -20), row("c", 0, { solventSystem: "dcm" }), row("d", -30), row("e", null)], (r) => [r.solventSystem ?? "none"]);
    expect(stats.map((s) => [s.key, s.n])).toEqual([["etoac", 3], ["dcm", 1]]);
    expect(stats[0]).toMatchObject({ mean: -20, median: -20, sd: 10 });
    expect(stats[1]?.sd).toBeNull();
  });

  it("counts a workup under every operation type it contains", () => {
    const stats = groupStats([row("a", -10, { operationTypes: ["wash", "extract"] }), row("b", 10, { operationTypes: ["extract"] })], (r) => r.operationTypes);
    expect(Object.fromEntries(stats.map((s) => [s.key, s.n]))).toEqual({ extract: 2, wash: 1 });
  });
});

describe("histogram of deviations", () => {
  it("puts each deviation in one 5-point bin aligned on multiples of 5, empty bins included", () => {
    const bins = histogram([-12, -10, -0.1, 0, 4.9, 5]);
    expect(bins.map((b) => [b.from, b.count])).toEqual([[-15, 1], [-10, 1], [-5, 1], [0, 2], [5, 1]]);
    expect(bins.reduce((a, b) => a + b.count, 0)).toBe(6);
    expect(histogram([])).toEqual([]);
  });
});

describe("calibration and the flagged list", () => {
  it("reports the mean absolute deviation and how often the reported recovery fell inside the interval", () => {
    const c = calibration([row("a", -5), row("b", 15), row("c", -25, { flagged: true }), row("d", null)]);
    expect(c).toEqual({ n: 3, meanAbsoluteDeviation: 15, withinInterval: 1 / 3, flagged: 1 });
  });

  it("ranks flagged workups by shortfall, danger-only flags last", () => {
    const ranked = rankedFlagged([row("a", -5, { flagged: true }), row("b", -30, { flagged: true }), row("c", null, { flagged: true }), row("d", -50)]);
    expect(ranked.map((r) => r.id)).toEqual(["b", "a", "c"]);
  });
});

describe("per-person views (in aggregate, or to the person and the lead)", () => {
  const rows = [row("a", -10, { chemistId: "me" }), row("b", -20, { chemistId: "other" }), row("c", 0, { chemistId: "third" }), row("d", 5, { chemistId: null })];
  const names = new Map([["me", "Ines"], ["other", "Oskar"], ["third", "Tove"]]);

  it("shows a member their own figures beside everyone else's together", () => {
    const stats = chemistStats(rows, { groupId: "g", userId: "me", isLead: false }, names);
    expect(stats.map((s) => [s.label, s.n])).toEqual([[EVERYONE_ELSE, 3], [YOU, 1]]);
    expect(JSON.stringify(stats)).not.toMatch(/Oskar|Tove/);
  });

  it("shows the lead each chemist by name", () => {
    const stats = chemistStats(rows, { groupId: "g", userId: "lead", isLead: true }, names);
    expect(stats.map((s) => s.label).sort()).toEqual(["Ines", "Not recorded", "Oskar", "Tove"]);
  });

  it("refuses a member's filter on someone else, but not on themselves or for a lead", () => {
    expect(chemistFilterFor({ groupId: "g", userId: "me", isLead: false }, "other")).toEqual({
      chemist: undefined, notice: "Only a group lead can look at another chemist's workups on their own; the chemist filter was not applied.",
    });
    expect(chemistFilterFor({ groupId: "g", userId: "me", isLead: false }, "me")).toEqual({ chemist: "me", notice: null });
    expect(chemistFilterFor({ groupId: "g", userId: "lead", isLead: true }, "other")).toEqual({ chemist: "other", notice: null });
  });
});

describe("review filters", () => {
  it("reads the query string, treating blanks as absent, and writes it back", () => {
    const f = parseInput(reviewFilterSchema, { from: "2026-09-01", to: "", chemist: "", solvent: "DCM" });
    expect(f).toEqual({ from: "2026-09-01", solvent: "dcm" });
    expect(filterQuery(f)).toBe("from=2026-09-01&solvent=dcm");
  });

  it("names a malformed date and a reversed range", () => {
    expect(reviewFilterSchema.safeParse({ from: "1 Sept" }).error?.issues[0]?.message).toBe("from must be a date written YYYY-MM-DD");
    expect(reviewFilterSchema.safeParse({ from: "2026-10-01", to: "2026-09-01" }).error?.issues[0]).toMatchObject({ path: ["to"], message: "the start date must not be after the end date" });
  });
});

describe("CSV export (RFC 4180)", () => {
  it("quotes what needs quoting, doubles quotes, ends lines with CRLF and defuses formulas", () => {
    expect(toCsv([["title", "n"], ['Wash, then "dry"', 3], ["=HYPERLINK(\"x\")", -2.5], [null, 1 / 3]])).toBe(
      'title,n\r\n"Wash, then ""dry""",3\r\n"\'=HYPERLINK(""x"")",-2.5\r\n,0.33333333\r\n',
    );
    expect(fileSlug("Deviations by solvent system")).toBe("deviations-by-solvent-system");
  });

  it("puts axis ticks on round numbers", () => {
    expect(niceTicks(-0.01, 0.97)).toEqual([-0.2, 0, 0.2, 0.4, 0.6, 0.8, 1]);
    expect(niceTicks(3, 47, 4)).toEqual([0, 20, 40, 60]);
  });
});
