// GET: the whole group as one JSON document (lib/workups/export-format.ts), as a download.
import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { exportGroup } from "@/lib/workups/group-export";

export const GET = memberRoute("data:read", async (_request, { member }) => {
  const document = await exportGroup(await getDb(), member.group.id);
  const day = document.exportedAt.slice(0, 10);
  return Response.json(document, { headers: { "Content-Disposition": `attachment; filename="layerwise-${member.group.slug}-${day}.json"` } });
});
