// POST text/csv: import past workups and outcomes, all rows or none. With "Accept: application/x-ndjson" the answer
// streams one JSON line per checked or written row ({"type":"progress","phase","done","total"}) and ends with
// {"type":"result",...}; otherwise it is one JSON body: 201 with the created rows, or 422 with every row's errors.
// The import takes one of the user's heavy slots (429 when they are all taken); each row's engine work is budgeted
// and runs on an engine thread (lib/workups/csv-import.ts).
import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { readBodyText } from "@/lib/api/body";
import { ndjsonResponse } from "@/lib/api/stream";
import { actorOf } from "@/lib/workups/context";
import { importWorkupsCsv } from "@/lib/workups/csv-import";
import { acquireHeavySlot } from "@/lib/workers/limits";

/** A few thousand rows with JSON specs. */
const CSV_LIMIT = 10 * 1024 * 1024;

export const POST = memberRoute("data:write", async (request, { member }) => {
  const text = await readBodyText(request, CSV_LIMIT);
  const db = await getDb();
  const actor = actorOf(member);
  // One of the importer's heavy slots for the whole import (429 before anything starts when they are all taken).
  const release = acquireHeavySlot(member.user.id);
  if ((request.headers.get("accept") ?? "").includes("application/x-ndjson")) {
    return ndjsonResponse(async (send) => {
      try {
        const result = await importWorkupsCsv(db, actor, text, { onProgress: (p) => send({ type: "progress", ...p }) });
        send({ type: "result", ...result });
      } finally {
        release();
      }
    });
  }
  let result;
  try {
    result = await importWorkupsCsv(db, actor, text);
  } finally {
    release();
  }
  if (!result.ok) {
    return Response.json(
      { error: { code: "validation", message: `${result.errors.length} problems in ${result.rows} rows; nothing was imported.`, rows: result.errors } },
      { status: 422 },
    );
  }
  return Response.json(result, { status: 201 });
}, { bodyTypes: ["text/csv"] });
