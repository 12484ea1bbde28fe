/**
 * What Layerwise derives from a structure at registration.
 *
 * - crippenLogP: Wildman–Crippen atom-contribution octanol–water log P (S. A. Wildman & G. M. Crippen,
 *   J. Chem. Inf. Comput. Sci. 1999, 39, 868–873), as implemented by RDKit. The authors report r² = 0.918 and
 *   σ = 0.677 log units on their 9920-compound training set; treat it as an estimate with that spread.
 * - tpsa: topological polar surface area from N and O fragment contributions (P. Ertl, B. Rohde & P. Selzer,
 *   J. Med. Chem. 2000, 43, 3714–3717), Å²; sulfur and phosphorus are not counted, as in the original method.
 * - molarMass: average molar mass from RDKit's table of standard atomic weights, g/mol.
 */
import { parseRDKitJson } from "./rdkit-json";
import { hillFormula, netCharge } from "./formula";
import { morganFingerprint, patternFingerprint } from "./fingerprint";
import { type RDKitModule, type RDKitMol, usingMol } from "./rdkit";
import { type ReadOptions, readStructure } from "./read";
import { encodeSearchGraph } from "./search-graph";

export interface StructureProperties {
  /** RDKit canonical SMILES: the identity used for duplicate detection within a group. */
  canonicalSmiles: string;
  formula: string;
  /** g/mol */
  molarMass: number;
  /** Monoisotopic mass, g/mol */
  exactMass: number;
  crippenLogP: number;
  /** Å² */
  tpsa: number;
  heavyAtomCount: number;
  netCharge: number;
  /** Disconnected parts ("." in SMILES): a salt or a mixture has more than one. */
  fragmentCount: number;
}

/** Bytes the search index needs; store them with the compound so an index can be rebuilt without RDKit. */
export interface SearchKeys {
  /** Morgan radius 2, 2048 bits, 256 bytes (layout in fingerprint.ts). */
  morganFingerprint: Uint8Array;
  /** RDKit pattern fingerprint, 2048 bits, 256 bytes. Not needed by the search index (it screens with its own). */
  patternFingerprint: Uint8Array;
  /** Compact graph for exact substructure matching (search-graph.ts). */
  searchGraph: Uint8Array;
}

export interface DescribedStructure extends StructureProperties, SearchKeys {}

interface RDKitDescriptors {
  amw?: number;
  exactmw?: number;
  CrippenClogP?: number;
  tpsa?: number;
  NumHeavyAtoms?: number;
}

export function describeMol(mol: RDKitMol): DescribedStructure {
  const descriptors = JSON.parse(mol.get_descriptors()) as RDKitDescriptors;
  const molecule = parseRDKitJson(mol.get_json());
  const canonicalSmiles = mol.get_smiles();
  return {
    canonicalSmiles,
    formula: hillFormula(molecule),
    molarMass: descriptors.amw ?? NaN,
    exactMass: descriptors.exactmw ?? NaN,
    crippenLogP: descriptors.CrippenClogP ?? NaN,
    tpsa: descriptors.tpsa ?? NaN,
    heavyAtomCount: descriptors.NumHeavyAtoms ?? molecule.atoms.filter((a) => a.z > 1).length,
    netCharge: netCharge(molecule),
    fragmentCount: canonicalSmiles.split(".").length,
    morganFingerprint: morganFingerprint(mol),
    patternFingerprint: patternFingerprint(mol),
    searchGraph: encodeSearchGraph(molecule),
  };
}

/** Parses SMILES or a MOL block and describes it; throws StructureError for bad input. */
export function describeStructure(rdkit: RDKitModule, text: string, options: ReadOptions = {}): DescribedStructure {
  return usingMol(readStructure(rdkit, text, options), describeMol);
}

/** Search keys only (cheaper than describe: no descriptors), e.g. to backfill an index from stored SMILES. */
export function searchKeys(rdkit: RDKitModule, smiles: string, options: ReadOptions = {}): SearchKeys {
  return usingMol(readStructure(rdkit, smiles, options), (mol) => ({
    morganFingerprint: morganFingerprint(mol),
    patternFingerprint: patternFingerprint(mol),
    searchGraph: encodeSearchGraph(parseRDKitJson(mol.get_json())),
  }));
}
