/**
 * Every way a structure can be refused, with a message a chemist can act on. The app maps StructureError to a
 * 422 response; `code` is stable for tests and clients, `message` is for people, `detail` keeps RDKit's own words.
 */
export const STRUCTURE_ERROR_CODES = [
  "empty_input",
  "input_too_large",
  "too_many_atoms",
  "too_many_records",
  "invalid_character",
  "whitespace_in_smiles",
  "unbalanced_parentheses",
  "unbalanced_brackets",
  "unclosed_ring",
  "bad_ring_closure",
  "unknown_element",
  "smiles_syntax",
  "valence",
  "aromaticity",
  "unspecified_atom",
  "mol_block_header",
  "mol_block_counts",
  "mol_block_atom",
  "mol_block_bond",
  "mol_block_truncated",
  "mol_block_unreadable",
  "sdf_record_without_molecule",
  "smarts_syntax",
  "unreadable",
] as const;

export type StructureErrorCode = (typeof STRUCTURE_ERROR_CODES)[number];

export interface StructureErrorDetails {
  /** 1-based character position in a SMILES/SMARTS string, when known. */
  position?: number;
  /** 1-based line number in a MOL block or SD file, when known. */
  line?: number;
  /** 0-based atom index for valence and aromaticity problems. */
  atoms?: number[];
  /** RDKit's log output, verbatim, for support. */
  detail?: string;
}

export class StructureError extends Error {
  override readonly name = "StructureError";
  readonly code: StructureErrorCode;
  readonly position: number | undefined;
  readonly line: number | undefined;
  readonly atoms: number[] | undefined;
  readonly detail: string | undefined;

  constructor(code: StructureErrorCode, message: string, details: StructureErrorDetails = {}) {
    super(message);
    this.code = code;
    this.position = details.position;
    this.line = details.line;
    this.atoms = details.atoms;
    this.detail = details.detail;
  }
}

export function isStructureError(error: unknown): error is StructureError {
  return error instanceof StructureError;
}
