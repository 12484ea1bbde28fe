/**
 * Solvent library shipped to groups (the app stores an editable copy). Every value carries its source key
 * (data/sources.ts) and confidence; values at about 20–25 °C. Keys are the names used in work-up records.
 * Collander lines log K(solvent/water) = a·log P(octanol/water) + b are given separately for H-bond-donor
 * solutes (acids, phenols, alcohols) and for the rest, following Leo, Hansch & Elkins 1971. Only the ether,
 * chloroform, benzene and n-butanol lines are recalled from that paper (memory); the others are assumptions by
 * analogy and carry a wide standard error that the uncertainty engine propagates. They are the fallback: a
 * component with Abraham descriptors is partitioned by the solvation equations of data/abraham-solvents.ts.
 */
import { type Confidence, type Sourced } from "./sources";

export type SolventFamily = "water" | "ester" | "ether" | "chlorinated" | "aromatic" | "alkane" | "alcohol" | "nitrile" | "ketone" | "amide" | "sulfoxide";

export interface CollanderLine { a: number; b: number }

export interface SolventPartitionModel {
  donor: CollanderLine;
  acceptor: CollanderLine;
  /** Standard error of a predicted log K from this line (log units). */
  se: number;
  source: string;
  confidence: Confidence;
}

export interface SolventProps {
  key: string;
  name: string;
  family: SolventFamily;
  density: Sourced;
  bpC: Sourced;
  /** Octanol–water log P of the solvent itself; sets how a water-miscible solvent splits between the layers. */
  logP: Sourced;
  waterMiscible: boolean;
  /** Mass % of solvent in the water-rich phase at saturation (null when miscible). */
  solventInWaterWtPct: Sourced | null;
  /** Mass % of water in the solvent-rich phase at saturation (null when miscible). */
  waterInSolventWtPct: Sourced | null;
  chlorinated: boolean;
  peroxideFormer: boolean;
  /** Lipophilic ion pairs (protonated amine + TFA/OTf/OTs/BF₄⁻/PF₆⁻/I⁻) extract into it (§2.2). */
  ionPairCapable: boolean;
  dipolarAprotic: boolean;
  reproductiveToxicant: boolean;
  /** Collander lines; absent for water-miscible solvents. */
  partition: SolventPartitionModel | null;
  /** log K_ion − log K_neutral for ions with a hydrophilic counter-ion (common practice: −3.5 for polar solvents). */
  ionLogKOffset: number;
  /** log K_ion − log K_neutral for ions with a lipophilic counter-ion (ion pairs). */
  ionPairLogKOffset: number;
  /** Cosolvency power σ = m·log P(solute) + n (log-linear model); water-miscible solvents only. */
  cosolvency: { m: number; n: number; source: string; confidence: Confidence } | null;
}

const s = (value: number, source: string, confidence: Confidence, tempC?: number): Sourced =>
  tempC === undefined ? { value, source, confidence } : { value, source, confidence, tempC };
const mem = (value: number, tempC?: number) => s(value, "memory", "memory", tempC);
const pc = (value: number, tempC: number) => s(value, "CRC-PC", "confirmed_digitized", tempC);
const logp = (value: number) => s(value, "CRC-logP", "confirmed_digitized");

/** Ether lines (donors 1.130/−0.170; acceptors 1.142/−1.070): Leo, Hansch & Elkins 1971, memory, moderate. */
const ETHER: SolventPartitionModel = { donor: { a: 1.13, b: -0.17 }, acceptor: { a: 1.142, b: -1.07 }, se: 0.5, source: "Leo-Hansch-Elkins", confidence: "memory" };
/** Chloroform lines (donors 1.126/−1.343; acceptors 1.276/+0.171): Leo, Hansch & Elkins 1971, memory, low. */
const CHLOROFORM: SolventPartitionModel = { donor: { a: 1.126, b: -1.343 }, acceptor: { a: 1.276, b: 0.171 }, se: 0.6, source: "Leo-Hansch-Elkins", confidence: "memory" };
/** Benzene lines (donors 1.015/−1.402; acceptors 1.223/−0.573): Leo, Hansch & Elkins 1971, memory, low. */
const AROMATIC: SolventPartitionModel = { donor: { a: 1.015, b: -1.402 }, acceptor: { a: 1.223, b: -0.573 }, se: 0.6, source: "Leo-Hansch-Elkins", confidence: "memory" };
/** Alkanes: slopes well above 1 for donors (Leo, Hansch & Elkins, memory); the numbers are an assumption. */
const ALKANE: SolventPartitionModel = { donor: { a: 1.3, b: -2.6 }, acceptor: { a: 1.15, b: -1.2 }, se: 1.0, source: "assumed", confidence: "assumed" };
/** Esters (EtOAc, iPrOAc): wet, H-bond-accepting like wet octanol; taken as octanol (assumption). */
const ESTER: SolventPartitionModel = { donor: { a: 1.0, b: 0.0 }, acceptor: { a: 1.0, b: -0.1 }, se: 0.6, source: "assumed", confidence: "assumed" };

