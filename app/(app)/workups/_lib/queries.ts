// The detail loader under the guard's group, for callers outside the workup pages (and the guard's integration test):
// another group's workup is simply not found.
import { getDb } from "@/lib/db/client";
import { type MemberContext } from "@/lib/authz";
import { getWorkupDetail, type WorkupDetail } from "@/lib/workups/queries";

export async function getWorkup(member: MemberContext, id: string): Promise<WorkupDetail> {
  return getWorkupDetail(await getDb(), member.group.id, id);
}
