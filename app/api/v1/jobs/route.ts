import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { jobsStatus } from "@/lib/jobs/status";

/** GET /api/v1/jobs: the group's background jobs waiting or running (with progress), and the last one finished. */
export const GET = memberRoute("data:read", async (_request, { member }) => {
  const status = await jobsStatus(await getDb(), member.group.id);
  return Response.json(status, { headers: { "Cache-Control": "no-store" } });
});
