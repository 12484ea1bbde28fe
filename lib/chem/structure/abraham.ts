/**
 * Abraham solute descriptors for a structure, for the engine to receive as component data (component.abraham):
 * the measured ones when the canonical SMILES is in the table (data/abraham-solutes.ts), with V always the exact
 * McGowan volume of the structure; for unlisted structures the group-contribution estimate of Platts, Butina,
 * Abraham & Hersey, J. Chem. Inf. Comput. Sci. 1999, 39, 835 (abraham-estimate.ts), or null when a fragment is
 * missing (then the engine keeps the log P line).
 */
import { MEASURED_DESCRIPTORS, type MeasuredDescriptors } from "../data/abraham-solutes";
import { estimateAbrahamDescriptors, type EstimatedDescriptors } from "./abraham-estimate";
import { mcGowanVolume } from "./mcgowan";
import { type RDKitModule, usingMol } from "./rdkit";
import { type ReadOptions, readStructure } from "./read";

export interface StructureAbraham {
  canonicalSmiles: string;
  /** Exact McGowan volume, (cm³/mol)/100. */
  mcGowanV: number;
  /** Measured descriptors for this structure, or null when it is not in the table. */
  measured: MeasuredDescriptors | null;
  /** Group-contribution estimate when there are no measured descriptors (null when measured or not estimable). */
  estimated: EstimatedDescriptors | null;
}

export function abrahamForStructure(rdkit: RDKitModule, text: string, options: ReadOptions = {}): StructureAbraham {
  return usingMol(readStructure(rdkit, text, options), (mol) => {
    const canonicalSmiles = mol.get_smiles();
    const measured = MEASURED_DESCRIPTORS.get(canonicalSmiles) ?? null;
    return { canonicalSmiles, mcGowanV: mcGowanVolume(mol), measured, estimated: measured ? null : estimateAbrahamDescriptors(rdkit, mol) };
  });
}
