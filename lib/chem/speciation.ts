/**
 * Speciation of a molecule with any number of acidic and basic sites, treating the sites as independent
 * (microscopic-independence approximation). "Neutral" means every site uncharged; every other form, a
 * zwitterion included, counts as charged (common practice). The distribution ratio D (total organic over
 * total aqueous concentration) sums the neutral and ionic contributions:
 *   D = K_N·f₀ + K_I·(1 − f₀)
 * which reduces to the Henderson–Hasselbalch forms D = P/(1 + 10^(pH−pKa)) for an acid and
 * D = P/(1 + 10^(pKaH−pH)) for a base when K_I → 0 (Scherrer & Howard 1977, via [S19]).
 */

export interface IonizableSite {
  pKa: number;
  /** "base" means the value is the pKa of the conjugate acid (pKaH). */
  kind: "acid" | "base";
}

/** log K_ion − log K_neutral for callers with no counter-ion or solvent at hand (common practice: ions 3–4 log
 * units below). The simulator and planner use the ion-pair model of ion-pair.ts instead. */
export const DEFAULT_ION_LOGK_OFFSET = -3.5;

export interface Speciation {
  fractionNeutral: number;
  fractionCharged: number;
  /** Mean net charge in the aqueous phase (the fixed charge included). */
  meanCharge: number;
  /** Fraction of each net charge, e.g. { "-1": 0.9, "0": 0.1 }; net 0 includes zwitterions. */
  fractionByNetCharge: Record<string, number>;
}

/** Fraction of a site in its charged form: A⁻ for an acid, BH⁺ for a base. */
export function fractionSiteCharged(pH: number, site: IonizableSite): number {
  const e = site.kind === "acid" ? site.pKa - pH : pH - site.pKa;
  return 1 / (1 + 10 ** e);
}

export function speciate(pH: number, sites: readonly IonizableSite[], fixedCharge = 0): Speciation {
  // Net-charge distribution by convolution over independent sites; index offset keeps charges non-negative.
  const n = sites.length;
  let dist = new Float64Array(2 * n + 1);
  dist[n] = 1;
  let fractionNeutral = fixedCharge === 0 ? 1 : 0;
  let meanCharge = fixedCharge;
  for (const site of sites) {
    const c = fractionSiteCharged(pH, site);
    const z = site.kind === "acid" ? -1 : 1;
    const next = new Float64Array(2 * n + 1);
    for (let i = 0; i < dist.length; i++) {
      const p = dist[i] ?? 0;
      if (p === 0) continue;
      next[i] = (next[i] ?? 0) + p * (1 - c);
      const j = i + z;
      next[j] = (next[j] ?? 0) + p * c;
    }
    dist = next;
    fractionNeutral *= 1 - c;
    meanCharge += z * c;
  }
  const fractionByNetCharge: Record<string, number> = {};
  dist.forEach((p, i) => {
    if (p > 0) fractionByNetCharge[String(i - n + fixedCharge)] = p;
  });
  return { fractionNeutral, fractionCharged: 1 - fractionNeutral, meanCharge, fractionByNetCharge };
}

export function fractionNeutral(pH: number, sites: readonly IonizableSite[]): number {
  let f = 1;
  for (const site of sites) f *= 1 - fractionSiteCharged(pH, site);
  return f;
}

/**
 * Distribution ratio D at a pH. `logKIon` defaults to logKNeutral − 3.5 (common practice).
 * A permanently charged molecule (fixedCharge ≠ 0) has no neutral form.
 */
export function distributionRatio(pH: number, sites: readonly IonizableSite[], logKNeutral: number,
  logKIon: number = logKNeutral + DEFAULT_ION_LOGK_OFFSET, fixedCharge = 0): number {
  const f0 = fixedCharge === 0 ? fractionNeutral(pH, sites) : 0;
  return 10 ** logKNeutral * f0 + 10 ** logKIon * (1 - f0);
}

export function logDistributionRatio(pH: number, sites: readonly IonizableSite[], logKNeutral: number,
  logKIon?: number, fixedCharge = 0): number {
  return Math.log10(distributionRatio(pH, sites, logKNeutral, logKIon, fixedCharge));
}

/** An acidic site more acidic than a basic site's conjugate acid: the net-neutral form is the internal salt. */
export function isZwitterionic(sites: readonly IonizableSite[]): boolean {
  let minAcid = Infinity;
  let maxBase = -Infinity;
  for (const s of sites) {
    if (s.kind === "acid") minAcid = Math.min(minAcid, s.pKa);
    else maxBase = Math.max(maxBase, s.pKa);
  }
  return minAcid < maxBase;
}

/** Isoelectric point of a simple ampholyte: mean of the two pKa values bracketing the zwitterion [S27]. */
export function isoelectricPoint(sites: readonly IonizableSite[]): number | null {
  if (!isZwitterionic(sites)) return null;
  const acids = sites.filter((s) => s.kind === "acid").map((s) => s.pKa);
  const bases = sites.filter((s) => s.kind === "base").map((s) => s.pKa);
  return (Math.min(...acids) + Math.max(...bases)) / 2;
}

/** Fraction of a solute extracted into the organic phase in one equilibration: E/(1+E), E = D·V_org/V_aq (§2.1). */
export function fractionExtracted(distribution: number, volumeOrganic: number, volumeAqueous: number, portions = 1): number {
  const e = (distribution * volumeOrganic) / volumeAqueous;
  return 1 - (1 / (1 + e)) ** portions;
}
