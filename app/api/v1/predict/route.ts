// POST: predict a workup with the group's library, without saving anything. The engine runs on a worker thread within
// the caller's heavy slots; a request beyond the engine budget is refused with 422 (lib/workers/engine.ts).
import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { readJsonBody } from "@/lib/api/body";
import { predictSpec } from "@/lib/workups/predict-request";

export const POST = memberRoute("data:read", async (request, { member }) =>
  Response.json(await predictSpec(await getDb(), member.group.id, await readJsonBody(request), member.user.id)),
);
