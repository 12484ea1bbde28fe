/**
 * A substructure query ready for the index: its pattern fingerprint for screening, the compiled graph matcher when
 * RDKit's rules for it are reproduced exactly, and an RDKit check for the rare query the matcher does not cover.
 * Holds one RDKit molecule: call dispose() when done.
 */
import { patternFingerprint } from "@/lib/chem/structure/fingerprint";
import { type RDKitModule, type RDKitMol } from "@/lib/chem/structure/rdkit";
import { parseRDKitJson } from "@/lib/chem/structure/rdkit-json";
import { readSmarts, readSmiles } from "@/lib/chem/structure/read";
import { GraphMatcher } from "./graph-match";
import { compileQueryPlan, UnsupportedQuery } from "./query-graph";

export interface SubstructureQuery {
  text: string;
  /** "smarts": SMARTS semantics (C is aliphatic carbon, bonds default to single-or-aromatic); "smiles": the molecule as a query. */
  mode: "smarts" | "smiles";
  patternFingerprint: Uint8Array;
  /** Undefined when the query uses features only RDKit evaluates (then `verify` decides each candidate). */
  matcher: GraphMatcher | undefined;
  unsupportedReason: string | undefined;
  verify(smiles: string): boolean;
  dispose(): void;
}

export function compileSubstructureQuery(rdkit: RDKitModule, text: string, mode: "smarts" | "smiles" = "smarts"): SubstructureQuery {
  const query: RDKitMol = mode === "smarts" ? readSmarts(rdkit, text) : readSmiles(rdkit, text, { allowDummyAtoms: true });
  try {
    const fingerprint = patternFingerprint(query);
    let matcher: GraphMatcher | undefined;
    let unsupportedReason: string | undefined;
    try {
      matcher = new GraphMatcher(compileQueryPlan(parseRDKitJson(query.get_json())));
    } catch (error) {
      if (!(error instanceof UnsupportedQuery)) throw error;
      unsupportedReason = error.message;
    }
    let disposed = false;
    return {
      text,
      mode,
      patternFingerprint: fingerprint,
      matcher,
      unsupportedReason,
      verify(smiles: string): boolean {
        if (disposed) throw new Error("substructure query already disposed");
        const target = rdkit.get_mol(smiles);
        if (!target) return false;
        try {
          return target.get_substruct_match(query) !== "{}";
        } finally {
          target.delete();
        }
      },
      dispose(): void {
        if (!disposed) query.delete();
        disposed = true;
      },
    };
  } catch (error) {
    query.delete();
    throw error;
  }
}
