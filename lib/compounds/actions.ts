"use server";
// Server actions of the compound pages. Each starts at the guard (memberAction) and parses its input with the same
// schema the REST route uses.
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { memberAction } from "@/lib/authz/action";
import { type MemberContext } from "@/lib/authz/guard";
import { getDb } from "@/lib/db/client";
import { parseInput, type ActionResult } from "@/lib/errors";
import { clearLogP, deleteCompound, revertPKa, setLogP, setPKa } from "./edits";
import { type RecordProblem } from "./import-records";
import { logPEditSchema, pKaEditSchema, registerCompoundsSchema, type RegisterCompoundsInput } from "./schemas";
import { registerCompounds, RegistrationRejected, type RegisteredCompound } from "./service";
import { withHeavySlot } from "@/lib/workers/limits";

export type RegisterOutcome =
  | { status: "registered"; created: RegisteredCompound[]; skipped: RecordProblem[] }
  | { status: "rejected"; message: string; problems: RecordProblem[]; recordCount: number };

const actor = (member: MemberContext) => ({ groupId: member.group.id, userId: member.user.id });

/** A batch that fails record checks is a report for the form, not an error: it comes back as "rejected". */
export async function registerCompoundsAction(input: RegisterCompoundsInput): Promise<ActionResult<RegisterOutcome>> {
  return memberAction("data:write", async (member): Promise<RegisterOutcome> => {
    const parsed = parseInput(registerCompoundsSchema, input);
    try {
      // Reading every structure is heavy work: one of the member's heavy slots (429 when they are all taken).
      const result = await withHeavySlot(member.user.id, async () => registerCompounds(await getDb(), actor(member), parsed));
      revalidatePath("/compounds");
      return { status: "registered", ...result };
    } catch (error) {
      if (error instanceof RegistrationRejected) {
        return { status: "rejected", message: error.message, problems: error.problems, recordCount: error.recordCount };
      }
      throw error;
    }
  }, { where: "registerCompoundsAction" });
}

export async function setLogPAction(input: z.input<typeof logPEditSchema>): Promise<ActionResult> {
  return memberAction("data:write", async (member) => {
    const edit = parseInput(logPEditSchema, input);
    await setLogP(await getDb(), actor(member), edit);
    revalidatePath(`/compounds/${edit.compoundId}`);
    return undefined;
  });
}

const clearLogPSchema = z.object({ compoundId: z.string().min(1), expected: z.number().nullable() });

export async function clearLogPAction(input: z.input<typeof clearLogPSchema>): Promise<ActionResult> {
  return memberAction("data:write", async (member) => {
    const { compoundId, expected } = parseInput(clearLogPSchema, input);
    await clearLogP(await getDb(), actor(member), compoundId, expected);
    revalidatePath(`/compounds/${compoundId}`);
    return undefined;
  });
}

export async function setPKaAction(input: z.input<typeof pKaEditSchema>): Promise<ActionResult> {
  return memberAction("data:write", async (member) => {
    const edit = parseInput(pKaEditSchema, input);
    await setPKa(await getDb(), actor(member), edit);
    revalidatePath(`/compounds/${edit.compoundId}`);
    return undefined;
  });
}

const revertPKaSchema = z.object({ compoundId: z.string().min(1), index: z.number().int().min(0), expected: z.number() });

export async function revertPKaAction(input: z.input<typeof revertPKaSchema>): Promise<ActionResult> {
  return memberAction("data:write", async (member) => {
    const { compoundId, index, expected } = parseInput(revertPKaSchema, input);
    await revertPKa(await getDb(), actor(member), compoundId, index, expected);
    revalidatePath(`/compounds/${compoundId}`);
    return undefined;
  });
}

const deleteSchema = z.object({ compoundId: z.string().min(1) });

export async function deleteCompoundAction(input: z.input<typeof deleteSchema>): Promise<ActionResult> {
  return memberAction("data:write", async (member) => {
    const { compoundId } = parseInput(deleteSchema, input);
    await deleteCompound(await getDb(), actor(member), compoundId);
    revalidatePath("/compounds");
    return undefined;
  });
}
