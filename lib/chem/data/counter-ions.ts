/**
 * Counter-ions a component may be weighed with (amine hydrochlorides, sodium carboxylates, quaternary ammonium
 * halides, TFA and sulfonate salts). Each is a monovalent ion that stays charged over the pH range of a work-up
 * (HCl, HBr, HI, TFA, TsOH, MsOH, TfOH, HBF₄, HPF₆ are strong or nearly so in water: TFA pKa ≈ 0.5, TsOH ≈ −2.8,
 * MsOH ≈ −1.9, from memory), so in the charge balance it counts as a strong ion, as HCl and NaOH washes do.
 *
 * `pairing`: how much more a pair with this ion extracts than with the reference ion of its sign (chloride for
 * anions, sodium for cations), log units. Bromide +0.24, nitrate +0.19 and methanesulfonate −0.33 are the
 * octanol ratios Avdeef measured for chlorpromazine cation in 0.125 M background salts (KBr 56, KNO₃ 50, KCl 32,
 * NaMeSO₃ 15; A. Avdeef, Absorption and Drug Development, Wiley 2003, ch. 4, citing his 1998 work). The large,
 * charge-diffuse anions (iodide, TFA, tosylate, triflate, BF₄⁻, PF₆⁻) and lithium/potassium follow the order of
 * the standard Gibbs energies of ion transfer from water to nitrobenzene (Y. Marcus, Ion Properties, 1997); their
 * numbers are from memory and carry ±1 log unit (`se`).
 */
export const COUNTER_IONS = {
  chloride: { name: "chloride", formula: "Cl⁻", charge: -1, molarMass: 35.45, pairing: 0, se: 0, source: "reference ion" },
  bromide: { name: "bromide", formula: "Br⁻", charge: -1, molarMass: 79.9, pairing: 0.24, se: 0.2, source: "Avdeef 2003 (octanol)" },
  iodide: { name: "iodide", formula: "I⁻", charge: -1, molarMass: 126.9, pairing: 1.0, se: 1, source: "memory (Marcus 1997 order)" },
  nitrate: { name: "nitrate", formula: "NO₃⁻", charge: -1, molarMass: 62.0, pairing: 0.19, se: 0.2, source: "Avdeef 2003 (octanol)" },
  mesylate: { name: "methanesulfonate", formula: "CH₃SO₃⁻", charge: -1, molarMass: 95.1, pairing: -0.33, se: 0.2, source: "Avdeef 2003 (octanol)" },
  tosylate: { name: "p-toluenesulfonate", formula: "TsO⁻", charge: -1, molarMass: 171.19, pairing: 1.0, se: 1, source: "memory" },
  trifluoroacetate: { name: "trifluoroacetate", formula: "CF₃CO₂⁻", charge: -1, molarMass: 113.02, pairing: 1.0, se: 1, source: "memory" },
  triflate: { name: "triflate", formula: "CF₃SO₃⁻", charge: -1, molarMass: 149.07, pairing: 1.5, se: 1, source: "memory" },
  tetrafluoroborate: { name: "tetrafluoroborate", formula: "BF₄⁻", charge: -1, molarMass: 86.8, pairing: 1.5, se: 1, source: "memory (Marcus 1997 order)" },
  hexafluorophosphate: { name: "hexafluorophosphate", formula: "PF₆⁻", charge: -1, molarMass: 144.96, pairing: 2.0, se: 1, source: "memory (Marcus 1997 order)" },
  sodium: { name: "sodium", formula: "Na⁺", charge: 1, molarMass: 22.99, pairing: 0, se: 0, source: "reference ion" },
  lithium: { name: "lithium", formula: "Li⁺", charge: 1, molarMass: 6.94, pairing: -0.3, se: 0.5, source: "memory (Marcus 1997 order)" },
  potassium: { name: "potassium", formula: "K⁺", charge: 1, molarMass: 39.1, pairing: 0.3, se: 0.5, source: "memory (Marcus 1997 order)" },
} as const;

export type CounterIonKey = keyof typeof COUNTER_IONS;
export const COUNTER_ION_KEYS = Object.keys(COUNTER_IONS) as [CounterIonKey, ...CounterIonKey[]];

/** Mass of a proton, g/mol (IUPAC standard atomic weight of H). */
const H = 1.008;

/**
 * Molar mass of a salt of `parentMolarMass` (the neutral molecule as drawn, or the cation of a quaternary
 * ammonium) with `perParent` counter-ions: an anion on a neutral base brings its proton too (B·HCl), a cation
 * on a neutral acid replaces one (RCO₂Na); a permanently charged parent pairs with the bare ion.
 */
export function saltMolarMass(parentMolarMass: number, ion: CounterIonKey, perParent: number, fixedCharge: number): number {
  const x = COUNTER_IONS[ion];
  const proton = fixedCharge !== 0 ? 0 : x.charge < 0 ? H : -H;
  return parentMolarMass + perParent * (x.molarMass + proton);
}
