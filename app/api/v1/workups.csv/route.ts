// GET: the filtered workup list as CSV (the list's filters; every matching row). Columns: lib/workups/csv-columns.ts.
import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { queryOf } from "@/lib/api/body";
import { primedTextStream } from "@/lib/api/stream";
import { exportWorkupsCsv } from "@/lib/workups/csv-export";

export const GET = memberRoute("data:read", async (request, { member }) => {
  // The filter is checked and the first rows read before any header is sent: a bad filter answers 4xx, not a reset.
  const body = await primedTextStream(exportWorkupsCsv(await getDb(), member.group.id, queryOf(request)));
  const day = new Date().toISOString().slice(0, 10);
  return new Response(body, {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": `attachment; filename="workups-${member.group.slug}-${day}.csv"`,
    },
  });
}, { personParam: "chemistId" });
