/** Turns RDKit's log lines after a failed parse into a specific StructureError. */
import { StructureError } from "./errors";

export function errorFromRDKitLog(log: string, what: "SMILES" | "SMARTS" | "MOL block"): StructureError {
  const detail = log.replace(/^\[\d\d:\d\d:\d\d\] ?/gm, "").trim();
  const valence = /Explicit valence for atom # ?(\d+) (\w+)(?:, (\d+))?, is greater than permitted/.exec(detail);
  if (valence) {
    const atom = Number(valence[1]);
    const bonds = valence[3] ? ` (valence ${valence[3]})` : "";
    return new StructureError("valence", `Atom ${atom + 1} (${valence[2]}) has more bonds than it allows${bonds}; check bond orders, charges and hydrogens.`, { atoms: [atom], detail });
  }
  const kekule = /Can't kekulize mol\.\s+Unkekulized atoms: ([\d ]+)/.exec(detail);
  if (kekule) {
    const atoms = (kekule[1] ?? "").trim().split(/\s+/).map(Number);
    return new StructureError("aromaticity", `The aromatic ring with atoms ${atoms.map((a) => a + 1).join(", ")} cannot be given alternating single and double bonds; check lowercase (aromatic) atoms and [nH] hydrogens.`, { atoms, detail });
  }
  const nonRing = /non-ring atom (\d+) marked aromatic/.exec(detail);
  if (nonRing) {
    const atom = Number(nonRing[1]);
    return new StructureError("aromaticity", `Atom ${atom + 1} is written as aromatic (lowercase) but is not in a ring.`, { atoms: [atom], detail });
  }
  if (/unclosed ring/.test(detail)) return new StructureError("unclosed_ring", `A ring bond in the ${what} is opened but never closed.`, { detail });
  if (/extra (open|close) parenthes/.test(detail)) return new StructureError("unbalanced_parentheses", `The ${what} has unmatched parentheses.`, { detail });
  if (/duplicate|ring closure/i.test(detail)) {
    return new StructureError("bad_ring_closure", `The ${what} closes a ring onto an atom it is already bonded to, or onto itself.`, { detail, ...position(detail) });
  }
  const pos = position(detail);
  if (pos.position !== undefined) {
    const code = what === "SMARTS" ? "smarts_syntax" : "smiles_syntax";
    return new StructureError(code, `${what} syntax error near position ${pos.position}.`, { detail, ...pos });
  }
  if (what === "MOL block") return new StructureError("mol_block_unreadable", `RDKit could not read the MOL block${detail ? `: ${firstLine(detail)}` : "."}`, { detail });
  return new StructureError(what === "SMARTS" ? "smarts_syntax" : "unreadable", `RDKit could not read the ${what}${detail ? `: ${firstLine(detail)}` : "."}`, { detail });
}

function position(detail: string): { position?: number } {
  const match = /around position (\d+)/.exec(detail);
  return match ? { position: Number(match[1]) } : {};
}

function firstLine(text: string): string {
  return (text.split("\n").find((l) => l.trim() && !/^\*+$/.test(l.trim())) ?? text).trim().slice(0, 200);
}
