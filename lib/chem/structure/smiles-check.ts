/**
 * Lexical checks on a SMILES string before RDKit sees it. RDKit reports most syntax errors only as "check for
 * mistakes around position N"; these checks name the actual problem (unknown element, unclosed bracket, unmatched
 * parenthesis, dangling ring bond) and its position. Grammar: OpenSMILES specification (opensmiles.org, 2007–2016).
 */
import { atomicNumber } from "./elements";
import { StructureError } from "./errors";

const ALLOWED = /^[A-Za-z0-9[\]()=#$:/\\.@+\-%*~]$/;
const ORGANIC_TWO = new Set(["Cl", "Br"]);
const ORGANIC_ONE = new Set(["B", "C", "N", "O", "P", "S", "F", "I", "b", "c", "n", "o", "p", "s", "*"]);
const AROMATIC_BRACKET = new Set(["b", "c", "n", "o", "p", "s", "se", "as", "te", "si"]);

/** Throws a StructureError for the first lexical problem found; returns silently when RDKit should decide. */
export function checkSmilesLexically(smiles: string): void {
  const openRings = new Map<string, number>();
  const parens: number[] = [];
  // A ring-bond digit must follow an atom (or its bond symbol); at the start, after "(" or after "." it cannot.
  let ringAllowed = false;
  let i = 0;
  while (i < smiles.length) {
    const ch = smiles.charAt(i);
    const pos = i + 1;
    if (/\s/.test(ch)) {
      throw new StructureError("whitespace_in_smiles", `SMILES may not contain spaces or line breaks (position ${pos}); put one structure per line and the name after it.`, { position: pos });
    }
    if (!ALLOWED.test(ch)) {
      throw new StructureError("invalid_character", `Character '${ch}' at position ${pos} is not allowed in SMILES.`, { position: pos });
    }
    if (ch === "[") {
      const close = smiles.indexOf("]", i + 1);
      const nextOpen = smiles.indexOf("[", i + 1);
      if (close < 0 || (nextOpen >= 0 && nextOpen < close)) {
        throw new StructureError("unbalanced_brackets", `The '[' at position ${pos} is never closed with ']'.`, { position: pos });
      }
      checkBracketAtom(smiles.slice(i + 1, close), pos);
      ringAllowed = true;
      i = close + 1;
      continue;
    }
    if (ch === "]") throw new StructureError("unbalanced_brackets", `The ']' at position ${pos} has no matching '['.`, { position: pos });
    if ((ch === "%" || /\d/.test(ch)) && !ringAllowed) {
      throw new StructureError("bad_ring_closure", `Ring-bond digit at position ${pos} does not follow an atom.`, { position: pos });
    }
    if (ch === "(" || ch === ".") ringAllowed = false;
    if (ch === "(") parens.push(pos);
    else if (ch === ")") {
      if (parens.pop() === undefined) throw new StructureError("unbalanced_parentheses", `The ')' at position ${pos} has no matching '('.`, { position: pos });
    } else if (ch === "%") {
      const label = smiles.slice(i + 1, i + 3);
      if (!/^\d\d$/.test(label)) {
        throw new StructureError("bad_ring_closure", `Ring-bond label '%' at position ${pos} must be followed by two digits (e.g. %10).`, { position: pos });
      }
      toggleRing(openRings, `%${label}`, pos);
      i += 3;
      continue;
    } else if (/\d/.test(ch)) toggleRing(openRings, ch, pos);
    else if (/[A-Za-z*]/.test(ch)) {
      i += checkOrganicAtom(smiles, i);
      ringAllowed = true;
      continue;
    }
    i += 1;
  }
  const unclosed = parens.pop();
  if (unclosed !== undefined) {
    throw new StructureError("unbalanced_parentheses", `The '(' at position ${unclosed} is never closed with ')'.`, { position: unclosed });
  }
  for (const [label, position] of openRings) {
    throw new StructureError("unclosed_ring", `Ring bond ${label} opened at position ${position} is never closed.`, { position });
  }
}

function toggleRing(open: Map<string, number>, label: string, pos: number): void {
  if (open.has(label)) open.delete(label);
  else open.set(label, pos);
}

/** Atoms outside brackets must be in the organic subset; returns the number of characters consumed. */
function checkOrganicAtom(smiles: string, i: number): number {
  const pos = i + 1;
  const one = smiles.charAt(i);
  const next = smiles.charAt(i + 1);
  const two = one + next;
  if (ORGANIC_TWO.has(two)) return 2;
  // "Na" reads as N followed by an invalid 'a'; "Sn" reads legally as S and aromatic n.
  const twoIsElement = /^[A-Z][a-z]$/.test(two) && atomicNumber(two) !== undefined && !ORGANIC_ONE.has(next);
  if (twoIsElement) throw bracketsNeeded(two, pos);
  if (ORGANIC_ONE.has(one)) return 1;
  if (/[A-Z]/.test(one) && atomicNumber(one) !== undefined) throw bracketsNeeded(one, pos);
  if (AROMATIC_BRACKET.has(two)) throw bracketsNeeded(two, pos);
  throw new StructureError("unknown_element", `'${one}' at position ${pos} is not an element symbol.`, { position: pos });
}

function bracketsNeeded(symbol: string, pos: number): StructureError {
  return new StructureError("smiles_syntax", `Element ${symbol} at position ${pos} must be written in square brackets, e.g. [${symbol}].`, { position: pos });
}

function checkBracketAtom(content: string, openPos: number): void {
  const match = /^(\d*)(\*|[A-Z][a-z]?|[a-z][a-z]?)/.exec(content);
  if (!match) {
    throw new StructureError("unknown_element", `The bracket atom at position ${openPos} has no element symbol.`, { position: openPos });
  }
  const raw = match[2] ?? "";
  const symbol = resolveBracketSymbol(raw);
  if (symbol === undefined) {
    throw new StructureError("unknown_element", `'${raw}' in the bracket atom at position ${openPos} is not an element symbol.`, { position: openPos + 1 + (match[1]?.length ?? 0) });
  }
}

/** Greedy two-letter match first ([Co] is cobalt), then one letter ([CH4]); aromatic forms are lowercase. */
function resolveBracketSymbol(raw: string): string | undefined {
  if (raw === "*") return raw;
  if (AROMATIC_BRACKET.has(raw)) return raw;
  if (/^[A-Z]/.test(raw)) {
    if (atomicNumber(raw) !== undefined) return raw;
    const one = raw.charAt(0);
    if (atomicNumber(one) !== undefined) return one;
    return undefined;
  }
  const one = raw.charAt(0);
  return AROMATIC_BRACKET.has(one) ? one : undefined;
}
