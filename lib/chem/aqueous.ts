/**
 * Aqueous pH by charge balance. Every aqueous contact is solved for the pH at which cations and anions balance:
 * strong ions (Na⁺, Cl⁻, …), the weak acid–base systems of the reagents (carbonate, phosphate, citrate,
 * ammonium, hydrogen sulfate, …), water, and the mixture's own acids and bases — the last distributing between
 * the layers at the same time, so mass balance sits inside the root solve. In a contact (equilibrium.ts) the
 * balance runs on a(H⁺) with Davies activity coefficients (activity.ts); aqueousPh and reagentPh here keep
 * unit activities, the "ideal" pH of a fresh reagent.
 * The residual is monotone in pH, so a bracketed Brent solve on pH ∈ [−2, 16] always converges.
 */
import { N_SYSTEMS, SYSTEM_KA, SYSTEM_Z0, CARBONATE, type CompiledReagent } from "./library";

/** Ion product of water at 25 °C, pKw = 14.00 (standard value). */
export const KW = 1e-14;
/** Enthalpy of H⁺ + OH⁻ → H₂O: ΔfH°(H₂O, l) − ΔfH°(OH⁻, aq) = −285.830 + 230.015 = −55.8 kJ/mol (CODATA key values). */
export const HEAT_OF_NEUTRALIZATION_KJ_PER_MOL = -55.8;
/** CO₂ dissolved in water under 1 atm CO₂ at 25 °C, mol/L: Henry's law solubility 3.3–3.4·10⁻⁴ mol m⁻³ Pa⁻¹
 * (R. Sander, Atmos. Chem. Phys. 2015, 15, 4399, compilation; Weiss, Mar. Chem. 1974, 2, 203: 3.4·10⁻⁴). */
export const CO2_SATURATION_M = 0.034;
/** d ln k_H / d(1/T) of CO₂ in water, K (Sander 2015: 2400 K, as most of the evaluations it lists). */
export const CO2_HENRY_VAN_T_HOFF_K = 2400;

/** CO₂ dissolved under 1 atm CO₂ at `temperatureC`, mol/L: k_H(T) = k_H(298.15 K)·exp(2400·(1/T − 1/298.15)).
 * Within 3 % of Weiss's (1974) fit for pure water from 5 to 40 °C. NaN or no temperature: 25 °C. */
export function co2SaturationM(temperatureC: number): number {
  if (!Number.isFinite(temperatureC)) return CO2_SATURATION_M;
  return CO2_SATURATION_M * Math.exp(CO2_HENRY_VAN_T_HOFF_K * (1 / (temperatureC + 273.15) - 1 / 298.15));
}
export const PH_MIN = -2;
export const PH_MAX = 16;

/** Mean charge of an acid–base system at [H⁺] = h: z₀ minus the mean number of protons lost. */
export function systemMeanCharge(system: number, h: number): number {
  const ka = SYSTEM_KA[system] as Float64Array;
  let term = 1, sum = 1, lost = 0;
  for (let i = 0; i < ka.length; i++) {
    term *= (ka[i] as number) / h;
    sum += term;
    lost += (i + 1) * term;
  }
  return (SYSTEM_Z0[system] as number) - lost / sum;
}

/** Fraction of a system in its fully protonated form (H₂CO₃* for carbonate). */
export function systemFractionProtonated(system: number, h: number): number {
  const ka = SYSTEM_KA[system] as Float64Array;
  let term = 1, sum = 1;
  for (let i = 0; i < ka.length; i++) {
    term *= (ka[i] as number) / h;
    sum += term;
  }
  return 1 / sum;
}

/** Protons carried per formula unit relative to the fully deprotonated form. */
export function systemBoundProtons(system: number, h: number): number {
  const ka = SYSTEM_KA[system] as Float64Array;
  return ka.length - ((SYSTEM_Z0[system] as number) - systemMeanCharge(system, h)) ;
}

export interface ChargeBalance {
  /** Net positive charge concentration (mol/L) at this pH; decreasing in pH. */
  residual(pH: number): number;
}

/**
 * pH where the residual crosses zero: Brent's method inside [−2, 16]. With a guess (the previous contact's pH),
 * the bracket starts ±0.5 around it and widens until it holds the root, which saves most evaluations.
 */
export function solvePh(balance: ChargeBalance, guess = NaN, tolerance = 1e-9): number {
  let a = PH_MIN, b = PH_MAX, fa: number, fb: number;
  if (Number.isFinite(guess) && guess > PH_MIN && guess < PH_MAX) {
    let step = 0.5;
    a = Math.max(PH_MIN, guess - step);
    b = Math.min(PH_MAX, guess + step);
    fa = balance.residual(a);
    fb = balance.residual(b);
    while (fa < 0 && a > PH_MIN) { b = a; fb = fa; step *= 4; a = Math.max(PH_MIN, a - step); fa = balance.residual(a); }
    while (fb > 0 && b < PH_MAX) { a = b; fa = fb; step *= 4; b = Math.min(PH_MAX, b + step); fb = balance.residual(b); }
  } else {
    fa = balance.residual(a);
    fb = balance.residual(b);
  }
  if (fa <= 0) return a;
  if (fb >= 0) return b;
  return brent(balance, a, b, fa, fb, tolerance);
}

