/** Molecular formula in Hill order (Hill, J. Am. Chem. Soc. 1900, 22, 478): C, then H, then the rest alphabetically;
 * without carbon, every element alphabetically. A net charge is appended as "+", "2+", "-"... */
import { elementSymbol } from "./elements";
import { type JsonMolecule } from "./rdkit-json";

export function hillFormula(molecule: JsonMolecule): string {
  const counts = new Map<string, number>();
  const add = (symbol: string, n: number) => counts.set(symbol, (counts.get(symbol) ?? 0) + n);
  let charge = 0;
  for (const atom of molecule.atoms) {
    add(elementSymbol(atom.z), 1);
    if (atom.impHs > 0) add("H", atom.impHs);
    charge += atom.chg;
  }
  const symbols = [...counts.keys()].sort();
  const order = counts.has("C") ? ["C", ...(counts.has("H") ? ["H"] : []), ...symbols.filter((s) => s !== "C" && s !== "H")] : symbols;
  const body = order.map((s) => `${s}${(counts.get(s) ?? 0) > 1 ? String(counts.get(s)) : ""}`).join("");
  if (charge === 0) return body;
  const magnitude = Math.abs(charge) > 1 ? String(Math.abs(charge)) : "";
  return `${body}${magnitude}${charge > 0 ? "+" : "-"}`;
}

export function netCharge(molecule: JsonMolecule): number {
  return molecule.atoms.reduce((sum, atom) => sum + atom.chg, 0);
}
