// POST: load a group export into the caller's group, which must hold no compounds, workups or partition data.
// Group leads only: the import also replaces the group's solvent and reagent library. The body is parsed and checked
// on an engine thread (lib/workups/group-import-plan.ts), in one of the lead's heavy slots (429 when all are taken).
import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { readBodyBytes } from "@/lib/api/body";
import { actorOf } from "@/lib/workups/context";
import { importGroupFile } from "@/lib/workups/group-import";
import { withHeavySlot } from "@/lib/workers/limits";

/** Exports of a few thousand workups with their stored predictions. */
const EXPORT_LIMIT = 100 * 1024 * 1024;

export const POST = memberRoute("library:manage", async (request, { member }) => {
  const bytes = await readBodyBytes(request, EXPORT_LIMIT);
  const counts = await withHeavySlot(member.user.id, async () => importGroupFile(await getDb(), actorOf(member), bytes));
  return Response.json(counts, { status: 201 });
});
