"use server";
// Server actions of the partition pages. Each starts at the guard: adding a measurement needs data:write; excluding
// or restoring an observation is the lead's (library:manage).
import { revalidatePath } from "next/cache";
import { memberAction } from "@/lib/authz/action";
import { getDb } from "@/lib/db/client";
import { type ActionResult } from "@/lib/errors";
import { addMeasurement, setExclusion, type AddedObservation } from "./service";
import { type MeasurementInputRaw } from "./schemas";

const actor = (member: { group: { id: string }; user: { id: string } }) => ({ groupId: member.group.id, userId: member.user.id });

export async function addMeasurementAction(input: MeasurementInputRaw): Promise<ActionResult<AddedObservation>> {
  return memberAction("data:write", async (member) => {
    const added = await addMeasurement(await getDb(), actor(member), input);
    revalidatePath(`/partition/${input.compoundId}`);
    revalidatePath("/partition");
    return added;
  }, { where: "addMeasurementAction" });
}

export async function setExclusionAction(input: { observationId: string; excluded: boolean; reason?: string; compoundId: string }): Promise<ActionResult<{ jobId: string | null }>> {
  return memberAction("library:manage", async (member) => {
    const result = await setExclusion(await getDb(), actor(member), input);
    revalidatePath(`/partition/${input.compoundId}`);
    revalidatePath("/partition");
    return result;
  }, { where: "setExclusionAction" });
}
