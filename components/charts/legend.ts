// A chart's legend as data: drawn in HTML beside the chart on screen and laid out again inside an exported image,
// wrapped onto as many rows as the labels need so that none is cut off at the image's edge.

export interface LegendItem {
  label: string;
  /** Swatch colour, #rrggbb. */
  color: string;
  /** How the series is drawn: a dot (points), a bar, a line or a dashed line. */
  mark?: "dot" | "bar" | "line" | "dash";
}

export interface PlacedLegendItem extends LegendItem {
  x: number;
  /** Baseline of the row. */
  y: number;
}

export const LEGEND_ROW_HEIGHT = 20;
const SWATCH = 18;
const GAP = 16;
const MARGIN = 12;

/**
 * Rows of legend entries for an image `width` px wide, with text measured by `measure` (px). An entry longer than a
 * whole row gets a row of its own (and the image is widened by the caller to `minWidth`).
 */
export function legendLayout(items: readonly LegendItem[], width: number, measure: (text: string) => number) {
  const placed: PlacedLegendItem[] = [];
  let x = MARGIN;
  let row = 0;
  let minWidth = 0;
  for (const item of items) {
    const w = SWATCH + measure(item.label);
    minWidth = Math.max(minWidth, w + 2 * MARGIN);
    if (x > MARGIN && x + w > width - MARGIN) {
      row += 1;
      x = MARGIN;
    }
    placed.push({ ...item, x, y: row * LEGEND_ROW_HEIGHT + 15 });
    x += w + GAP;
  }
  return { placed, height: items.length === 0 ? 0 : (row + 1) * LEGEND_ROW_HEIGHT + 6, minWidth };
}

/** A rough text width for 12 px sans-serif when no canvas is at hand (average advance ≈ 0.6 em). */
export const roughTextWidth = (text: string) => text.length * 7.2;
