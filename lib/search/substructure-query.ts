/**
 * A substructure query ready for the index: a screening fingerprint, a graph matcher, and an RDKit check. When the
 * matcher reproduces RDKit's rules for every test in the query, it decides alone (`exact`); otherwise it runs a
 * relaxed plan as a prefilter and RDKit decides each survivor. Holds one RDKit molecule: call dispose() when done.
 */
import { type RDKitModule, type RDKitMol } from "@/lib/chem/structure/rdkit";
import { parseRDKitJson } from "@/lib/chem/structure/rdkit-json";
import { readSmarts, readSmiles } from "@/lib/chem/structure/read";
import { GraphMatcher } from "./graph-match";
import { compileQueryPlan, UnsupportedQuery } from "./query-graph";
import { queryScreen } from "./screen";

export interface SubstructureQuery {
  text: string;
  /** "smarts": SMARTS semantics (C is aliphatic carbon, bonds default to single-or-aromatic); "smiles": the molecule as a query. */
  mode: "smarts" | "smiles";
  /** Bits every matching compound's screen has (screen.ts). */
  screen: Uint8Array;
  matcher: GraphMatcher;
  /** True when `matcher` alone decides; false when RDKit (`verify`) confirms what the relaxed matcher lets through. */
  exact: boolean;
  /** Why the matcher is relaxed, when it is. */
  unsupportedReason: string | undefined;
  verify(smiles: string): boolean;
  dispose(): void;
}

export function compileSubstructureQuery(rdkit: RDKitModule, text: string, mode: "smarts" | "smiles" = "smarts"): SubstructureQuery {
  const query: RDKitMol = mode === "smarts" ? readSmarts(rdkit, text) : readSmiles(rdkit, text, { allowDummyAtoms: true });
  try {
    const molecule = parseRDKitJson(query.get_json());
    let unsupportedReason: string | undefined;
    let plan;
    try {
      plan = compileQueryPlan(molecule);
    } catch (error) {
      if (!(error instanceof UnsupportedQuery)) throw error;
      unsupportedReason = error.message;
      plan = compileQueryPlan(molecule, undefined, true);
    }
    let disposed = false;
    return {
      text,
      mode,
      screen: queryScreen(plan),
      matcher: new GraphMatcher(plan),
      exact: unsupportedReason === undefined,
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