export interface SlopedChargeBalance {
  /** Net positive charge (mol/L) at this pH, with h = 10^−pH given; sets `slope`. */
  residualAt(pH: number, h: number): number;
  /** d(residual)/d(pH) at the pH last passed to residualAt(); negative. */
  readonly slope: number;
  /** Set by the solver: 10^−pH at the pH it returns. */
  rootH: number;
}

const tenToMinus = (pH: number): number => Math.exp(-pH * Math.LN10);

/** 1/k! for k = 0…12. */
const INV_FACTORIAL = Array.from({ length: 13 }, (_, k) => 1 / Array.from({ length: k }, (_, i) => i + 1).reduce((a, b) => a * b, 1));
const [, , C2 = 0, C3 = 0, C4 = 0, C5 = 0, C6 = 0, C7 = 0, C8 = 0, C9 = 0, C10 = 0, C11 = 0, C12 = 0] = INV_FACTORIAL;

/**
 * e^u for |u| ≤ 0.35 by its Taylor series, inlined unlike Math.exp, cut where the next term falls below 1e-17:
 * the last Newton steps are tiny and need only a few terms.
 */
function expSmall(u: number): number {
  const a = Math.abs(u);
  if (a <= 0.005) return 1 + u * (1 + u * (C2 + u * (C3 + u * (C4 + u * C5))));
  if (a <= 0.05) return 1 + u * (1 + u * (C2 + u * (C3 + u * (C4 + u * (C5 + u * (C6 + u * (C7 + u * C8)))))));
  return 1 + u * (1 + u * (C2 + u * (C3 + u * (C4 + u * (C5 + u * (C6 + u * (C7 + u * (C8 + u * (C9 + u * (C10 + u * (C11 + u * C12)))))))))));
}

function rootAt(balance: SlopedChargeBalance, pH: number, h: number): number {
  balance.rootH = h;
  return pH;
}

/** 10^−(x + step) from h = 10^−x. */
export function shiftH(h: number, x: number, step: number): number {
  const u = -step * Math.LN10;
  return Math.abs(u) <= 0.35 ? h * expSmall(u) : tenToMinus(x + step);
}

/** Longest step taken before the root is bracketed, pH units. */
const MAX_OPEN_STEP = 3;

/** Newton steps shorter than this (pH units) end the search; the step taken leaves an error of order its square
 * (about 1e-10, below solvePh's tolerance of 1e-9). */
export const NEWTON_STEP_TOLERANCE = 1e-5;

/**
 * pH where the residual crosses zero, by Newton steps on the analytic slope kept inside a shrinking bracket,
 * with a bisection whenever a step would leave the bracket or fails to halve the step before it (the rule of
 * "rtsafe", Press et al., Numerical Recipes, §9.4); clamped to [−2, 16] as solvePh is. Started within a few
 * tenths of the root it converges quadratically: about four evaluations to a pH good to ~1e-10. `guessH`, if
 * given, is 10^−guess. A looser `stepTolerance` stops earlier, for a caller that refines the root itself; a caller
 * that has just evaluated the balance at the guess passes `residualAtGuess` (the slope is read from the balance).
 */
