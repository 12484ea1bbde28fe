/** Server-side compound search: exact similarity and substructure search over an in-memory, group-partitioned index. */
export { CompoundSearchIndex, type IndexedCompound, type SimilarityHit, type SubstructureResult } from "./search-index";
export { type SimilarityOptions } from "./similarity-partition";
export { compileSubstructureQuery, type SubstructureQuery } from "./substructure-query";
export { type CompoundChange, type CompoundChangeFeed, IndexSync, type IndexSyncOptions } from "./sync";
export { bruteForceSimilar, type ReferenceEntry } from "./brute-force";
