import { getDb } from "@/lib/db/client";
import { type RoleName } from "@/lib/authz/permissions";

export interface MyGroup {
  id: string;
  name: string;
  slug: string;
  role: RoleName;
}

/** The groups a user belongs to, for the group switcher (the user's own memberships only). */
export async function listMyGroups(userId: string): Promise<MyGroup[]> {
  const db = await getDb();
  const rows = await db.membership.findMany({
    where: { userId },
    orderBy: { group: { name: "asc" } },
    select: { role: true, group: { select: { id: true, name: true, slug: true } } },
  });
  return rows.map((r) => ({ ...r.group, role: r.role }));
}
