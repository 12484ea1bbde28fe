// POST: report (or replace) the outcome; answers the recovery, deviation, status and likely causes.
import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { readJsonBody } from "@/lib/api/body";
import { actorOf } from "@/lib/workups/context";
import { reportOutcome } from "@/lib/workups/outcome";

export const POST = memberRoute<{ id: string }>("data:write", async (request, { member, params }) =>
  Response.json(await reportOutcome(await getDb(), actorOf(member), params.id, await readJsonBody(request))),
);
