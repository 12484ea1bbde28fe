"use server";
// Server actions of the library editor. Reading needs membership; changing needs "library:manage" (group leads).
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { memberAction } from "@/lib/authz/action";
import { getDb } from "@/lib/db/client";
import { parseInput, type ActionResult } from "@/lib/errors";
import { libraryKeySchema, reagentPropsSchema, solventPropsSchema, type ReagentPropsInput, type SolventPropsInput } from "./schemas";
import { removeEntry, saveReagent, saveSolvent } from "./service";

const actor = (m: { group: { id: string }; user: { id: string } }) => ({ groupId: m.group.id, userId: m.user.id });

export async function saveSolventAction(input: SolventPropsInput): Promise<ActionResult<{ key: string }>> {
  return memberAction("library:manage", async (member) => {
    const saved = await saveSolvent(await getDb(), actor(member), parseInput(solventPropsSchema, input));
    revalidatePath("/library");
    return { key: saved.key };
  });
}

export async function saveReagentAction(input: ReagentPropsInput): Promise<ActionResult<{ key: string }>> {
  return memberAction("library:manage", async (member) => {
    const saved = await saveReagent(await getDb(), actor(member), parseInput(reagentPropsSchema, input));
    revalidatePath("/library");
    return { key: saved.key };
  });
}

const removeSchema = z.object({ table: z.enum(["solvent", "reagent"]), key: libraryKeySchema });

export async function removeLibraryEntryAction(input: z.input<typeof removeSchema>): Promise<ActionResult> {
  return memberAction("library:manage", async (member) => {
    const { table, key } = parseInput(removeSchema, input);
    await removeEntry(await getDb(), actor(member), table, key);
    revalidatePath("/library");
    return undefined;
  });
}
