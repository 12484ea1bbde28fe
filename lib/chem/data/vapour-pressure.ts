/**
 * Antoine constants of the common work-up solvents, NIST Chemistry WebBook convention:
 * log10(P/bar) = A − B/(T/K + C). Each set reproduces 1 atm at the CRC normal boiling point to within 1.5 % (a check
 * on the copying). Source: NIST Chemistry WebBook, SRD 69, "Antoine Equation Parameters" of each
 * compound; the constants are quoted from memory of those pages and checked
 * against the CRC Handbook vapour pressures at 40 °C in tests/unit/chem/evaporation.test.ts.
 * Solvents without a set here fall back to the estimate from the normal boiling point (evaporation.ts).
 */
export interface AntoineConstants {
  A: number;
  B: number;
  C: number;
  /** Temperature range of the fit, K. */
  rangeK: [number, number];
  source: string;
}

const nist = (A: number, B: number, C: number, rangeK: [number, number]): AntoineConstants =>
  ({ A, B, C, rangeK, source: "NIST Chemistry WebBook, Antoine equation parameters (memory; checked at the normal boiling point)" });

export const SOLVENT_ANTOINE: Readonly<Record<string, AntoineConstants>> = {
  water: nist(5.20389, 1733.926, -39.485, [304, 333]),
  etoac: nist(4.22809, 1245.702, -55.189, [260, 385]),
  dcm: nist(4.53691, 1327.016, -20.474, [233, 313]),
  chcl3: nist(4.20772, 1233.129, -40.953, [215, 334]),
  toluene: nist(4.07827, 1343.943, -53.773, [308, 384]),
  benzene: nist(4.01814, 1203.835, -53.226, [288, 354]),
  hexane: nist(4.00266, 1171.53, -48.784, [286, 343]),
  heptane: nist(4.02832, 1268.636, -56.199, [299, 372]),
  cyclohexane: nist(3.96988, 1203.526, -50.287, [293, 354]),
  meoh: nist(5.20409, 1581.341, -33.5, [288, 357]),
  etoh: nist(5.24677, 1598.673, -46.424, [292, 366]),
  acetone: nist(4.42448, 1312.253, -32.445, [259, 508]),
  thf: nist(4.12118, 1202.942, -46.818, [296, 373]),
  mecn: nist(4.27873, 1355.374, -37.853, [288, 362]),
};

/** Molar masses of the library solvents, g/mol (from the formula; derived), to count them in moles in the flask. */
export const SOLVENT_MOLAR_MASS: Readonly<Record<string, number>> = {
  water: 18.015, etoac: 88.106, ipac: 102.13, et2o: 74.123, mtbe: 88.15, "2-methf": 86.13, cpme: 100.16, dcm: 84.93,
  chcl3: 119.37, dce: 98.95, toluene: 92.14, hexane: 86.18, heptane: 100.2, cyclohexane: 84.16, nbuoh: 74.12,
  octanol: 130.23, thf: 72.11, dioxane: 88.11, meoh: 32.04, etoh: 46.07, ipa: 60.1, mecn: 41.05, acetone: 58.08,
  dmf: 73.09, dmac: 87.12, nmp: 99.13, dmso: 78.13,
};
/** Molar mass assumed for a solvent a group adds without one (typical of the table above; assumption). */
export const DEFAULT_SOLVENT_MOLAR_MASS = 90;
