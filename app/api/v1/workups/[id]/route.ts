// GET: a workup as the editor opens it. PUT: save a new version (body carries baseVersion). DELETE: remove it.
import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { readJsonBody } from "@/lib/api/body";
import { actorOf } from "@/lib/workups/context";
import { getWorkupDetail } from "@/lib/workups/queries";
import { deleteWorkup, updateWorkup } from "@/lib/workups/service";

type Params = { id: string };

export const GET = memberRoute<Params>("data:read", async (_request, { member, params }) =>
  Response.json(await getWorkupDetail(await getDb(), member.group.id, params.id)),
);

export const PUT = memberRoute<Params>("data:write", async (request, { member, params }) =>
  Response.json(await updateWorkup(await getDb(), actorOf(member), params.id, await readJsonBody(request))),
);

export const DELETE = memberRoute<Params>("data:write", async (_request, { member, params }) => {
  await deleteWorkup(await getDb(), actorOf(member), params.id);
  return new Response(null, { status: 204 });
});
