import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { NotFoundError, parseInput } from "@/lib/errors";
import { depictionParamsSchema, depictStored, svgResponse } from "@/lib/compounds/depiction";
import { structureForDepiction } from "@/lib/compounds/queries";

/** A compound's structure as SVG: GET /api/depict/compounds/{id}?w=300&h=220&highlight=3,4 */
export const GET = memberRoute<{ id: string }>("data:read", async (request, { member, params }) => {
  const options = parseInput(depictionParamsSchema, Object.fromEntries(new URL(request.url).searchParams));
  const stored = await structureForDepiction(await getDb(), member.group.id, params.id);
  if (!stored) throw new NotFoundError("compound");
  const version = `${params.id}@${stored.updatedAt.getTime()}`;
  const etag = `"${version}-${options.w}x${options.h}-${options.highlight.join(".")}"`;
  return svgResponse(await depictStored(version, stored.text, options), etag, request);
});
