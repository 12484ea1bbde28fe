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
