"use server";
// Server actions behind the editor's compound picker: search the group's registry by name, and register a structure
// from a SMILES without leaving the editor. Both start at the guard and stay inside the member's group.
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { memberAction } from "@/lib/authz/action";
import { getDb, type Db } from "@/lib/db/client";
import { parseInput, type ActionResult } from "@/lib/errors";
import { readStoredPKas, registerCompoundsSchema } from "@/lib/compounds/schemas";
import { registerCompounds, RegistrationRejected } from "@/lib/compounds/service";
import { type PickerCompound } from "@/lib/workups-client/compound-component";

/** Enough hits to choose from while typing, few enough to read. */
const PICKER_LIMIT = 12;

const pickerSelect = {
  id: true, name: true, canonicalSmiles: true, formula: true, molarMass: true, crippenLogP: true, logP: true, logPSource: true, pKas: true,
} as const;

async function byIds(db: Db, groupId: string, ids: string[]): Promise<PickerCompound[]> {
  const rows = await db.compound.findMany({ where: { groupId, id: { in: ids } }, select: pickerSelect });
  return rows.map((r) => ({ ...r, pKas: readStoredPKas(r.pKas) }));
}

const searchSchema = z.string().trim().max(200, { error: "search text must be ≤ 200 characters" });

export async function searchCompoundsAction(query: string): Promise<ActionResult<PickerCompound[]>> {
  return memberAction("data:read", async (member) => {
    const q = parseInput(searchSchema, query);
    const db = await getDb();
    const rows = await db.compound.findMany({
      where: {
        groupId: member.group.id,
        ...(q ? { OR: [{ name: { contains: q, mode: "insensitive" } }, { synonyms: { has: q.toLowerCase() } }, { canonicalSmiles: q }] } : {}),
      },
      orderBy: [{ name: "asc" }, { id: "asc" }],
      take: PICKER_LIMIT,
      select: pickerSelect,
    });
    return rows.map((r) => ({ ...r, pKas: readStoredPKas(r.pKas) }));
  });
}

const registerSchema = z.object({
  smiles: z.string().trim().min(1, { error: "enter a SMILES" }).max(2000, { error: "SMILES must be ≤ 2000 characters" })
    .refine((s) => !/\s/.test(s), { error: "a SMILES has no spaces; put the name in its own field" }),
  name: z.string().trim().max(200, { error: "name must be ≤ 200 characters" }).default(""),
});

export type InlineRegistration =
  | { status: "registered" | "existing"; compound: PickerCompound }
  | { status: "rejected"; message: string };

/** Registers one structure; a structure the group already has is answered with that compound instead. */
export async function registerForWorkupAction(input: z.input<typeof registerSchema>): Promise<ActionResult<InlineRegistration>> {
  return memberAction("data:write", async (member): Promise<InlineRegistration> => {
    const { smiles, name } = parseInput(registerSchema, input);
    const db = await getDb();
    const batch = parseInput(registerCompoundsSchema, { format: "smiles", text: name ? `${smiles} ${name}` : smiles, onDuplicate: "reject" });
    try {
      const result = await registerCompounds(db, { groupId: member.group.id, userId: member.user.id }, batch);
      revalidatePath("/compounds");
      const created = result.created[0];
      const [compound] = created ? await byIds(db, member.group.id, [created.id]) : [];
      return compound ? { status: "registered", compound } : { status: "rejected", message: "Nothing was registered." };
    } catch (error) {
      if (!(error instanceof RegistrationRejected)) throw error;
      const existingId = error.problems.find((p) => p.code === "duplicate_of_existing")?.duplicateOf?.id;
      const [existing] = existingId ? await byIds(db, member.group.id, [existingId]) : [];
      if (existing) return { status: "existing", compound: existing };
      return { status: "rejected", message: error.problems.map((p) => p.message.replace(/^Line 1( \([^)]*\))?: /, "")).join("; ") || error.message };
    }
  });
}
