// The group's editable copy of the solvent and aqueous-reagent library, handed to the engine as overrides of the
// shipped tables (lib/chem/library.ts replaces or adds entries by key).
import { type LibraryOverrides } from "@/lib/chem/library";
import { type SolventProps } from "@/lib/chem/data/solvents";
import { type ReagentProps } from "@/lib/chem/data/reagents";
import { type Client } from "./context";

export async function groupLibrary(db: Client, groupId: string): Promise<LibraryOverrides> {
  const [solvents, reagents] = await Promise.all([
    db.solvent.findMany({ where: { groupId }, select: { key: true, props: true } }),
    db.aqueousReagent.findMany({ where: { groupId }, select: { key: true, props: true } }),
  ]);
  // The props columns hold the engine's own record types, written through the library editor's schema.
  return {
    ...(solvents.length > 0
      ? { solvents: Object.fromEntries(solvents.map((s) => [s.key, { ...(s.props as unknown as SolventProps), key: s.key }])) }
      : {}),
    ...(reagents.length > 0
      ? { reagents: Object.fromEntries(reagents.map((r) => [r.key, { ...(r.props as unknown as ReagentProps), key: r.key }])) }
      : {}),
  };
}
