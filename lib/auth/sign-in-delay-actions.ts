"use server";
import { memberAction } from "@/lib/authz/action";
import { formFields, parseInput, type ActionResult } from "@/lib/errors";
import { liftMemberSignInDelay } from "@/lib/auth/sign-in-delay";
import { membershipIdSchema } from "@/lib/groups/schemas";

export async function liftSignInDelayAction(_prev: ActionResult<{ lifted: number }> | null, form: FormData): Promise<ActionResult<{ lifted: number }>> {
  return memberAction("members:manage", async (member) => {
    const { membershipId } = parseInput(membershipIdSchema, formFields(form));
    return { lifted: await liftMemberSignInDelay(member, membershipId) };
  });
}
