/**
 * McGowan characteristic volume V (the Abraham solute descriptor), computed exactly from the structure:
 * V = (Σ atom contributions − 6.56 · number of bonds) / 100, in units of cm³ mol⁻¹ / 100, where every bond counts
 * once whatever its order and the number of bonds is atoms − 1 + rings (M. H. Abraham & J. C. McGowan,
 * Chromatographia 1987, 23, 243–246). Atom contributions, cm³/mol, from the same paper.
 */
import { type JsonMolecule, parseRDKitJson } from "./rdkit-json";
import { type RDKitMol } from "./rdkit";

/** Atomic contributions by atomic number, cm³/mol (Abraham & McGowan 1987, Table 1). */
const ATOM_VOLUME: Readonly<Record<number, number>> = {
  1: 8.71, 5: 18.32, 6: 16.35, 7: 14.39, 8: 12.43, 9: 10.48, 14: 26.83, 15: 24.87, 16: 22.91, 17: 20.95,
  32: 31.02, 33: 29.42, 34: 27.81, 35: 26.21, 50: 39.35, 53: 34.53,
};
const BOND_VOLUME = 6.56;

/** Exact McGowan volume of a parsed molecule, or NaN when an element has no published contribution. */
export function mcGowanVolumeOf(molecule: JsonMolecule): number {
  let sum = 0, atoms = 0;
  for (const atom of molecule.atoms) {
    const v = ATOM_VOLUME[atom.z];
    if (v === undefined) return Number.NaN;
    sum += v + atom.impHs * (ATOM_VOLUME[1] as number);
    atoms += 1 + atom.impHs;
  }
  if (atoms === 0) return Number.NaN;
  // Bonds between the listed atoms, plus one for every hydrogen not listed as an atom (= atoms − 1 + rings).
  const bonds = molecule.bonds.length + molecule.atoms.reduce((n, a) => n + a.impHs, 0);
  return (sum - BOND_VOLUME * bonds) / 100;
}

export function mcGowanVolume(mol: RDKitMol): number {
  return mcGowanVolumeOf(parseRDKitJson(mol.get_json()));
}