type Row = Omit<SolventProps, "ionLogKOffset" | "ionPairLogKOffset" | "dipolarAprotic" | "reproductiveToxicant" | "cosolvency" | "partition" | "chlorinated" | "peroxideFormer" | "ionPairCapable"> & Partial<SolventProps>;

function solvent(r: Row): SolventProps {
  const chlorinated = r.chlorinated ?? r.family === "chlorinated";
  const nonPolar = r.family === "alkane" || r.family === "aromatic" || r.family === "ether";
  return {
    chlorinated,
    peroxideFormer: false,
    ionPairCapable: chlorinated,
    dipolarAprotic: false,
    reproductiveToxicant: false,
    partition: null,
    cosolvency: null,
    // Octanol-type solvents: ions ~3.5 log units below the neutral (common practice); far lower in
    // alkanes, aromatics and ethers (§2.2; the −5 is an assumption). Lipophilic ion pairs in chlorinated
    // solvents: −1.5 (assumption; ion-pair extraction grows with counter-ion lipophilicity, Yoshida 1998).
    ionLogKOffset: nonPolar ? -5 : -3.5,
    ionPairLogKOffset: chlorinated ? -1.5 : nonPolar ? -4.5 : -3,
    ...r,
  };
}

/** Cosolvency power of a water-miscible solvent: σ = 0.9·log P + 0.5 (form from Li & Yalkowsky 1998; numbers memory). */
const COSOLVENT = { m: 0.9, n: 0.5, source: "Li-Yalkowsky", confidence: "memory" as Confidence };

