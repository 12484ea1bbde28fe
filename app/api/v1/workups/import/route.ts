// POST text/csv: import past workups and outcomes, all rows or none. With "Accept: application/x-ndjson" the answer
// streams one JSON line per checked or written row ({"type":"progress","phase","done","total"}) and ends with
// {"type":"result",...}; otherwise it is one JSON body: 201 with the created rows, or 422 with every row's errors.
import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { readBodyText } from "@/lib/api/body";
import { ndjsonResponse } from "@/lib/api/stream";
import { actorOf } from "@/lib/workups/context";
import { importWorkupsCsv } from "@/lib/workups/csv-import";

/** A few thousand rows with JSON specs. */
const CSV_LIMIT = 10 * 1024 * 1024;

export const POST = memberRoute("data:write", async (request, { member }) => {
  const text = await readBodyText(request, CSV_LIMIT);
  const db = await getDb();
  const actor = actorOf(member);
  if ((request.headers.get("accept") ?? "").includes("application/x-ndjson")) {
    return ndjsonResponse(async (send) => {
      const result = await importWorkupsCsv(db, actor, text, { onProgress: (p) => send({ type: "progress", ...p }) });
      send({ type: "result", ...result });
    });
  }
  const result = await importWorkupsCsv(db, actor, text);
  if (!result.ok) {
    return Response.json(
      { error: { code: "validation", message: `${result.errors.length} problems in ${result.rows} rows; nothing was imported.`, rows: result.errors } },
      { status: 422 },
    );
  }
  return Response.json(result, { status: 201 });
}, { bodyTypes: ["text/csv"] });
