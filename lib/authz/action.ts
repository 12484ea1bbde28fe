// The guard for server actions: checks, runs, and turns every failure into an ActionResult the form can show.
import { actionFailure, type ActionResult } from "@/lib/errors";
import { requireMember } from "@/lib/authz/index";
import { type GuardOptions, type MemberContext } from "@/lib/authz/guard";
import { type Permission } from "@/lib/authz/permissions";

export async function memberAction<T>(
  permission: Permission,
  run: (context: MemberContext) => Promise<T>,
  options?: GuardOptions & { where?: string },
): Promise<ActionResult<T>> {
  try {
    const context = await requireMember(permission, { ...options, sessionOnly: true });
    return { ok: true, data: await run(context) };
  } catch (error) {
    return actionFailure(error, options?.where ?? `action needing ${permission}`);
  }
}
