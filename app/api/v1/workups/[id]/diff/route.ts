// GET ?from=1&to=3: what changed between two versions of a workup.
import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { queryOf } from "@/lib/api/body";
import { parseInput } from "@/lib/errors";
import { diffVersions } from "@/lib/workups/history";
import { versionPairSchema } from "@/lib/workups/schemas";

export const GET = memberRoute<{ id: string }>("data:read", async (request, { member, params }) => {
  const { from, to } = parseInput(versionPairSchema, queryOf(request));
  return Response.json(await diffVersions(await getDb(), member.group.id, params.id, from, to));
});
