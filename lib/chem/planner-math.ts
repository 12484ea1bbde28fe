/**
 * Closed-form stage arithmetic the planner reasons with (the multiple-extraction formula of any analytical chemistry textbook, e.g. Harris, Quantitative Chemical Analysis), and the distribution
 * ratio of a component in a solvent at a pH from the engine's own partition and speciation functions.
 */
import { type SolventProps } from "./data/solvents";
import { SOLVENTS } from "./data/solvents";
import { ionLogKShift, pairingSign } from "./ion-pair";
import { solventLogK } from "./partition";
import { type Component } from "./schema";
import { distributionRatio, fractionSiteCharged, type IonizableSite } from "./speciation";
import { co2SaturationM, KW, systemFractionProtonated, systemMeanCharge } from "./aqueous";
import { CARBONATE, type CompiledReagent } from "./library";

/** Fraction of a component kept in the organic layer after n washes of V_w each: (1 + V_w/(D·V_org))^−n (§2.3). */
export function fractionKeptAfterWashes(d: number, organicMl: number, washMl: number, portions: number): number {
  return (1 + washMl / (d * organicMl)) ** -portions;
}

/**
 * Fraction extracted from an aqueous volume by n portions of V_org each: 1 − (1 + D·V_org/V_aq)^−n
 * (IUPAC Gold Book, "fraction extracted", PAC 65 (1993) 2384; §2.3).
 */
export function fractionExtractedAfter(d: number, aqueousMl: number, portionMl: number, portions: number): number {
  return 1 - (1 + (d * portionMl) / aqueousMl) ** -portions;
}

export interface SplitOption {
  portions: number;
  volumeMl: number;
  recovery: number;
}

/** The same total solvent volume split into 1…maxPortions equal portions. */
export function splitComparison(d: number, aqueousMl: number, totalMl: number, maxPortions: number): SplitOption[] {
  return Array.from({ length: maxPortions }, (_, i) => {
    const portions = i + 1;
    const volumeMl = totalMl / portions;
    return { portions, volumeMl, recovery: fractionExtractedAfter(d, aqueousMl, volumeMl, portions) };
  });
}

export function sitesOf(c: Pick<Component, "pKas">): IonizableSite[] {
  return c.pKas.map((p) => ({ pKa: p.value, kind: p.kind }));
}

/** Counter-ion concentration the planner assumes for ion pairs, mol/L (a 1 M wash). */
const PLANNING_COUNTER_ION_M = 1;

/** D(pH) of a component between `solvent` and water; null when neither log P nor a log K is known. */
export function distributionFunction(c: Component, solvent: SolventProps): ((pH: number) => number) | null {
  const k = solventLogK(c, solvent, SOLVENTS);
  if (!k) return null;
  // Ion pairs at 1 M counter-ion, the strength of a typical acid or base wash (ion-pair.ts).
  const offset = c.ionLogKOffset ?? (c.counterIon === "lipophilic" && !c.salt ? solvent.ionPairLogKOffset : ionLogKShift(solvent, pairingSign(c), PLANNING_COUNTER_ION_M));
  const sites = sitesOf(c);
  return (pH: number) => distributionRatio(pH, sites, k.value, k.value + offset, c.fixedCharge);
}

/** Fraction of a component charged at a pH (all sites independent). */
export function fractionCharged(c: Pick<Component, "pKas" | "fixedCharge">, pH: number): number {
  if (c.fixedCharge !== 0) return 1;
  let neutral = 1;
  for (const site of sitesOf(c)) neutral *= 1 - fractionSiteCharged(pH, site);
  return 1 - neutral;
}

/**
 * Buffer capacity of a reagent solution toward a pH (mmol per mL): the net charge of the solution at that pH
 * from its charge balance. Positive: acid (as its anion) it can take up while staying at or above pH;
 * negative: base it can take up while staying at or below pH. Carbonic acid beyond saturation leaves as CO₂
 * in a vented funnel (§2.7), so the carbonate left is capped where H₂CO₃* reaches saturation under 1 atm CO₂ at
 * the wash's temperature (°C; Henry's law with its van 't Hoff slope, as the simulator's contacts; NaN: 25 °C).
 */
export function reagentCapacity(r: CompiledReagent, pH: number, temperatureC = Number.NaN): number {
  const h = 10 ** -pH;
  let q = r.strongCharge + h - KW / h;
  const saturation = co2SaturationM(temperatureC);
  r.systems.forEach((total, s) => {
    if (!(total > 0)) return;
    const left = s === CARBONATE ? Math.min(total, saturation / systemFractionProtonated(s, h)) : total;
    q += left * systemMeanCharge(s, h);
  });
  return q;
}

/** A volume rounded to what one would measure: whole mL below 10, else to 5 mL. */
export function niceVolume(ml: number): number {
  if (ml < 10) return Math.max(1, Math.ceil(ml));
  return Math.ceil(ml / 5) * 5;
}
