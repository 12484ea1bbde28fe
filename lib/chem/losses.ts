/**
 * Where material that left the main line went, booked by destination: aqueous layers (washes, extracted
 * aqueous phases), organic waste (discarded organic layers), the drying agent (solution held on the spent
 * agent), the filter cake (solution held on a cake or pad) and evaporation. A discarded layer is aqueous or
 * organic by what it mostly is: a wash saturated with ethyl acetate (≈9 vol %) is still an aqueous layer.
 */
import { type ComponentLosses, type SideStream } from "./types";

export type LossBucket = keyof ComponentLosses;
export const LOSS_BUCKETS: readonly LossBucket[] = ["aqueous", "organic", "drying_agent", "filter_cake", "evaporated"];

/** The bucket a side stream's contents are lost to; null for a stream saved for later (not lost). */
export function lossBucket(s: Pick<SideStream, "fate" | "wasteClass">): LossBucket | null {
  switch (s.fate) {
    case "drying_agent": return "drying_agent";
    case "filter_cake": return "filter_cake";
    case "evaporated": return "evaporated";
    case "waste": return s.wasteClass === "aqueous" ? "aqueous" : s.wasteClass === "solid" ? "filter_cake" : "organic";
    default: return null;
  }
}

export type { ComponentLosses };

export const noLosses = (): ComponentLosses => ({ aqueous: 0, organic: 0, drying_agent: 0, filter_cake: 0, evaporated: 0 });

/** Each component's losses by bucket, as fractions of its starting amount (0 when it has none). */
export function lossesByBucket(sideStreams: readonly SideStream[], start: Readonly<Record<string, number>>): Record<string, ComponentLosses> {
  const out: Record<string, ComponentLosses> = {};
  for (const key of Object.keys(start)) out[key] = noLosses();
  for (const s of sideStreams) {
    const bucket = lossBucket(s);
    if (!bucket) continue;
    for (const [key, mmol] of Object.entries(s.components)) {
      const n0 = start[key] ?? 0;
      const row = out[key];
      if (row && n0 > 0) row[bucket] += mmol / n0;
    }
  }
  return out;
}
