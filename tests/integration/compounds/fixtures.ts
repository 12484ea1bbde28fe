// Groups, people and structure files for the compound tests, written through the data layer (no mocks).
// Names are invented; molecules are real.
import { randomBytes } from "node:crypto";
import { loadRDKit, usingMol } from "@/lib/chem/structure";
import { type Db } from "@/lib/db/client";
import { type CompoundActor } from "@/lib/compounds/service";

const unique = () => randomBytes(4).toString("hex");

export async function makeActor(db: Db, groupName = "Fenwick lab"): Promise<CompoundActor> {
  const group = await db.group.create({ data: { name: groupName, slug: `${groupName.toLowerCase().replace(/\W+/g, "-")}-${unique()}` } });
  const user = await db.user.create({ data: { name: "Ines Arkwright", email: `ines.${unique()}@example.org` } });
  await db.membership.create({ data: { groupId: group.id, userId: user.id, role: "member" } });
  return { groupId: group.id, userId: user.id };
}

/** A MOL block drawn by RDKit from SMILES, with `title` on its first line. */
export async function molBlock(smiles: string, title: string): Promise<string> {
  const rdkit = await loadRDKit();
  const mol = rdkit.get_mol(smiles);
  if (!mol) throw new Error(`fixture SMILES does not parse: ${smiles}`);
  const block = usingMol(mol, (m) => m.get_molblock());
  return [title, ...block.split("\n").slice(1)].join("\n");
}

/** An SD file from records of [MOL block, data fields]. */
export function sdFile(records: [string, Record<string, string>][]): string {
  return records
    .map(([block, data]) => block.replace(/\n*$/, "\n") + Object.entries(data).map(([k, v]) => `> <${k}>\n${v}\n\n`).join("") + "$$$$\n")
    .join("");
}

export async function makeWorkupUsing(db: Db, actor: CompoundActor, compoundId: string, title: string, options: { deviationPct?: number; status?: "as_expected" | "below" | "above" | "unknown" } = {}) {
  const workup = await db.workup.create({
    data: {
      groupId: actor.groupId, title, performedOn: new Date("2026-10-01T00:00:00Z"), spec: { components: [], operations: [] },
      status: options.status ?? "unknown", deviationPct: options.deviationPct ?? null,
    },
  });
  await db.workupComponent.create({ data: { groupId: actor.groupId, workupId: workup.id, compoundId, key: "p", name: title, role: "product", amountMmol: 5 } });
  return workup;
}
