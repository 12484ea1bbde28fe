/**
 * Loss of volatile components on concentration, as a rate rather than a boiling-point cut-off.
 *  - Vapour pressures: Antoine constants where published (data/vapour-pressure.ts); otherwise integrated
 *    Clausius–Clapeyron from the normal boiling point with a Trouton-type entropy of vaporization,
 *    ΔS = R(4.4 + ln Tb) (Kistiakowsky's refinement of Trouton's rule), and ΔCp = −0.8·ΔS (Mackay, Bobra, Chan &
 *    Shiu, Environ. Sci. Technol. 1982, 16, 645; the form from memory, checked against published vapour pressures
 *    at 40 °C in tests/unit/chem/evaporation.test.ts).
 *  - The liquid in the flask is an ideal solution (Raoult's law): species j leaves at a rate proportional to its
 *    partial pressure x_j·P_j°, so the product co-evaporates with the solvent in the ratio of their vapour
 *    pressures (Rayleigh) and, once the solvent is gone, keeps evaporating from the neat residue for the rest of
 *    the time. Two transport terms: diffusion of vapour away from the liquid film (always), and bulk boiling when
 *    the liquid's total vapour pressure exceeds the set pressure, at a rate proportional to the superheat.
 *  - Bath temperature, pressure and time come from the step; the defaults follow common practice.
 * Everything is continuous in the boiling point, the bath temperature, the pressure and the time.
 */
import { SOLVENT_ANTOINE, type AntoineConstants } from "./data/vapour-pressure";

export const ATM_MBAR = 1013.25;
const KELVIN = 273.15;

export type ConcentrationMethod = "rotavap" | "high_vacuum" | "n2_stream" | "distillation";

/** Antoine equation in the NIST convention (log10 P/bar, T in K), in mbar. */
export function antoineMbar(a: AntoineConstants, tC: number): number {
  return 1000 * 10 ** (a.A - a.B / (tC + KELVIN + a.C));
}

/** Vapour pressure (mbar) of a liquid at tC estimated from its normal boiling point (Mackay et al. 1982 form). */
export function vapourPressureFromBp(bpC: number, tC: number): number {
  const tb = bpC + KELVIN;
  const r = tb / (tC + KELVIN);
  return ATM_MBAR * Math.exp(-(4.4 + Math.log(tb)) * (1.803 * (r - 1) - 0.803 * Math.log(r)));
}

/** Vapour pressure of a library solvent (mbar): its Antoine constants, else the boiling-point estimate. */
export function solventVapourPressure(key: string, bpC: number, tC: number): number {
  const a = SOLVENT_ANTOINE[key];
  return a ? antoineMbar(a, tC) : vapourPressureFromBp(bpC, tC);
}

/**
 * Pressures (mbar) assumed when the step gives none: a rotary evaporator is set by the "rule of 20" (solvent
 * boiling 20 °C below the bath; common practice), an oil pump on a manifold reaches about 0.5 mbar (memory), a
 * nitrogen stream and a distillation run at atmospheric pressure.
 */
export const DEFAULT_PRESSURE_MBAR = { high_vacuum: 0.5, n2_stream: ATM_MBAR, distillation: ATM_MBAR } as const;
export const RULE_OF_20_K = 20;
/** Minutes the flask stays on after the last solvent has gone, when the step gives no time (common practice:
 * a few minutes on the evaporator; an hour on the high-vacuum line). */
export const DEFAULT_MINUTES_AFTER_DRY: Record<ConcentrationMethod, number> = { rotavap: 5, n2_stream: 5, distillation: 0, high_vacuum: 60 };

/**
 * Transport constants (order-of-magnitude assumptions, stated so they can be replaced by a group's measurement):
 *  - diffusion from the liquid film: D ≈ 0.08 cm²/s for an organic vapour in air at 1 atm (memory), a 2 cm
 *    boundary layer over a 50 cm² film, D ∝ 1/P down to 10 mbar (below that the path to the trap limits) →
 *    4.6·10⁻³ mmol min⁻¹ mbar⁻¹ at 1 atm;
 *  - a nitrogen stream of about 1 L/min (41 mmol/min, common practice) leaves saturated with the vapour;
 *  - boiling on a rotary evaporator removes about 100 mmol/min (≈ 9 mL/min of ethyl acetate, ≈ 0.5 L/h; memory)
 *    at the rule-of-20 superheat of 20 K, in proportion to the superheat.
 */
