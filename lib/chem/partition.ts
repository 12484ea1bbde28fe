/**
 * Solvent-specific partition coefficients of neutral solutes, and the corrections applied at each contact.
 *  - A group's own value for the compound and solvent (component.logK[solvent]) overrides every estimate.
 *  - Abraham solvation equations (abraham.ts) from the solute's descriptors (component.abraham, else the measured
 *    table looked up by canonical SMILES) and the solvent's published coefficients (data/abraham-solvents.ts);
 *    standard error from the validation against measured partition data (bench:partition). A measured octanol
 *    log P anchors estimated descriptors only.
 *  - Salting out moves the neutral form; the salt concentration is the aqueous layer's ionic strength (phases.ts).
 *  - Otherwise Collander-type lines log K_s = a·log P_oct + b (Collander 1951; Leo, Hansch & Elkins 1971), one
 *    line for H-bond-donor solutes and one for the rest; coefficients and their confidence in data/solvents.ts.
 *  - Salting out of neutrals (Setschenow): log K rises by K_s·I; K_s per compound from 0.04·log P + 0.114 L/mol
 *    (correlation attributed to Ni & Yalkowsky, Int. J. Pharm. 2003, 254, 167; from memory) unless given.
 *  - Cosolvency (log-linear model, Yalkowsky & Roseman 1981): a water-miscible solvent at volume fraction f in
 *    the aqueous phase raises aqueous solubility by 10^(σ·f), so log K falls by σ·f; σ = m·log P + n
 *    (form of Li & Yalkowsky 1998).
 */
import { abrahamEstimate, componentDescriptors, solventAsSolute, type AbrahamEstimate } from "./abraham";
import { ABRAHAM_SOLVENTS } from "./data/abraham-solvents";
import { type SolventProps } from "./data/solvents";
import { type Component, type LogValue } from "./schema";

/** Standard error (log units) of a log P by provenance when none is given (issue 3: estimated ±0.7). */
export const LOGP_SE_BY_PROVENANCE: Record<LogValue["provenance"], number> = { measured: 0.1, literature: 0.2, group: 0.3, estimated: 0.7 };

/** Salting-out gain is capped: the linear Setschenow form is least reliable above 2–3 M (§2.5, memory). */
export const MAX_SALTING_OUT_LOG_GAIN = 1.5;
export const MAX_SETSCHENOW_SALT_M = 6;

export interface SolventLogK {
  value: number;
  /** Standard error of the value, log units: the component's own, or log P's combined with the line's. */
  se: number;
  origin: "component" | "abraham" | "collander";
  provenance: LogValue["provenance"];
}

/**
 * Standard error of a log K from group-contribution descriptors (Platts et al. 1999): the validation RMSE over the
 * measured rows whose compounds have no measured descriptors (bench:partition, seven solvents pooled, n = 98),
 * anchored on the measured octanol log P (0.64) or not (0.99).
 */
export const ESTIMATED_DESCRIPTORS_SE = { anchored: 0.64, alone: 0.99 } as const;

/** True when the solute is an H-bond donor (carboxylic acid, phenol, alcohol): taken from its acidic sites. */
export function isHBondDonor(c: Pick<Component, "pKas">): boolean {
  return c.pKas.some((p) => p.kind === "acid");
}

export function collanderLogK(logP: number, solvent: SolventProps, donor: boolean): number {
  const m = solvent.partition;
  if (!m) throw new Error(`solvent '${solvent.key}' is water-miscible and has no partition line`);
  const line = donor ? m.donor : m.acceptor;
  return line.a * logP + line.b;
}

/** Standard error of a log K predicted from a Collander line (exported for the uncertainty engine). */
export function partitionModelSe(solvent: SolventProps): number {
  return solvent.partition?.se ?? 1;
}

/**
 * The solvent-translation standard error a component's log P carries in the Monte Carlo (perturb.ts), given the
 * immiscible solvents of the work-up and the Collander-line figure `lineSd` for them: the validated Abraham
 * standard error of each solvent the component's estimated descriptors cover (a log P draw reaches that log K
 * through anchoring), nothing for measured descriptors (their log K does not follow log P), `lineSd` otherwise.
 */
export function componentTranslationSd(c: Pick<Component, "smiles" | "abraham">, solventKeys: readonly string[], lineSd: number): number {
  if (!(lineSd > 0)) return 0;
  const estimated = componentDescriptors(c)?.provenance === "estimated";
  let sd = 0;
  for (const key of solventKeys) {
    const ab = componentAbraham(c, key);
    sd = Math.max(sd, ab ? (estimated ? Math.max(ab.se, ESTIMATED_DESCRIPTORS_SE.anchored) : 0) : lineSd);
  }
  return sd;
}

/** The octanol–water log P, or one back-calculated from any solvent log K the component carries. */
export function effectiveLogP(c: Pick<Component, "logP" | "logK" | "pKas">, solvents: Readonly<Record<string, SolventProps>>): LogValue | null {
  if (c.logP) return c.logP;
  for (const [key, v] of Object.entries(c.logK)) {
    const line = solvents[key]?.partition;
    if (!line) continue;
    const l = isHBondDonor(c) ? line.donor : line.acceptor;
    return { value: (v.value - l.b) / l.a, provenance: v.provenance, se: Math.hypot(v.se ?? LOGP_SE_BY_PROVENANCE[v.provenance], line.se) };
  }
  return null;
}

/**
 * log K of the neutral form between `solvent` and water: the component's own value, else the Abraham equation
 * (anchored on a given octanol log P, see abrahamLogK), else the Collander line.
 */