export function solvePhWithSlope(balance: SlopedChargeBalance, guess = NaN, guessH = NaN, stepTolerance = NEWTON_STEP_TOLERANCE,
  residualAtGuess = NaN): number {
  let lo = PH_MIN, hi = PH_MAX;
  let loChecked = false, hiChecked = false;
  const usable = Number.isFinite(guess) && guess > PH_MIN && guess < PH_MAX;
  let x = usable ? guess : 7;
  let h = usable && guessH > 0 ? guessH : tenToMinus(x);
  let stepBefore = PH_MAX - PH_MIN, lastStep = stepBefore;
  for (let iter = 0; iter < 200; iter++) {
    const f = iter === 0 && usable && !Number.isNaN(residualAtGuess) ? residualAtGuess : balance.residualAt(x, h);
    if (f === 0) return rootAt(balance, x, h);
    if (f > 0) { lo = x; loChecked = true; } else { hi = x; hiChecked = true; }
    const slope = balance.slope;
    const step = slope < 0 ? -f / slope : NaN;
    if (Math.abs(step) < stepTolerance) {
      const root = x + step;
      if (root > PH_MIN && root < PH_MAX) return rootAt(balance, root, shiftH(h, x, step));
      const clamped = root <= PH_MIN ? PH_MIN : PH_MAX;
      return rootAt(balance, clamped, tenToMinus(clamped));
    }
    let next = x + step;
    if (!(loChecked && hiChecked)) {
      // Not yet bracketed: Newton crawls down the exponential tails of the balance (steps of about 0.43 pH
      // shrinking by a steady ratio r), so such a step is stretched by 1/(1 − r), the rest of the series, and
      // no step goes beyond MAX_OPEN_STEP; an end of the range is tested only when a step would pass it.
      const r = step / lastStep;
      const stretched = r > 0.5 && r < 1 ? step * Math.min(4, 1 / (1 - r)) : step;
      next = x + Math.max(-MAX_OPEN_STEP, Math.min(MAX_OPEN_STEP, stretched));
    }
    if (!(next > lo && next < hi && (!(loChecked && hiChecked) || Math.abs(step) <= 0.5 * Math.abs(stepBefore)))) {
      // A root beyond an end never evaluated: test that end once (solvePh's clamp), else bisect.
      if (next <= lo && !loChecked) {
        loChecked = true;
        if (balance.residualAt(PH_MIN, tenToMinus(PH_MIN)) <= 0) return rootAt(balance, PH_MIN, tenToMinus(PH_MIN));
      } else if (next >= hi && !hiChecked) {
        hiChecked = true;
        if (balance.residualAt(PH_MAX, tenToMinus(PH_MAX)) >= 0) return rootAt(balance, PH_MAX, tenToMinus(PH_MAX));
      }
      next = 0.5 * (lo + hi);
      if (hi - lo < 1e-10) return rootAt(balance, next, tenToMinus(next));
    }
    stepBefore = lastStep;
    lastStep = next - x;
    h = shiftH(h, x, next - x);
    x = next;
  }
  return rootAt(balance, x, tenToMinus(x));
}

function brent(balance: ChargeBalance, a: number, b: number, fa: number, fb: number, tolerance: number): number {
  let c = a, fc = fa, d = b - a, e = d;
  for (let iter = 0; iter < 100; iter++) {
    if ((fb > 0) === (fc > 0)) { c = a; fc = fa; d = b - a; e = d; }
    if (Math.abs(fc) < Math.abs(fb)) { a = b; b = c; c = a; fa = fb; fb = fc; fc = fa; }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tolerance;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number, q: number;
      if (a === c) { p = 2 * m * s; q = 1 - s; } else {
        const qq = fa / fc, r = fb / fc;
        p = s * (2 * m * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q; else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) { e = d; d = p / q; } else { d = m; e = m; }
    } else { d = m; e = m; }
    a = b; fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = balance.residual(b);
  }
  return b;
}

/** A plain aqueous solution: net strong-ion charge (mol/L) and the total of each acid–base system (mol/L). */
export interface AqueousComposition {
  strongCharge: number;
  systems: ArrayLike<number>;
  /** Extra acids and bases (e.g. the mixture's own), as independent sites with total concentration, mol/L. */
  solutes?: { concentration: number; sites: { pKa: number; kind: "acid" | "base" }[] }[];
}

class PlainBalance implements ChargeBalance {
  constructor(private readonly c: AqueousComposition) {}
  residual(pH: number): number {
    const h = 10 ** -pH;
    let f = this.c.strongCharge + h - KW / h;
    for (let s = 0; s < N_SYSTEMS; s++) {
      const t = this.c.systems[s] ?? 0;
      if (t > 0) f += t * systemMeanCharge(s, h);
    }
    for (const sol of this.c.solutes ?? []) {
      let z = 0;
      for (const site of sol.sites) {
        const ka = 10 ** -site.pKa;
        z += site.kind === "acid" ? -ka / (h + ka) : h / (h + ka);
      }
      f += sol.concentration * z;
    }
    return f;
  }
}

/** pH of an aqueous solution by charge balance (ideal activities). */
export function aqueousPh(composition: AqueousComposition): number {
  return solvePh(new PlainBalance(composition));
}

/** pH of a fresh reagent solution (kept on the compiled reagent); NaN for solids. */
export function reagentPh(r: CompiledReagent): number {
  if (r.solid) return NaN;
  if (Number.isNaN(r.freshPh)) r.freshPh = aqueousPh({ strongCharge: r.strongCharge, systems: r.systems });
  return r.freshPh;
}

/** CO₂ above saturation in an aqueous phase, mmol, that leaves as gas (carbonate total in mmol, volume in mL). */
export function co2Excess(carbonateMmol: number, volumeMl: number, h: number): number {
  const dissolved = carbonateMmol * systemFractionProtonated(CARBONATE, h);
  return Math.max(0, dissolved - CO2_SATURATION_M * volumeMl);
}
