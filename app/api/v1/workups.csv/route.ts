// GET: the filtered workup list as CSV (the list's filters; every matching row). Columns: lib/workups/csv-columns.ts.
import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { queryOf } from "@/lib/api/body";
import { textStream } from "@/lib/api/stream";
import { exportWorkupsCsv } from "@/lib/workups/csv-export";

export const GET = memberRoute("data:read", async (request, { member }) => {
  const chunks = exportWorkupsCsv(await getDb(), member.group.id, queryOf(request));
  const day = new Date().toISOString().slice(0, 10);
  return new Response(textStream(chunks), {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": `attachment; filename="workups-${member.group.slug}-${day}.csv"`,
    },
  });
});
