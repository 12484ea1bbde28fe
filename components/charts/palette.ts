// Colours of the charts: distinguishable in print and for the common forms of colour blindness (Okabe & Ito,
// "Color Universal Design", 2008), in a fixed order so a solvent keeps its colour across views.
export const SERIES_COLORS = ["#0072B2", "#E69F00", "#009E73", "#CC79A7", "#56B4E9", "#D55E00", "#F0E442", "#000000"] as const;

export function seriesColor(index: number): string {
  return SERIES_COLORS[index % SERIES_COLORS.length] as string;
}

export const BELOW_COLOR = "#D55E00";
export const ABOVE_COLOR = "#0072B2";
export const MUTED_COLOR = "#a8a29e";
/** The width that fits an A4 page in portrait with 15 mm margins at 96 px per inch (180 mm ≈ 680 px). */
export const PRINT_WIDTH = 680;

/** The charts' background, on screen and in exported images. */
export const CHART_BACKGROUND = "#ffffff";
/** Legend text: the series colour is in the swatch beside it, never in the text (stone-800, 14.9:1 on white). */
export const LEGEND_TEXT = "#292524";
/** Axis labels and tick text drawn by the charts themselves (stone-600). */
export const AXIS_TEXT = "#57534e";
/** The reference lines: perfect agreement, and the ±10-point band. */
export const IDENTITY_COLOR = "#57534e";
export const BAND_COLOR = "#a8a29e";