export function solventLogK(c: Pick<Component, "logP" | "logK" | "pKas" | "smiles" | "abraham">, solvent: SolventProps,
  solvents: Readonly<Record<string, SolventProps>>): SolventLogK | null {
  const own = c.logK[solvent.key];
  if (own) return { value: own.value, se: own.se ?? LOGP_SE_BY_PROVENANCE[own.provenance], origin: "component", provenance: own.provenance };
  const ab = componentAbraham(c, solvent.key);
  if (ab) {
    const d = componentDescriptors(c);
    const anchor = anchorLogP(c);
    const se = d?.provenance === "estimated" ? Math.max(ab.se, anchor === undefined ? ESTIMATED_DESCRIPTORS_SE.alone : ESTIMATED_DESCRIPTORS_SE.anchored) : ab.se;
    return { value: abrahamLogK(ab, anchor), se, origin: "abraham", provenance: d?.provenance ?? "literature" };
  }
  const logP = effectiveLogP(c, solvents);
  if (!logP || !solvent.partition) return null;
  const se = Math.hypot(logP.se ?? LOGP_SE_BY_PROVENANCE[logP.provenance], partitionModelSe(solvent));
  return { value: collanderLogK(logP.value, solvent, isHBondDonor(c)), se, origin: "collander", provenance: logP.provenance };
}

/** Setschenow constant in NaCl, L/mol: 0.04·log P + 0.114 (the correlation of the Armitage/Kramer in-vitro distribution model; attribution to Ni & Yalkowsky 2003 from memory). */
export function setschenowConstant(logP: number): number {
  return Math.max(0, 0.04 * logP + 0.114);
}

/** Rise in log K of a neutral solute from salt at concentration `saltM` (mol/L), capped (§2.5). */
export function saltingOutShift(setschenowK: number, saltM: number): number {
  return Math.min(MAX_SALTING_OUT_LOG_GAIN, setschenowK * Math.min(saltM, MAX_SETSCHENOW_SALT_M));
}

/** Cosolvency power σ = log(S_cosolvent/S_water) of a solute in a water-miscible solvent; never negative here. */
export function cosolvencyPower(logP: number, cosolvent: SolventProps): number {
  const c = cosolvent.cosolvency;
  if (!c) return 0;
  return Math.max(0, c.m * logP + c.n);
}

/** Fall in log K when the aqueous phase holds a water-miscible solvent at volume fraction f (log-linear model). */
export function cosolvencyShift(sigma: number, volumeFraction: number): number {
  return -sigma * volumeFraction;
}

/**
 * The component's Abraham estimate for a solvent (unanchored). Cached per descriptor object and solvent key: the
 * engine asks on every run and Monte-Carlo draw, and stored work-ups arrive as new component objects that still
 * share their descriptor objects (the table's entries or the component's own `abraham`).
 */
const abrahamCache = new WeakMap<object, Map<string, AbrahamEstimate | null>>();
export function componentAbraham(c: Pick<Component, "smiles" | "abraham">, solventKey: string): AbrahamEstimate | null {
  const d = componentDescriptors(c);
  if (!d) return null;
  let bySolvent = abrahamCache.get(d);
  if (!bySolvent) { bySolvent = new Map(); abrahamCache.set(d, bySolvent); }
  const hit = bySolvent.get(solventKey);
  if (hit !== undefined) return hit;
  const coefficients = ABRAHAM_SOLVENTS[solventKey];
  const est = coefficients ? abrahamEstimate(d, coefficients) : null;
  bySolvent.set(solventKey, est);
  return est;
}

/**
 * The log P an Abraham estimate is anchored on: a given value that is not itself an estimate, and only when the
 * descriptors are estimated. Measured descriptors are left alone: on the validation set (bench:partition, MNSol
 * rows with an octanol value) anchoring them raised the RMSE for every solvent but heptane (EtOAc 0.18 → 0.23,
 * chloroform 0.20 → 0.34, ether 0.23 → 0.32, toluene 0.20 → 0.30, hexane 0.19 → 0.28; heptane 0.26 both).
 */
export function anchorLogP(c: Pick<Component, "logP" | "smiles" | "abraham">): number | undefined {
  if (!c.logP || c.logP.provenance === "estimated") return undefined;
  const d = componentDescriptors(c);
  return d && d.provenance !== "estimated" ? undefined : c.logP.value;
}

/**
 * Whether a given octanol–water log P shifts an Abraham estimate from estimated descriptors:
 * log K_s += β_s·(log P − predicted log P), β_s the ratio of the solvent's size coefficient to octanol's (the
 * residual is put on the size term).
 */
export const ANCHOR_ON_LOGP = true;

/** An Abraham estimate, anchored on the octanol log P when ANCHOR_ON_LOGP and a log P is given. */
export function abrahamLogK(est: AbrahamEstimate, logP: number | undefined, anchor = ANCHOR_ON_LOGP): number {
  if (!anchor || logP === undefined || !Number.isFinite(logP) || !Number.isFinite(est.octanol)) return est.value;
  return est.value + est.beta * (logP - est.octanol);
}

/**
 * Distribution ratio of a water-miscible solvent between an organic solvent and water: the Abraham equation with
 * the cosolvent's own measured descriptors where both are known, else the Collander line on its log P.
 */
export function cosolventLogK(cosolvent: SolventProps, organic: SolventProps): number {
  const solute = solventAsSolute(cosolvent.key);
  const coefficients = ABRAHAM_SOLVENTS[organic.key];
  const est = solute && coefficients ? abrahamEstimate(solute, coefficients) : null;
  if (est) return est.value;
  if (!organic.partition) return 0;
  const donor = cosolvent.family === "alcohol";
  return collanderLogK(cosolvent.logP.value, organic, donor);
}
