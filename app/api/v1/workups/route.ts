// GET: one page of the group's workups (filters and cursor in the query string). POST: create a workup.
import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { queryOf, readJsonBody } from "@/lib/api/body";
import { actorOf } from "@/lib/workups/context";
import { listWorkups } from "@/lib/workups/queries";
import { createWorkup } from "@/lib/workups/service";

export const GET = memberRoute(
  "data:read",
  async (request, { member }) => Response.json(await listWorkups(await getDb(), member.group.id, queryOf(request))),
  { personParam: "chemistId" },
);

export const POST = memberRoute("data:write", async (request, { member }) => {
  const saved = await createWorkup(await getDb(), actorOf(member), await readJsonBody(request));
  return Response.json(saved, { status: 201, headers: { Location: `/api/v1/workups/${saved.id}` } });
});
