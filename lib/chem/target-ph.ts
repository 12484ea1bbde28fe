/**
 * How much of a reagent brings the current stream to a target pH (adjust_ph): the least volume, within a factor
 * 1 + 1e-6, at which the pH has reached the target (pH is monotone in the volume), searched between 1e-9 mL and
 * ten times the liquid present. Without carbonate the search reads the sign of the charge balance held at the
 * target pH, which says on which side the mixture's pH lies without solving for it and is nearly linear in the
 * volume; with carbonate, whose CO₂ leaves after a first pH solve, it solves for the pH at each trial volume.
 */
import { reagentPh } from "./aqueous";
import { CARBONATE, WATER, type CompiledReagent } from "./library";
import { type Simulator } from "./simulator";

export interface TargetPhVolume {
  volumeMl: number;
  /**
   * "already": the stream is within AT_TARGET_PH of the target; "wrong_direction": the reagent moves the pH away
   * from the target (nothing is added); "short": even the largest volume does not reach it.
   */
  outcome: "already" | "reached" | "short" | "wrong_direction";
  /** pH of the stream before any reagent. */
  startPh: number;
}

/** A stream this close to the target pH needs no adjustment (the reading of a calibrated meter, ±0.05; common practice). */
export const AT_TARGET_PH = 0.05;

export function volumeForTargetPh(sim: Simulator, r: CompiledReagent, target: number): TargetPhVolume {
  const mixWith = (vol: number) => {
    const mix = sim.scratch(0);
    mix.addFrom(sim.current, 1);
    const fresh = sim.scratch(1);
    fresh.addReagent(r, vol, sim.lib.density[WATER] as number);
    mix.addFrom(fresh, 1);
    return mix;
  };
  const phWith = (vol: number) => {
    sim.eq.equilibrate(mixWith(vol), sim.scratch(2), sim.scratch(3));
    return sim.eq.pH;
  };
  const least = 1e-9;
  const start = phWith(least);
  const raising = reagentPh(r) > start;
  if (Math.abs(target - start) <= AT_TARGET_PH) return { volumeMl: 0, outcome: "already", startPh: start };
  if (raising !== target > start) return { volumeMl: 0, outcome: "wrong_direction", startPh: start };
  // Still short of the target at volume `vol` when positive.
  const byCharge = (sim.current.sys[CARBONATE] as number) === 0 && (r.systems[CARBONATE] as number) === 0;
  const shortfall = byCharge
    ? (vol: number) => (raising ? -1 : 1) * sim.eq.chargeAt(mixWith(vol), target)
    : (vol: number) => (raising ? target - phWith(vol) : phWith(vol) - target);
  const most = Math.max(1, sim.current.totalVolume()) * 10;
  const sMost = shortfall(most);
  if (sMost > 0) return { volumeMl: most, outcome: "short", startPh: start };
  return { volumeMl: volumeToTarget(shortfall, least, shortfall(least), most, sMost, !byCharge), outcome: "reached", startPh: start };
}

/**
 * The smallest volume (within a factor 1 + 1e-6) at which `shortfall`, decreasing in volume, is no longer
 * positive, `lo`/`hi` bracketing it: regula falsi with the Illinois modification (Dowell & Jarratt, BIT 11
 * (1971) 168), which keeps a bracket as bisection does but converges superlinearly. On ln V for a shortfall in
 * pH units; on V itself for a shortfall in charge, which is nearly linear in it.
 */
function volumeToTarget(shortfall: (v: number) => number, lo: number, sLo: number, hi: number, sHi: number, logScale: boolean): number {
  let a = logScale ? Math.log(lo) : lo, fa = sLo, b = logScale ? Math.log(hi) : hi, fb = sHi;
  let vLo = lo, vHi = hi, side = 0;
  for (let i = 0; i < 200 && vHi > vLo * (1 + 1e-6); i++) {
    let c = fb === fa ? Number.NaN : (a * fb - b * fa) / (fb - fa);
    if (!(c > a && c < b)) c = 0.5 * (a + b);
    const vc = logScale ? Math.exp(c) : c;
    const fc = shortfall(vc);
    if (fc > 0) {
      a = c;
      fa = fc;
      vLo = vc;
      if (side === -1) fb /= 2;
      side = -1;
    } else {
      b = c;
      fb = fc;
      vHi = vc;
      if (side === 1) fa /= 2;
      side = 1;
    }
  }
  return vHi;
}