const list: SolventProps[] = [
  solvent({ key: "water", name: "Water", family: "water", density: s(0.9982, "water-dens", "secondary", 20), bpC: s(100, "CRC-PC", "confirmed"), logP: mem(-1.38), waterMiscible: true, solventInWaterWtPct: null, waterInSolventWtPct: null }),
  solvent({ key: "etoac", name: "Ethyl acetate", family: "ester", density: pc(0.9003, 20), bpC: pc(77.1, 20), logP: logp(0.73), waterMiscible: false,
    solventInWaterWtPct: s(8.3, "Merck-EtOAc", "derived", 25), waterInSolventWtPct: s(3.3, "Merck-EtOAc", "confirmed"), partition: ESTER }),
  solvent({ key: "ipac", name: "Isopropyl acetate", family: "ester", density: pc(0.8662, 25), bpC: pc(88.6, 25), logP: mem(1.02), waterMiscible: false,
    solventInWaterWtPct: mem(2.9, 20), waterInSolventWtPct: mem(1.8), partition: { ...ESTER, se: 0.7 } }),
  solvent({ key: "et2o", name: "Diethyl ether", family: "ether", density: pc(0.7138, 20), bpC: pc(34.4, 20), logP: logp(0.89), waterMiscible: false, peroxideFormer: true,
    solventInWaterWtPct: s(6.9, "vendor-Et2O", "secondary", 20), waterInSolventWtPct: mem(1.3), partition: ETHER }),
  solvent({ key: "mtbe", name: "tert-Butyl methyl ether", family: "ether", density: pc(0.7353, 25), bpC: pc(55.1, 25), logP: logp(0.94), waterMiscible: false,
    solventInWaterWtPct: mem(4.8, 20), waterInSolventWtPct: mem(1.5), partition: { ...ETHER, se: 0.7, source: "assumed (ether lines)", confidence: "assumed" } }),
  solvent({ key: "2-methf", name: "2-Methyltetrahydrofuran", family: "ether", density: pc(0.8552, 20), bpC: pc(80.0, 20), logP: logp(1.85), waterMiscible: false, peroxideFormer: true,
    solventInWaterWtPct: s(14.4, "S13", "secondary", 19.3), waterInSolventWtPct: s(4.4, "S13", "secondary", 23),
    partition: { donor: { a: 1.0, b: 0.0 }, acceptor: { a: 1.0, b: -0.3 }, se: 0.8, source: "assumed (between ester and ether)", confidence: "assumed" } }),
  solvent({ key: "cpme", name: "Cyclopentyl methyl ether", family: "ether", density: mem(0.86, 20), bpC: mem(106), logP: mem(1.59), waterMiscible: false, peroxideFormer: true,
    solventInWaterWtPct: s(1.1, "CPME-mfr", "secondary", 23), waterInSolventWtPct: mem(0.3), partition: { ...ETHER, se: 0.8, source: "assumed (ether lines)", confidence: "assumed" } }),
  solvent({ key: "dcm", name: "Dichloromethane", family: "chlorinated", density: pc(1.3266, 20), bpC: pc(39.8, 20), logP: logp(1.25), waterMiscible: false,
    solventInWaterWtPct: s(1.3, "OSHA-DCM", "confirmed", 20), waterInSolventWtPct: mem(0.2), partition: { ...CHLOROFORM, se: 0.7, source: "assumed (chloroform lines)", confidence: "assumed" } }),
  solvent({ key: "chcl3", name: "Chloroform", family: "chlorinated", density: pc(1.4788, 25), bpC: pc(61.2, 25), logP: logp(1.97), waterMiscible: false,
    solventInWaterWtPct: s(0.79, "IUPAC-NIST-CHCl3", "confirmed", 25), waterInSolventWtPct: s(0.0758, "IUPAC-NIST-CHCl3", "confirmed", 25), partition: CHLOROFORM }),
  solvent({ key: "dce", name: "1,2-Dichloroethane", family: "chlorinated", density: pc(1.2454, 25), bpC: pc(83.4, 25), logP: mem(1.48), waterMiscible: false,
    solventInWaterWtPct: mem(0.86), waterInSolventWtPct: mem(0.19), partition: { ...CHLOROFORM, se: 0.8, source: "assumed (chloroform lines)", confidence: "assumed" } }),
  solvent({ key: "toluene", name: "Toluene", family: "aromatic", density: pc(0.8623, 25), bpC: pc(110.6, 25), logP: logp(2.73), waterMiscible: false,
    solventInWaterWtPct: s(0.067, "Merck-tol", "confirmed", 23.5), waterInSolventWtPct: mem(0.04), partition: { ...AROMATIC, se: 0.7, source: "assumed (benzene lines)", confidence: "assumed" } }),
  solvent({ key: "hexane", name: "Hexane", family: "alkane", density: pc(0.6606, 25), bpC: pc(68.7, 25), logP: logp(4.0), waterMiscible: false, reproductiveToxicant: false,
    solventInWaterWtPct: mem(0.001), waterInSolventWtPct: mem(0.01), partition: ALKANE }),
  solvent({ key: "heptane", name: "Heptane", family: "alkane", density: pc(0.6795, 25), bpC: pc(98.4, 25), logP: logp(4.5), waterMiscible: false,
    solventInWaterWtPct: mem(0.0003), waterInSolventWtPct: mem(0.01), partition: ALKANE }),
  solvent({ key: "cyclohexane", name: "Cyclohexane", family: "alkane", density: pc(0.7739, 25), bpC: pc(80.7, 25), logP: mem(3.44), waterMiscible: false,
    solventInWaterWtPct: mem(0.0055), waterInSolventWtPct: mem(0.01), partition: ALKANE }),
  solvent({ key: "nbuoh", name: "1-Butanol", family: "alcohol", density: pc(0.8095, 20), bpC: pc(117.6, 20), logP: logp(0.84), waterMiscible: false,
    solventInWaterWtPct: s(7.4, "IUPAC-NIST-BuOH", "confirmed", 25), waterInSolventWtPct: s(20.3, "IUPAC-NIST-BuOH", "confirmed", 25),
    partition: { donor: { a: 0.697, b: 0.381 }, acceptor: { a: 0.697, b: 0.381 }, se: 0.4, source: "Leo-Hansch-Elkins", confidence: "memory" } }),
  // Octanol is the reference system itself (identity line); kept for shake-flask comparisons.
  solvent({ key: "octanol", name: "1-Octanol", family: "alcohol", density: mem(0.826, 20), bpC: mem(195), logP: mem(3.0), waterMiscible: false,
    solventInWaterWtPct: mem(0.054), waterInSolventWtPct: mem(4.8), partition: { donor: { a: 1, b: 0 }, acceptor: { a: 1, b: 0 }, se: 0.05, source: "definition", confidence: "derived" } }),
  solvent({ key: "thf", name: "Tetrahydrofuran", family: "ether", density: pc(0.8833, 25), bpC: pc(66.0, 25), logP: logp(0.46), waterMiscible: true, peroxideFormer: true, solventInWaterWtPct: null, waterInSolventWtPct: null, cosolvency: COSOLVENT }),
  solvent({ key: "dioxane", name: "1,4-Dioxane", family: "ether", density: pc(1.0337, 20), bpC: pc(101.2, 20), logP: s(-0.27, "PhysProp", "confirmed_digitized"), waterMiscible: true, peroxideFormer: true, solventInWaterWtPct: null, waterInSolventWtPct: null, cosolvency: COSOLVENT }),
  solvent({ key: "meoh", name: "Methanol", family: "alcohol", density: pc(0.7914, 20), bpC: pc(64.5, 20), logP: logp(-0.74), waterMiscible: true, solventInWaterWtPct: null, waterInSolventWtPct: null, cosolvency: COSOLVENT }),
  solvent({ key: "etoh", name: "Ethanol", family: "alcohol", density: pc(0.7893, 20), bpC: pc(78.24, 20), logP: logp(-0.3), waterMiscible: true, solventInWaterWtPct: null, waterInSolventWtPct: null, cosolvency: COSOLVENT }),
  solvent({ key: "ipa", name: "2-Propanol", family: "alcohol", density: mem(0.786, 20), bpC: mem(82.3), logP: mem(0.05), waterMiscible: true, solventInWaterWtPct: null, waterInSolventWtPct: null, cosolvency: COSOLVENT }),
  solvent({ key: "mecn", name: "Acetonitrile", family: "nitrile", density: pc(0.7857, 20), bpC: pc(81.6, 20), logP: logp(-0.34), waterMiscible: true, solventInWaterWtPct: null, waterInSolventWtPct: null, cosolvency: COSOLVENT }),
  solvent({ key: "acetone", name: "Acetone", family: "ketone", density: pc(0.7845, 25), bpC: pc(56.1, 25), logP: logp(-0.24), waterMiscible: true, solventInWaterWtPct: null, waterInSolventWtPct: null, cosolvency: COSOLVENT }),
  solvent({ key: "dmf", name: "N,N-Dimethylformamide", family: "amide", density: pc(0.9445, 25), bpC: pc(152.8, 25), logP: logp(-1.01), waterMiscible: true, dipolarAprotic: true, reproductiveToxicant: true, solventInWaterWtPct: null, waterInSolventWtPct: null, cosolvency: COSOLVENT }),
  solvent({ key: "dmac", name: "N,N-Dimethylacetamide", family: "amide", density: mem(0.937, 25), bpC: mem(165), logP: mem(-0.77), waterMiscible: true, dipolarAprotic: true, reproductiveToxicant: true, solventInWaterWtPct: null, waterInSolventWtPct: null, cosolvency: COSOLVENT }),
  solvent({ key: "nmp", name: "N-Methyl-2-pyrrolidone", family: "amide", density: mem(1.028, 25), bpC: mem(202), logP: mem(-0.38), waterMiscible: true, dipolarAprotic: true, reproductiveToxicant: true, solventInWaterWtPct: null, waterInSolventWtPct: null, cosolvency: COSOLVENT }),
  // DMSO bp: 189 °C in most catalogues (memory); the digitized CRC file gives 191.9.
  solvent({ key: "dmso", name: "Dimethyl sulfoxide", family: "sulfoxide", density: pc(1.101, 25), bpC: mem(189), logP: logp(-1.35), waterMiscible: true, dipolarAprotic: true, solventInWaterWtPct: null, waterInSolventWtPct: null, cosolvency: COSOLVENT }),
];

export const SOLVENTS: Readonly<Record<string, SolventProps>> = Object.fromEntries(list.map((x) => [x.key, x]));
export const WATER_KEY = "water";
