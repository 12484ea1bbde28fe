// What the editor pages load on the server: the group's members (chemist choices, names in diffs) and the group's
// library (engine overrides). Scoped by the guard's group.
import { getDb, type Db } from "@/lib/db/client";
import { type MemberContext } from "@/lib/authz";
import { groupLibrary } from "@/lib/workups/library";
import { type LibraryOverrides } from "@/lib/chem/library";

export interface MemberName {
  id: string;
  name: string;
}

/** The group's members by name, in one statement (the membership as an EXISTS, not memberships and then users). */
export async function memberNames(db: Db, groupId: string): Promise<MemberName[]> {
  const users = await db.user.findMany({ where: { memberships: { some: { groupId } } }, select: { id: true, name: true } });
  return users.sort((a, b) => a.name.localeCompare(b.name, "en"));
}

export async function groupMembers(member: MemberContext): Promise<MemberName[]> {
  return memberNames(await getDb(), member.group.id);
}

export async function editorContext(member: MemberContext): Promise<{ members: MemberName[]; library: LibraryOverrides }> {
  const [members, library] = await Promise.all([groupMembers(member), getDb().then((db) => groupLibrary(db, member.group.id))]);
  return { members, library };
}

export function todayUtc(): string {
  return new Date().toISOString().slice(0, 10);
}
