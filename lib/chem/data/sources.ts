/**
 * Source keys used beside every value in the data tables. Full citations, so the app can show where a number
 * came from. "memory" values were not confirmed in a retrieved copy of any source: the engine widens their
 * uncertainty and a group's own measurement should replace them.
 */
export type Confidence = "confirmed" | "confirmed_digitized" | "derived" | "secondary" | "memory" | "assumed";

/** A number with the key of its source and how sure we are of it. */
export interface Sourced {
  value: number;
  source: string;
  confidence: Confidence;
  /** Temperature the value refers to, °C. */
  tempC?: number;
}

export const SOURCES: Record<string, string> = {
  "CRC-PC": "CRC Handbook of Chemistry and Physics, 95th ed. (2014), Physical Constants of Organic Compounds (digitized in CalebBell/chemicals).",
  "CRC-logP": "CRC Handbook of Chemistry and Physics, 95th ed., Octanol-Water Partition Coefficients (digitized in CalebBell/chemicals).",
  "CRC-conc": "CRC Handbook of Chemistry and Physics, 102nd ed. (2021), Concentrative Properties of Aqueous Solutions, 20 °C.",
  "CRC-salts": "CRC Handbook of Chemistry and Physics, 98th ed. (2017), Solubility of Common Salts at Ambient Temperatures.",
  "Merck-EtOAc": "The Merck Index, monograph Ethyl Acetate.",
  "Merck-tol": "The Merck Index, monograph Toluene (citing Schwarz 1980).",
  "OSHA-DCM": "OSHA, Methylene Chloride final rule, 62 FR 1494 (1997), Section IV.",
  "IUPAC-NIST-CHCl3": "IUPAC-NIST Solubility Database (NIST SRD 106), Trichloromethane with Water (Donahue & Bartell 1952; Reinders & de Minjer 1947).",
  "IUPAC-NIST-BuOH": "IUPAC-NIST Solubility Database (NIST SRD 106), 1-Butanol + water (Letcher & Siswana, Fluid Phase Equilib. 74, 203, 1992).",
  "S13": "2-Methyltetrahydrofuran data (Wikipedia, citing primary data): solubility in water vs temperature, water in 2-MeTHF.",
  "vendor-Et2O": "Vendor data page for diethyl ether (69 g/L in water at 20 °C).",
  "CPME-mfr": "German Wikipedia, Cyclopentylmethylether (citing the manufacturer): 11 g/L in water at 23 °C.",
  "water-dens": "Standard density-of-water table: 998.2071 kg/m³ at 20 °C, 997.0479 kg/m³ at 25 °C.",
  "K&L": "Kaye & Laby, Tables of Physical & Chemical Constants §3.9.7 (NPL), from Robinson & Stokes, Electrolyte Solutions, 2nd ed. (1970).",
  "acid-table": "General-chemistry appendix table, Dissociation Constants and pK Values for Acids at 25 °C.",
  "LT-E5": "LibreTexts Reference Table E5, Acid Dissociation Constants of Organics (Martell & Smith, Critical Stability Constants, 1976).",
  "chemister": "chemister.ru inorganic database (citing Comey & Hahn 1921; Seidell).",
  "S3b": "University of York Chemistry Teaching Labs, Extractions vs washes (solution densities).",
  "Robertson": "G. R. Robertson, Laboratory Practice of Organic Chemistry, 3rd ed. (1954), pp. 147–152 (drying agents).",
  "Nichols": "L. Nichols, Organic Chemistry Lab Techniques (LibreTexts), §4.5 Extraction Theory and §7.19 Using Drying Agents.",
  "Leo-Hansch-Elkins": "A. Leo, C. Hansch, D. Elkins, Partition coefficients and their uses, Chem. Rev. 71 (1971) 525, Section IV (Collander relations).",
  "Collander": "R. Collander, Acta Chem. Scand. 5 (1951) 774 (linear relation between partition systems), as summarised in Leo, Hansch & Elkins 1971.",
  "Li-Yalkowsky": "A. Li, S. H. Yalkowsky, Predicting cosolvency. 1. Solubility ratio and solute log Kow, Ind. Eng. Chem. Res. 37 (1998) 4470 (log σ = N + M log Kow).",
  "Yalkowsky-Roseman": "S. H. Yalkowsky, T. J. Roseman, Solubilization of drugs by cosolvents, in Techniques of Solubilization of Drugs (1981): log-linear cosolvency model.",
  "Setschenow": "J. Setschenow, Z. Phys. Chem. 4 (1889) 117; IUPAC Gold Book 'salting out' (Pure Appl. Chem. 65, 2373, 1993).",
  "Ks-code": "Public implementation of the Armitage/Kramer in-vitro distribution model: Ks(NaCl) = 0.04·log Kow + 0.114 L/mol.",
  "CODATA": "CODATA Key Values for Thermodynamics (Cox, Wagman, Medvedev 1989): ΔfH°(H2O, l) = −285.830, ΔfH°(OH⁻, aq) = −230.015 kJ/mol.",
  "IUPAC-GB-E": "IUPAC Gold Book, fraction extracted E (Pure Appl. Chem. 65, 2373, 1993, p. 2384).",
  "Chung-2022": "Y. Chung, F. H. Vermeire, H. Wu, P. J. Walker, M. H. Abraham, W. H. Green, J. Chem. Inf. Model. 62 (2022) 433: Abraham gas-to-solvent coefficients for about 200 solvents (values as published with RMG-database, input/solvation/libraries/solvent.py).",
  "Abraham-Acree": "M. H. Abraham, W. E. Acree Jr. and co-workers, compilations of water-to-solvent partition equations log P = c + eE + sS + aA + bB + vV (e.g. Sprunger, Acree & Abraham; wet 1-octanol and 1-butanol, alkanes, aromatics, chlorinated solvents).",
  "Bradley-2014": "J.-C. Bradley, W. E. Acree Jr., A. S. I. D. Lang, Compounds with known Abraham descriptors, figshare (2014), doi 10.6084/m9.figshare.1176994 (CC BY 4.0); median where several entries.",
  "Abraham-1994": "M. H. Abraham et al., J. Chem. Soc. Perkin Trans. 2 (1994) 1777: solute descriptors including L (as published with RMG-database, input/solvation/libraries/solute.py).",
  "McGowan": "M. H. Abraham, J. C. McGowan, Chromatographia 23 (1987) 243: characteristic volume from atom and bond contributions.",
  "common": "Common practice (bench heuristic, no written source checked).",
  "memory": "From memory of standard handbooks; not confirmed in a retrieved source.",
  "derived": "Derived here from confirmed inputs (stoichiometry, conversion, ideal-solution equilibrium).",
};
