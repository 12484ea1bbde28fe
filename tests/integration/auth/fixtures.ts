// Groups and people for the auth tests, written through the data layer (no mocks). Names are invented.
import { randomBytes } from "node:crypto";
import { type Db } from "@/lib/db/client";
import { type Credentials } from "@/lib/authz/guard";
import { type RoleName } from "@/lib/authz/permissions";

const unique = () => randomBytes(4).toString("hex");

export async function makeGroup(db: Db, name = "Demo group") {
  return db.group.create({ data: { name, slug: `${name.toLowerCase().replace(/\W+/g, "-")}-${unique()}` } });
}

export async function makeUser(db: Db, name: string, passwordHash: string | null = null) {
  return db.user.create({ data: { name, email: `${name.toLowerCase().replace(/\W+/g, ".")}.${unique()}@example.org`, passwordHash } });
}

export async function makeMember(db: Db, groupId: string, role: RoleName, name = `${role} ${unique()}`) {
  const user = await makeUser(db, name);
  const membership = await db.membership.create({ data: { groupId, userId: user.id, role } });
  return { user, membership };
}

export function sessionOf(userId: string, activeGroupId: string | null = null): Credentials {
  return { kind: "session", userId, activeGroupId };
}

export async function makeWorkup(db: Db, groupId: string, title = "Aqueous wash of a test ester") {
  return db.workup.create({ data: { groupId, title, performedOn: new Date("2026-10-01T00:00:00Z"), spec: { components: [], operations: [] } } });
}
