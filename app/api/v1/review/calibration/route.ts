// GET: how often the group's predictive intervals contained the reported outcome, by interval level (the review
// page's calibration view). Same filters as the review page.
import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { queryOf } from "@/lib/api/body";
import { calibrationReport } from "@/lib/review/calibration-report";

export const GET = memberRoute("data:read", async (request, { member }) =>
  Response.json(await calibrationReport(await getDb(), { groupId: member.group.id, userId: member.user.id, isLead: member.role === "lead" }, queryOf(request))),
);
