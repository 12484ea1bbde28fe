/**
 * From a measurement of both layers to the neutral species' log K (shake-flask mass balance, common practice):
 *   D = (n_org / V_org) / (n_aq / V_aq), or C_org / C_aq when concentrations were entered;
 *   log K_N = log D − log(f₀ + (1 − f₀)·10^Δ), with f₀ the neutral fraction at the measured aqueous pH (lib/chem
 *   speciation, independent sites) and Δ the engine's default ion offset (−3.5, common practice, §2.2).
 * The standard error combines the measurement's own (stated, or a default per method) with the pH and pKa
 * uncertainties carried through that correction by central differences. Pure: no I/O.
 */
import { DEFAULT_UNCERTAINTY } from "@/lib/chem/perturb";
import { type PKa } from "@/lib/chem/schema";
import { distributionRatio, fractionNeutral, type IonizableSite } from "@/lib/chem/speciation";
import type { FieldErrors } from "@/lib/errors";
import { type MeasurementInput, type MeasurementMethod } from "./schemas";

/**
 * Standard error of one log D when no replicates are given. Shake-flask: 0.15, the same figure lib/chem/pool.ts uses
 * for a measured value (OECD TG 107 asks duplicates to agree within ±0.3 log units, [S33a]); layer assay of a routine
 * separation: 0.25, wider because volumes are read from glassware and the layers were not pre-saturated (from memory).
 */
export const DEFAULT_LOGD_SE: Record<MeasurementMethod, number> = { shake_flask: 0.15, layer_assay: 0.25 };
/** pH of a biphasic aqueous layer read with a calibrated meter, one standard deviation (from memory). */
export const PH_READING_SE = 0.1;
/** Mass-balance closure outside this range: don't use the record for fitting (common practice, §5.2). */
export const MASS_BALANCE_RANGE: readonly [number, number] = [0.9, 1.1];
/**
 * Below this neutral fraction the correction from log D to log K is mostly the assumed ion partition (the ion term
 * dominates once f₀ < 10^Δ), so the measurement says little about the neutral form (§5.2, "Identifiability").
 */
export const MIN_FRACTION_NEUTRAL = 0.01;

export type ObservationBoundName = "value" | "lower" | "upper";

export interface MeasuredLogK {
  logD: number;
  logK: number;
  se: number;
  bound: ObservationBoundName;
  fractionNeutral: number;
  /** log K − log D. */
  correction: number;
  /** (n_org + n_aq) / amount added, when both were given. */
  massBalance: number | null;
  seParts: { measurement: number; pH: number; pKa: number };
}

/** A measurement that cannot be used; the messages are keyed by the form's field names. */
export class MeasurementRejected extends Error {
  constructor(readonly fields: FieldErrors) {
    super(Object.values(fields).flat().join("; "));
    this.name = "MeasurementRejected";
  }
}

function sitesOf(pKas: readonly Pick<PKa, "value" | "kind">[]): IonizableSite[] {
  return pKas.map((p) => ({ pKa: p.value, kind: p.kind }));
}

/** log K_N − log D at a pH: minus the log of the neutral-plus-ion share the engine assumes. */
export function neutralCorrection(pH: number, pKas: readonly Pick<PKa, "value" | "kind">[]): number {
  return -Math.log10(distributionRatio(pH, sitesOf(pKas), 0));
}

export function measuredLogD(m: MeasurementInput): { logD: number; bound: ObservationBoundName; massBalance: number | null } {
  const d = m.basis === "amount"
    ? (m.organic / (m.organicVolumeMl ?? 1)) / (m.aqueous / (m.aqueousVolumeMl ?? 1))
    : m.organic / m.aqueous;
  const bound: ObservationBoundName = m.belowDetection === "aqueous" ? "lower" : m.belowDetection === "organic" ? "upper" : "value";
  const massBalance = m.basis === "amount" && m.totalAmount !== undefined ? (m.organic + m.aqueous) / m.totalAmount : null;
  return { logD: Math.log10(d), bound, massBalance };
}

/** Converts one measurement; throws MeasurementRejected when the record should not be used. */
export function measuredLogK(m: MeasurementInput, pKas: readonly PKa[]): MeasuredLogK {
  const { logD, bound, massBalance } = measuredLogD(m);
  const fields: FieldErrors = {};
  if (massBalance !== null && (massBalance < MASS_BALANCE_RANGE[0] || massBalance > MASS_BALANCE_RANGE[1])) {
    fields["totalAmount"] = [`the layers account for ${(100 * massBalance).toFixed(0)} % of the amount added; outside 90–110 % a measurement should not be used (common practice)`];
  }
  if (pKas.length > 0 && m.aqueousPh === undefined) {
    fields["aqueousPh"] = ["the compound has ionizable sites: give the aqueous pH measured after equilibration"];
  }
  const pH = m.aqueousPh ?? 7;
  const f0 = fractionNeutral(pH, sitesOf(pKas));
  if (pKas.length > 0 && m.aqueousPh !== undefined && f0 < MIN_FRACTION_NEUTRAL) {
    fields["aqueousPh"] = [`at pH ${pH} only ${(100 * f0).toPrecision(2)} % of the compound is neutral, so log D says little about the neutral form; measure where most of it is neutral`];
  }
  if (Object.keys(fields).length > 0) throw new MeasurementRejected(fields);

  const correction = neutralCorrection(pH, pKas);
  const h = 0.01;
  const slopePh = pKas.length > 0 ? (neutralCorrection(pH + h, pKas) - neutralCorrection(pH - h, pKas)) / (2 * h) : 0;
  let pKaVariance = 0;
  pKas.forEach((site, i) => {
    const shifted = (delta: number) => pKas.map((p, j) => (j === i ? { ...p, value: p.value + delta } : p));
    const slope = (neutralCorrection(pH, shifted(h)) - neutralCorrection(pH, shifted(-h))) / (2 * h);
    const sd = site.se ?? DEFAULT_UNCERTAINTY.pKa[site.provenance];
    pKaVariance += (slope * sd) ** 2;
  });
  const seParts = { measurement: m.logDSe ?? DEFAULT_LOGD_SE[m.method], pH: Math.abs(slopePh) * PH_READING_SE, pKa: Math.sqrt(pKaVariance) };
  return {
    logD, logK: logD + correction, bound, fractionNeutral: f0, correction, massBalance,
    se: Math.hypot(seParts.measurement, seParts.pH, seParts.pKa), seParts,
  };
}