const DIFFUSION_MMOL_PER_MIN_MBAR_1ATM = 4.6e-3;
const MIN_DIFFUSION_PRESSURE_MBAR = 10;
const N2_SWEEP_MMOL_PER_MIN = 41;
const BOIL_MMOL_PER_MIN_AT_20K = 100;
/** ΔH_vap/R for the superheat estimate: Trouton's rule (ΔS ≈ 10.5 R) at a typical solvent boiling point of 350 K. */
const TROUTON_DH_OVER_R = 10.5 * 350;
/** The solvent counts as gone below this fraction of its starting amount. */
const SOLVENT_GONE = 0.01;
const MAX_STEPS = 64;

export interface EvaporationConditions {
  method: ConcentrationMethod;
  bathC: number;
  pressureMbar: number;
  /** Total time on the evaporator, min; null: until the solvent is gone plus DEFAULT_MINUTES_AFTER_DRY. */
  minutes: number | null;
}

/**
 * Evaporates a liquid in place. `amounts` (mmol) and `pressures` (mbar, vapour pressure of each pure species at
 * the bath temperature) list the solvents first (`solventCount` of them, whose disappearance marks "dry"), then
 * the components. Returns the minutes simulated.
 */
export function evaporate(amounts: Float64Array, pressures: Float64Array, solventCount: number, c: EvaporationConditions): number {
  const n = amounts.length;
  const p = c.pressureMbar;
  const diffusion = c.method === "n2_stream"
    ? N2_SWEEP_MMOL_PER_MIN / p
    : DIFFUSION_MMOL_PER_MIN_MBAR_1ATM * (ATM_MBAR / Math.max(p, MIN_DIFFUSION_PRESSURE_MBAR));
  const boilRate = c.method === "n2_stream" ? 0 : BOIL_MMOL_PER_MIN_AT_20K / RULE_OF_20_K;
  const tK = c.bathC + KELVIN;
  let solvent0 = 0;
  for (let j = 0; j < solventCount; j++) solvent0 += amounts[j] as number;
  let end = c.minutes ?? Infinity;
  let dry = solvent0 <= 0;
  if (dry && c.minutes === null) end = DEFAULT_MINUTES_AFTER_DRY[c.method];
  let t = 0;
  for (let step = 0; step < MAX_STEPS && t < end; step++) {
    let total = 0, partial = 0, solventLeft = 0;
    for (let j = 0; j < n; j++) {
      const nj = amounts[j] as number;
      total += nj;
      partial += nj * (pressures[j] as number);
      if (j < solventCount) solventLeft += nj;
    }
    if (total <= 1e-15 || partial <= 0) break;
    if (!dry && solventLeft <= SOLVENT_GONE * solvent0) {
      dry = true;
      if (c.minutes === null) end = t + DEFAULT_MINUTES_AFTER_DRY[c.method];
      if (t >= end) break;
    }
    const pi = partial / total;
    // Superheat of the boiling liquid over its bubble point at the set pressure (Clausius–Clapeyron).
    const boil = pi > p ? (boilRate * tK * tK * Math.log(pi / p)) / TROUTON_DH_OVER_R : 0;
    const flux = diffusion * pi + boil;
    const perMbar = (diffusion + boil / pi) / total;
    let dt = (0.3 * total) / flux;
    if (dt > end - t || step === MAX_STEPS - 1) dt = end - t;
    if (!Number.isFinite(dt)) break;
    for (let j = 0; j < n; j++) {
      const pj = pressures[j] as number;
      if (pj > 0) amounts[j] = (amounts[j] as number) * Math.exp(-perMbar * pj * dt);
    }
    t += dt;
  }
  return t;
}
