/**
 * Abraham solute descriptors for a structure, for the engine to receive as component data (component.abraham):
 * the measured ones when the canonical SMILES is in the table (data/abraham-solutes.ts), with V always the exact
 * McGowan volume of the structure. A group-contribution estimate for unlisted structures (Platts, Butina, Abraham
 * & Hersey, J. Chem. Inf. Comput. Sci. 1999, 39, 835) is not implemented: unlisted structures get V only, and the
 * engine keeps the log P line for them.
 */
import { MEASURED_DESCRIPTORS, type MeasuredDescriptors } from "../data/abraham-solutes";
import { mcGowanVolume } from "./mcgowan";
import { type RDKitModule, usingMol } from "./rdkit";
import { type ReadOptions, readStructure } from "./read";

export interface StructureAbraham {
  canonicalSmiles: string;
  /** Exact McGowan volume, (cm³/mol)/100. */
  mcGowanV: number;
  /** Measured descriptors for this structure, or null when it is not in the table. */
  measured: MeasuredDescriptors | null;
}

export function abrahamForStructure(rdkit: RDKitModule, text: string, options: ReadOptions = {}): StructureAbraham {
  return usingMol(readStructure(rdkit, text, options), (mol) => {
    const canonicalSmiles = mol.get_smiles();
    return { canonicalSmiles, mcGowanV: mcGowanVolume(mol), measured: MEASURED_DESCRIPTORS.get(canonicalSmiles) ?? null };
  });
}
