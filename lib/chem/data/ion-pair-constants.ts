/**
 * Published ion-pair extraction constants of quaternary ammonium salts, water → organic solvent, 25 °C:
 *   E_QX = [Q⁺X⁻]org / ([Q⁺]aq·[X⁻]aq),  L/mol
 * (the extraction constant of Schill's ion-pair extraction, G. Schill, in Ion Exchange and Solvent Extraction
 * vol. 6, Dekker 1974, and of phase-transfer catalysis, E. V. Dehmlow & S. S. Dehmlow, Phase Transfer Catalysis,
 * 3rd ed., VCH 1993). A component recognised as a symmetric tetra-n-alkylammonium ion takes these in place of
 * the ion-pair class value of the solvent (ion-pair.ts); a component may also state its own (schema.ts).
 *
 * Tetrabutylammonium in chloroform: Cl⁻ 0.78, Br⁻ 19.5, NO₃⁻ 24.5, I⁻ 1023 (and ClO₄⁻ 3020), as tabulated in the
 * UCLA phase-transfer-catalysis course notes (chem.ucla.edu/~bacher/General/30BL, "Phase Transfer catalysis");
 * they are the classic values of Gustavii's measurements (K. Gustavii, Acta Pharm. Suec. 4 (1967) 233), an
 * attribution from memory. The same notes give picrates of the four symmetric cations in chloroform: Me₄N⁺ 0.22,
 * Et₄N⁺ 21, Pr₄N⁺ 4400, Bu₄N⁺ 8.1·10⁵. The smaller cations' halides are derived from these by the additivity
 * of cation and anion contributions to log E that ion-pair extraction rests on (Schill 1974; A. Brändström,
 * Preparative Ion Pair Extraction, Apotekarsocieteten 1974):
 *   log E(Q, X) = log E(Bu₄N, X) + log E(Q, Pic) − log E(Bu₄N, Pic).
 * The picrate ladder is about 0.55 log units per CH₂ (2.0, 2.3, 2.3 per four CH₂), the figure those texts quote.
 * Standard uncertainty: 0.1 for the measured values and 0.3 for the derived ones (from memory: the scatter
 * between laboratories, and how far additivity holds).
 * Dichloromethane: no published constant was found for these salts; the chloroform values stand in (an
 * assumption, the two being the chlorinated solvents of ion-pair work) with a standard uncertainty of 1.
 */
import { type CounterIonKey } from "./counter-ions";

export interface ExtractionConstant {
  /** log10 E_QX, E in L/mol. */
  logKex: number;
  se: number;
  source: string;
}

const UCLA = "UCLA phase-transfer-catalysis notes (Gustavii 1967, attribution from memory)";
const DERIVED = "derived by additivity from the Bu4N+ value and the picrates (UCLA notes; Gustavii 1967, from memory)";
const ASSUMED_DCM = "assumed: the chloroform value (no published dichloromethane constant found)";

/** E of tetrabutylammonium salts in chloroform, L/mol. */
const BU4N_CHLOROFORM: Partial<Record<CounterIonKey, number>> = { chloride: 0.78, bromide: 19.5, nitrate: 24.5, iodide: 1023 };
/** E of the symmetric tetra-n-alkylammonium picrates in chloroform by carbons per chain, L/mol. */
const PICRATE_CHLOROFORM: Record<number, number> = { 1: 0.22, 2: 21, 3: 4400, 4: 8.1e5 };

function chloroform(carbons: number): Partial<Record<CounterIonKey, ExtractionConstant>> {
  const shift = Math.log10((PICRATE_CHLOROFORM[carbons] as number) / (PICRATE_CHLOROFORM[4] as number));
  const measured = carbons === 4;
  return Object.fromEntries(Object.entries(BU4N_CHLOROFORM).map(([ion, e]) => [ion, {
    logKex: Math.log10(e) + shift, se: measured ? 0.1 : 0.3, source: measured ? UCLA : DERIVED,
  }]));
}

/**
 * Extraction constants by the number of carbons in each chain of a symmetric tetra-n-alkylammonium ion
 * (1 tetramethyl … 4 tetrabutyl), then by library solvent key and counter-ion.
 */
function asDichloromethane(byIon: Partial<Record<CounterIonKey, ExtractionConstant>>): Partial<Record<CounterIonKey, ExtractionConstant>> {
  return Object.fromEntries(Object.entries(byIon).map(([ion, k]) => [ion, { logKex: k.logKex, se: 1, source: ASSUMED_DCM }]));
}

const bySolvent = (carbons: number) => ({ chcl3: chloroform(carbons), dcm: asDichloromethane(chloroform(carbons)) });

export const TETRAALKYLAMMONIUM_EXTRACTION: Readonly<Record<number, Readonly<Record<string, Partial<Record<CounterIonKey, ExtractionConstant>>>>>> = {
  1: bySolvent(1),
  2: bySolvent(2),
  3: bySolvent(3),
  4: bySolvent(4),
};
