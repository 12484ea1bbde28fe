"use server";
// Server actions of the partition pages. Each starts at the guard: adding a measurement needs data:write; excluding
// or restoring an observation is the lead's (library:manage).
import { revalidatePath } from "next/cache";
import { type z } from "zod";
import { recordIdArg } from "@/lib/api/action-args";
import { memberAction } from "@/lib/authz/action";
import { getDb } from "@/lib/db/client";
import { parseInput, type ActionResult } from "@/lib/errors";
import { addMeasurement, setExclusion, type AddedObservation } from "./service";
import { exclusionInputSchema, measurementInputSchema, type MeasurementInputRaw } from "./schemas";

/** The exclusion's own fields plus the compound page to refresh. */
const exclusionActionSchema = exclusionInputSchema.extend({ compoundId: recordIdArg("compoundId") });

const actor = (member: { group: { id: string }; user: { id: string } }) => ({ groupId: member.group.id, userId: member.user.id });

export async function addMeasurementAction(input: MeasurementInputRaw): Promise<ActionResult<AddedObservation>> {
  return memberAction("data:write", async (member) => {
    const parsed = parseInput(measurementInputSchema, input);
    const added = await addMeasurement(await getDb(), actor(member), input);
    revalidatePath(`/partition/${parsed.compoundId}`);
    revalidatePath("/partition");
    return added;
  }, { where: "addMeasurementAction" });
}

export async function setExclusionAction(input: z.input<typeof exclusionActionSchema>): Promise<ActionResult<{ jobId: string | null }>> {
  return memberAction("library:manage", async (member) => {
    const { compoundId, ...exclusion } = parseInput(exclusionActionSchema, input);
    const result = await setExclusion(await getDb(), actor(member), exclusion);
    revalidatePath(`/partition/${compoundId}`);
    revalidatePath("/partition");
    return result;
  }, { where: "setExclusionAction" });
}
