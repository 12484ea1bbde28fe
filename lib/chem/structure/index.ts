/** Structures on RDKit (WebAssembly): parsing, properties, depictions, fingerprints and ionizable sites. */
export { type RDKitInit, type RDKitInitOptions, type RDKitModule, type RDKitMol, createRDKitInit, loadRDKit, usingMol } from "./rdkit";
export { STRUCTURE_ERROR_CODES, StructureError, type StructureErrorCode, isStructureError } from "./errors";
export { type ReadOptions, readMolBlock, readSmarts, readSmiles, readStructure } from "./read";
export { type DescribedStructure, type SearchKeys, type StructureProperties, describeMol, describeStructure, searchKeys } from "./describe";
export { type DepictOptions, depictSvg } from "./depict";
export { type SdfOptions, type SdfRecord, type SdfResult, readSdf, splitSdf } from "./sdf";
export { type SmilesLine, type SmilesLineResult, readSmilesLines, splitSmilesLines } from "./smiles-lines";
export { FINGERPRINT_BITS, FINGERPRINT_BYTES, bitIsSet, intersectionCount, morganFingerprint, patternFingerprint, popcount, tanimoto, tanimotoFromCounts } from "./fingerprint";
export { type EstimatedPKa, detectIonizableSites, estimateIonizableSites } from "./sites";
export { SITE_CLASSES, type SiteClass } from "./site-classes";
export { NO_SITE_WARNING, type SiteWarning, estimateSitesWithWarnings, unrecognisedProtonGroups } from "./site-warnings";
export { mcGowanVolume, mcGowanVolumeOf } from "./mcgowan";
export { type StructureAbraham, abrahamForStructure } from "./abraham";
export { type EstimatedDescriptors, estimateAbrahamDescriptors } from "./abraham-estimate";
