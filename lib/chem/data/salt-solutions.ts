/**
 * Densities of aqueous salt solutions at 20 °C by mass percent of the anhydrous salt: CRC Handbook of Chemistry
 * and Physics, 102nd ed. (2021), "Concentrative Properties of Aqueous Solutions" [CRC-conc], every row the table
 * gives for these salts (digitized copy in amosonabike/CRC-Solution-Properties-, checked against the printed
 * molarities in tests/unit/chem/salt-solutions.test.ts). Saturation at 20 °C from CRC 98th ed., "Solubility of
 * Common Salts at Ambient Temperatures" [CRC-salts], except Na₂SO₄ (memory).
 */
import { type Sourced } from "./sources";

export interface SaltSolutionTable {
  formula: string;
  /** g/mol of the anhydrous salt. */
  molarMass: number;
  /** [mass % of salt, density g/mL at 20 °C], ascending. */
  rows: readonly (readonly [number, number])[];
  /** Molality of the saturated solution at 20 °C, mol/kg water. */
  saturationMolality: Sourced;
}

const sat = (value: number, source: string, confidence: Sourced["confidence"]): Sourced => ({ value, source, confidence, tempC: 20 });

export const SALT_SOLUTIONS = {
  NaCl: {
    formula: "NaCl", molarMass: 58.443, saturationMolality: sat(6.136, "CRC-salts", "confirmed_digitized"),
    rows: [[0.1, 0.9989], [0.2, 0.9997], [0.3, 1.0004], [0.4, 1.0011], [0.5, 1.0018], [1, 1.0053], [1.5, 1.0089], [2, 1.0125],
      [2.5, 1.016], [3, 1.0196], [3.5, 1.0232], [4, 1.0268], [4.5, 1.0304], [5, 1.034], [6, 1.0413], [7, 1.0486], [8, 1.0559],
      [9, 1.0633], [10, 1.0707], [11, 1.0781], [12, 1.0857], [13, 1.0932], [14, 1.1008], [15, 1.1085], [16, 1.1162], [17, 1.124],
      [18, 1.1319], [19, 1.1398], [20, 1.1478], [21, 1.1558], [22, 1.164], [23, 1.1721], [24, 1.1804], [25, 1.1887], [26, 1.1972]],
  },
  LiCl: {
    formula: "LiCl", molarMass: 42.394, saturationMolality: sat(19.67, "CRC-salts", "confirmed_digitized"),
    rows: [[0.5, 1.0012], [1, 1.0041], [2, 1.0099], [3, 1.0157], [4, 1.0215], [5, 1.0272], [6, 1.033], [7, 1.0387], [8, 1.0444],
      [9, 1.0502], [10, 1.056], [12, 1.0675], [14, 1.0792], [16, 1.091], [18, 1.1029], [20, 1.115], [22, 1.1274], [24, 1.1399],
      [26, 1.1527], [28, 1.1658], [30, 1.1791]],
  },
  Na2SO4: {
    formula: "Na₂SO₄", molarMass: 142.043, saturationMolality: sat(1.373, "memory", "memory"),
    rows: [[0.5, 1.0027], [1, 1.0071], [2, 1.0161], [3, 1.0252], [4, 1.0343], [5, 1.0436], [6, 1.0526], [7, 1.0619], [8, 1.0713],
      [9, 1.0808], [10, 1.0905], [11, 1.1002], [12, 1.1101], [13, 1.1201], [14, 1.1301], [15, 1.1402], [16, 1.1503], [17, 1.1604],
      [18, 1.1705], [19, 1.1806], [20, 1.1907], [22, 1.2106]],
  },
  K2CO3: {
    formula: "K₂CO₃", molarMass: 138.206, saturationMolality: sat(7.948, "CRC-salts", "confirmed_digitized"),
    rows: [[0.5, 1.0027], [1, 1.0072], [2, 1.0163], [3, 1.0254], [4, 1.0345], [5, 1.0437], [6, 1.0529], [7, 1.0622], [8, 1.0715],
      [9, 1.0809], [10, 1.0904], [12, 1.1095], [14, 1.1291], [16, 1.149], [18, 1.1692], [20, 1.1898], [24, 1.232], [28, 1.2755],
      [32, 1.3204], [36, 1.3665], [40, 1.4142], [44, 1.4633], [48, 1.5142], [50, 1.5404]],
  },
} as const satisfies Record<string, SaltSolutionTable>;

export type SaltKey = keyof typeof SALT_SOLUTIONS;

/** The table each solid reagent of the library dissolves by (reagents.ts keys). */
export const SOLID_SALT_TABLE: Readonly<Record<string, SaltKey>> = { nacl: "NaCl", licl: "LiCl", na2so4: "Na2SO4", k2co3: "K2CO3" };
