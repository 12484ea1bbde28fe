// POST: record (or clear with `cause: null`) the cause the group found for the workup's shortfall at review.
import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { readJsonBody } from "@/lib/api/body";
import { actorOf } from "@/lib/workups/context";
import { recordFoundCause } from "@/lib/workups/found-cause";

export const POST = memberRoute<{ id: string }>("data:write", async (request, { member, params }) =>
  Response.json(await recordFoundCause(await getDb(), actorOf(member), params.id, await readJsonBody(request))),
);
