"use server";
import { revalidatePath } from "next/cache";
import { memberAction } from "@/lib/authz/action";
import { formFields, parseInput, type ActionResult } from "@/lib/errors";
import { createApiToken, createApiTokenSchema, revokeApiToken, tokenExpiry } from "@/lib/auth/api-tokens/tokens";
import { z } from "zod";

const PAGE = "/settings/api-tokens";

export async function createApiTokenAction(_prev: ActionResult<{ token: string; name: string }> | null, form: FormData): Promise<ActionResult<{ token: string; name: string }>> {
  return memberAction("tokens:manage", async (member) => {
    const { name, expiresInDays } = parseInput(createApiTokenSchema, formFields(form));
    const { token, row } = await createApiToken(member, name, tokenExpiry(expiresInDays));
    revalidatePath(PAGE);
    return { token, name: row.name };
  });
}

export async function revokeApiTokenAction(_prev: ActionResult | null, form: FormData): Promise<ActionResult> {
  return memberAction("tokens:manage", async (member) => {
    const { tokenId } = parseInput(z.object({ tokenId: z.string().min(1).max(64) }), formFields(form));
    await revokeApiToken(member, tokenId);
    revalidatePath(PAGE);
    return undefined;
  });
}
