import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { readJsonBody } from "@/lib/api/body";
import { parseInput } from "@/lib/errors";
import { listCompounds } from "@/lib/compounds/queries";
import { listCompoundsSchema, registerCompoundsSchema, searchSchema } from "@/lib/compounds/schemas";
import { compoundSearch } from "@/lib/compounds/search-service";
import { registerCompounds, RegistrationRejected } from "@/lib/compounds/service";
import { withHeavySlot } from "@/lib/workers/limits";

/**
 * GET /api/v1/compounds?after=&tag=&limit=                          the group's compounds by name, keyset-paginated
 * GET /api/v1/compounds?mode=similarity&query=SMILES&threshold=&topK=
 * GET /api/v1/compounds?mode=substructure&query=&queryType=smiles|smarts&limit=
 * GET /api/v1/compounds?mode=text&query=&limit=                      hits with their workups, outcome and deviation
 */
export const GET = memberRoute("data:read", async (request, { member }) => {
  const params = Object.fromEntries(new URL(request.url).searchParams);
  const db = await getDb();
  if (params["mode"] !== undefined) {
    return Response.json(await compoundSearch().search(db, member.group.id, parseInput(searchSchema, params)));
  }
  return Response.json(await listCompounds(db, member.group.id, parseInput(listCompoundsSchema, params)));
});

/** A JSON body holding the largest accepted text (MAX_REGISTER_TEXT characters) with room for escaping. */
const REGISTER_BODY_LIMIT = 10 * 1024 * 1024 + 64 * 1024;

/**
 * POST /api/v1/compounds  { format: "smiles" | "sdf" | "mol", text, tags?, onDuplicate?: "reject" | "skip" }
 * 201 { created, skipped }; 413 over 10 MB; 422 with `records` naming every record that stopped the batch (nothing is written).
 */
export const POST = memberRoute("data:write", async (request, { member }) => {
  const input = parseInput(registerCompoundsSchema, await readJsonBody(request, REGISTER_BODY_LIMIT));
  try {
    // Bulk registration parses every structure: one of the caller's heavy slots (429 when they are all taken).
    const result = await withHeavySlot(member.user.id, async () => registerCompounds(await getDb(), { groupId: member.group.id, userId: member.user.id }, input));
    return Response.json(result, { status: 201 });
  } catch (error) {
    if (!(error instanceof RegistrationRejected)) throw error;
    return Response.json(
      { error: { code: error.code, message: error.message, fields: error.fieldErrors, records: error.problems, recordCount: error.recordCount } },
      { status: error.status },
    );
  }
});
