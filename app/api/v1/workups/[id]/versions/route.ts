// GET: every version of a workup, newest first, with who saved it and when.
import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { listVersions } from "@/lib/workups/history";

export const GET = memberRoute<{ id: string }>("data:read", async (_request, { member, params }) =>
  Response.json({ versions: await listVersions(await getDb(), member.group.id, params.id) }),
);
