// Chart legends and text are readable (WCAG 2.x contrast computed from the colours the charts use), exported legends
// wrap instead of running off the image, and every chart's text summary says what it shows.
import { describe, expect, it } from "vitest";
import { contrastRatio, relativeLuminance } from "@/components/charts/contrast";
import { legendLayout, roughTextWidth } from "@/components/charts/legend";
import { AXIS_TEXT, CHART_BACKGROUND, LEGEND_TEXT, SERIES_COLORS } from "@/components/charts/palette";
import { calibrationSummary, groupSummary, histogramSummary, paritySummary, pooledSummary } from "@/components/charts/summaries";

describe("WCAG contrast", () => {
  // Reference values: black on white is 21:1 and white on white 1:1 by the definition (WCAG 2.1, "contrast ratio");
  // #777777 on white is 4.48:1, the usual example of a grey just failing AA (common practice, checked by hand:
  // L(#777) = 0.1845, (1.05)/(0.2345) = 4.478).
  it.each([
    ["#000000", "#ffffff", 21],
    ["#ffffff", "#ffffff", 1],
    ["#777777", "#ffffff", 4.478],
  ])("%s on %s is %f:1", (a, b, ratio) => {
    expect(contrastRatio(a, b)).toBeCloseTo(ratio, 2);
  });

  it("takes #rgb and is symmetric", () => {
    expect(relativeLuminance("#fff")).toBeCloseTo(1, 12);
    expect(contrastRatio("#0072B2", "#ffffff")).toBeCloseTo(contrastRatio("#ffffff", "#0072B2"), 12);
  });

  it("legend and axis text reach 4.5:1 on the chart background", () => {
    expect(contrastRatio(LEGEND_TEXT, CHART_BACKGROUND)).toBeGreaterThanOrEqual(4.5);
    expect(contrastRatio(AXIS_TEXT, CHART_BACKGROUND)).toBeGreaterThanOrEqual(4.5);
  });

  it("the series colours themselves would not all pass as text, which is why the legend text is not drawn in them", () => {
    const failing = SERIES_COLORS.filter((c) => contrastRatio(c, CHART_BACKGROUND) < 4.5);
    expect(failing).toContain("#E69F00");
    expect(failing).toContain("#F0E442");
  });
});

describe("legend layout for exported images", () => {
  const items = ["Ethyl acetate / water", "Dichloromethane / water", "2-Methyltetrahydrofuran / water", "No organic solvent", "Perfect agreement", "±10 points"]
    .map((label) => ({ label, color: "#0072B2" }));

  it("keeps every entry inside the image, wrapping onto new rows", () => {
    const width = 320;
    const layout = legendLayout(items, width, roughTextWidth);
    for (const item of layout.placed) expect(item.x + 18 + roughTextWidth(item.label)).toBeLessThanOrEqual(width);
    const rows = new Set(layout.placed.map((p) => p.y)).size;
    expect(rows).toBeGreaterThan(1);
    expect(layout.height).toBeGreaterThanOrEqual(rows * 20);
  });

  it("uses one row when the entries fit, and no room at all without a legend", () => {
    expect(new Set(legendLayout(items.slice(0, 2), 680, roughTextWidth).placed.map((p) => p.y)).size).toBe(1);
    expect(legendLayout([], 680, roughTextWidth).height).toBe(0);
  });

  it("asks for a wider image when one label is longer than a row", () => {
    const long = [{ label: "x".repeat(100), color: "#000000" }];
    expect(legendLayout(long, 300, roughTextWidth).minWidth).toBeGreaterThan(300);
  });
});

describe("text summaries", () => {
  const point = (predicted: number, reported: number, i: number) => ({ id: `w${i}`, title: `W${i}`, performedOn: "2026-09-01", predicted, reported, low: null, high: null, series: "etoac" });

  it("parity: inside, below and above the ±10-point band, and the median deviation", () => {
    expect(paritySummary([point(90, 88, 1), point(90, 60, 2), point(50, 75, 3), point(80, 81, 4)]))
      .toBe("4 workups: 2 within 10 points of the prediction, 1 below (less recovered than predicted), 1 above. Median reported − predicted: −0.5 points.");
    expect(paritySummary([])).toBe("No workups to plot.");
  });

  it("histogram: range, fullest bin, below and above zero", () => {
    const bins = [{ from: -20, to: -15, label: "−20 to −15", count: 1 }, { from: -5, to: 0, label: "−5 to 0", count: 3 }, { from: 0, to: 5, label: "0 to 5", count: 2 }];
    expect(histogramSummary(bins)).toBe("6 workups, from −20 to +5 points. Most in −5 to 0 points (3). 4 below zero, 2 above.");
  });

  it("groups: the lowest and highest mean among groups large enough to judge", () => {
    expect(groupSummary([
      { label: "Ethyl acetate / water", mean: -12.4, n: 5, few: false },
      { label: "Dichloromethane / water", mean: 3.1, n: 4, few: false },
      { label: "Toluene / water", mean: -40, n: 1, few: true },
    ], "groups")).toBe("3 groups. Lowest mean: Ethyl acetate / water, −12.4 points (n = 5). Highest: Dichloromethane / water, +3.1 points (n = 4). 1 group with fewer than three workups, shown in grey.");
  });

  it("calibration and pooled history", () => {
    expect(calibrationSummary([{ level: 0.5, n: 10, inside: 4, share: 0.4 }, { level: 0.95, n: 10, inside: 9, share: 0.9 }]))
      .toBe("10 outcomes. 50 % interval: 4 inside (40 %); 95 % interval: 9 inside (90 %).");
    expect(pooledSummary([
      { at: Date.UTC(2026, 8, 1), estimate: 1.2, low: 0.8, high: 1.6, n: 1 },
      { at: Date.UTC(2026, 9, 3), estimate: 1.05, low: 0.9, high: 1.2, n: 3 },
    ])).toBe("2 estimates from 1 Sept 2026 to 3 Oct 2026: pooled log K 1.20 at first, 1.05 now (95 % 0.90 to 1.20, n = 3).");
  });
});
