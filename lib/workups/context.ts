// Who is acting and in which group, and the transaction client type. Service functions take `db` first and an
// Actor, so the server actions, the REST routes, the importer, the seed and the tests all call the same code.
import { type Db, type DbTransaction } from "@/lib/db/client";
import { type MemberContext } from "@/lib/authz/guard";

export interface Actor {
  groupId: string;
  userId: string;
}

export function actorOf(member: Pick<MemberContext, "user" | "group">): Actor {
  return { groupId: member.group.id, userId: member.user.id };
}

/** The client inside an interactive transaction; with the secret columns omitted. */
export type Tx = DbTransaction;

/** Either the app's client or a transaction's: for reads and checks used in both places. */
export type Client = Db | Tx;

/** Long imports write thousands of rows in one transaction; Prisma's 5 s default would abort them. */
export const LONG_TRANSACTION = { maxWait: 10_000, timeout: 600_000 } as const;
