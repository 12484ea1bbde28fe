/** What the index keeps per compound outside the WebAssembly memory. */
export interface IndexEntry<Meta> {
  id: string;
  groupId: string;
  meta: Meta | undefined;
  /** Set bits of the Morgan fingerprint: the bucket it lives in. */
  popcount: number;
  /** Position inside its popcount bucket. */
  position: number;
  /** Compact graph for exact substructure matching; absent when the entry is similarity-only. */
  graph: Uint8Array | undefined;
  /** Canonical SMILES, for queries the graph matcher cannot answer and RDKit must check. */
  smiles: string | undefined;
  /** Milliseconds since the epoch of the row's last change, when known. */
  updatedAt: number | undefined;
}

/** Ranking order shared by the index and the brute-force reference: higher score first, then smaller id. */
export function before(scoreA: number, idA: string, scoreB: number, idB: string): boolean {
  return scoreA > scoreB || (scoreA === scoreB && idA < idB);
}
