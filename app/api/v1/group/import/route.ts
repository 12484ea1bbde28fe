// POST: load a group export into the caller's group, which must hold no compounds, workups or partition data.
// Group leads only: the import also replaces the group's solvent and reagent library.
import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { readJsonBody } from "@/lib/api/body";
import { actorOf } from "@/lib/workups/context";
import { importGroup } from "@/lib/workups/group-import";

/** Exports of a few thousand workups with their stored predictions. */
const EXPORT_LIMIT = 100 * 1024 * 1024;

export const POST = memberRoute("library:manage", async (request, { member }) =>
  Response.json(await importGroup(await getDb(), actorOf(member), await readJsonBody(request, EXPORT_LIMIT)), { status: 201 }),
);
