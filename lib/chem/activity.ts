/**
 * Activity coefficients by the Davies equation (C. W. Davies, Ion Association, Butterworths 1962):
 *   log γ_z = −A·z²·(√I/(1 + √I) − 0.3·I),   A = 0.509 (kg/mol)^½ at 25 °C (Debye–Hückel constant for water,
 * Robinson & Stokes, Electrolyte Solutions, 2nd ed. 1959).
 * The pH the engine reports is −log a(H⁺), the quantity a calibrated meter and the NIST standard buffers refer to
 * (R. G. Bates, Determination of pH, Wiley 1973). Each acid dissociation of a species of charge z into one of
 * charge z − 1 then has the concentration constant K′ = K·γ_z/γ_{z−1} = K·10^(−A·F·(2z − 1)), F the bracket above;
 * neutral species keep γ = 1. The equation is meant for I up to about 0.5 mol/L; above that it is an estimate
 * (brine, 1 M acid and base washes).
 */

/** Debye–Hückel A for water at 25 °C, (kg/mol)^½. */
export const DAVIES_A = 0.509;

/** A·(√I/(1 + √I) − 0.3·I): −log γ of a singly charged ion; z² times it for charge z. */
export function daviesTerm(ionicStrength: number): number {
  const i = Math.max(0, ionicStrength);
  const r = Math.sqrt(i);
  return DAVIES_A * (r / (1 + r) - 0.3 * i);
}

/** Activity coefficient of an ion of charge z at ionic strength I (mol/L). */
export function activityCoefficient(z: number, ionicStrength: number): number {
  return 10 ** (-z * z * daviesTerm(ionicStrength));
}

/** K′/K for the dissociation of a species of charge z (into charge z − 1), with `term` = daviesTerm(I). */
export function dissociationFactor(z: number, term: number): number {
  return Math.exp(-term * (2 * z - 1) * Math.LN10);
}
