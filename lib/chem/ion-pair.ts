/**
 * Ions enter an organic layer only as ion pairs. An organic anion A⁻ goes over with a cation M⁺ of the water,
 * an organic cation BH⁺ or Q⁺ with an anion X⁻:
 *   A⁻(aq) + M⁺(aq) ⇌ MA(org),   K_ex = [MA]org / ([A⁻]aq·[M⁺]aq)
 * so the ionic part of the distribution ratio is D_ion = K_ex·[M⁺]aq: it grows in proportion to the counter-ion
 * concentration (Avdeef measured log P_I = 1.00·log[Na⁺] + 0.63 for warfarin in octanol, Absorption and Drug
 * Development, Wiley 2003, ch. 4; the same form underlies Schill's ion-pair extraction, G. Schill, in Ion Exchange
 * and Solvent Extraction vol. 6, Dekker 1974). Here
 *   log K_ex = log K_N(solvent) + δ(solvent family, sign of the organic ion) + pairing(counter-ion)
 * with δ per solvent family at the reference counter-ion (Na⁺ for organic anions, Cl⁻ for organic cations) and
 * `pairing` from data/counter-ions.ts. 1 M NaOH (1 M Na⁺), saturated NaHCO₃ (1.1 M) and brine (5.4 M) therefore
 * differ, and a TFA or tosylate salt extracts more than a hydrochloride.
 */
import { COUNTER_IONS, type CounterIonKey } from "./data/counter-ions";
import { type SolventFamily, type SolventProps } from "./data/solvents";

export interface IonPairOffset {
  /** log K_ex − log K_N, L/mol, for an organic anion with Na⁺. */
  anion: number;
  /** The same for an organic cation with Cl⁻. */
  cation: number;
  /** Standard uncertainty of both, log units. */
  se: number;
  source: string;
}

/**
 * δ by solvent family.
 *  - Alcohols (octanol, butanol): anion −2.9 from warfarin (log K_ex 0.63 against log P_N 3.54; Avdeef 2003), in
 *    line with his "diff 4" between neutral and ion-pair log P of acids at 0.15 M K⁺ (−4 + log 1/0.15 = −3.2);
 *    cation −2.6 from chlorpromazine (P_I = 32 in 0.125 M KCl or NaCl against log P_N 5.40; Avdeef 2003) and his
 *    "diff 3" for bases (−3 + 0.8 = −2.2).
 *  - Chlorinated solvents: protonated amines pair with chloride well enough that lipophilic amine hydrochlorides
 *    extract into chloroform and dichloromethane (Schill 1974, memory), while small ones (Et₃N, DIPEA) wash out
 *    with 1 M HCl (common practice): −5 against the chloroform-line log K of the neutral amine; sodium carboxylates do not (soaps
 *    are insoluble in dichloromethane): −7, a class value from memory.
 *  - Esters, ethers, aromatics and alkanes: poorer ion solvents still, in the order of their polarity (class
 *    values from memory, ±1.5). These put ibuprofen, lauric and benzoic acids ≥ 99 % into two 1 M NaOH washes
 *    and Et₃N, DIPEA and benzylamine into two 1 M HCl washes (common practice).
 * The ±1.5 of a class value is read as a range holding about 95 % of cases, so its standard uncertainty (`se`,
 * which the uncertainty engine draws from, perturb.ts) is 0.75: with 1.5 as the standard deviation the upper tail
 * would keep a tenth of an anilinium chloride in ethyl acetate after a 1 M HCl wash, against common practice.
 */
const BY_FAMILY: Record<SolventFamily, IonPairOffset> = {
  alcohol: { anion: -2.9, cation: -2.6, se: 0.5, source: "Avdeef 2003 (octanol)" },
  chlorinated: { anion: -7, cation: -5, se: 0.75, source: "memory (Schill 1974 for amine hydrochlorides)" },
  ester: { anion: -6, cation: -4, se: 0.75, source: "memory (class value)" },
  ketone: { anion: -6, cation: -4, se: 0.75, source: "memory (class value)" },
  ether: { anion: -6.5, cation: -4.5, se: 0.75, source: "memory (class value)" },
  aromatic: { anion: -7.5, cation: -5.5, se: 0.75, source: "memory (class value)" },
  alkane: { anion: -9, cation: -7, se: 0.75, source: "memory (class value)" },
  nitrile: { anion: -5, cation: -3.5, se: 0.75, source: "memory (class value)" },
  amide: { anion: -5, cation: -3.5, se: 0.75, source: "memory (class value)" },
  sulfoxide: { anion: -5, cation: -3.5, se: 0.75, source: "memory (class value)" },
  water: { anion: 0, cation: 0, se: 0, source: "same phase" },
};

export function ionPairOffset(solvent: Pick<SolventProps, "family">): IonPairOffset {
  return BY_FAMILY[solvent.family];
}

/** Which counter-ion an organic ion needs: a component whose charged forms are anions pairs with cations. */
export type PairingSign = "anion" | "cation";

/** The sign of a component's charged forms: fixed charge first, else a pure acid is an anion; bases and
 * ampholytes pair as cations (their cationic form is the one that meets counter-ions in an acid wash). */
export function pairingSign(c: { fixedCharge: number; pKas: readonly { kind: "acid" | "base" }[] }): PairingSign {
  if (c.fixedCharge !== 0) return c.fixedCharge < 0 ? "anion" : "cation";
  return c.pKas.length > 0 && c.pKas.every((p) => p.kind === "acid") ? "anion" : "cation";
}

/** 10^pairing of a counter-ion: its extraction relative to the reference ion of its sign. */
export function pairingFactor(ion: CounterIonKey | undefined): number {
  return ion === undefined ? 1 : 10 ** COUNTER_IONS[ion].pairing;
}

/** Concentrations (mol/L) of strong cations and anions from a stream's net strong charge and Σz²·n over `volumeMl`
 * (exact for monovalent ions, which all but thiosulfate are). */
export function strongIonConcentrations(strongCharge: number, strongZ2: number, volumeMl: number): { cations: number; anions: number } {
  if (!(volumeMl > 0)) return { cations: 0, anions: 0 };
  return { cations: Math.max(0, (strongZ2 + strongCharge) / 2) / volumeMl, anions: Math.max(0, (strongZ2 - strongCharge) / 2) / volumeMl };
}

/**
 * log D_ion − log K_N for a plain solution: δ of the solvent plus log of the effective counter-ion concentration
 * (mol/L). For planning and flags, where no stream is simulated; −Infinity without counter-ions.
 */
export function ionLogKShift(solvent: Pick<SolventProps, "family">, sign: PairingSign, counterIonM: number): number {
  const o = ionPairOffset(solvent);
  return (sign === "anion" ? o.anion : o.cation) + Math.log10(counterIonM);
}
