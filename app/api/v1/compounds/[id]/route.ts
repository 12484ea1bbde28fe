import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { getCompound, partitionDataFor, workupsUsing } from "@/lib/compounds/queries";
import { siteWarnings } from "@/lib/compounds/site-warnings";

/**
 * GET /api/v1/compounds/{id}: properties, sites (with "no ionizable site recognised: check" notes in siteWarnings),
 * partition data and workups; another group's id answers 404.
 */
export const GET = memberRoute<{ id: string }>("data:read", async (_request, { member, params }) => {
  const db = await getDb();
  const compound = await getCompound(db, member.group.id, params.id);
  const partitionData = await partitionDataFor(db, member.group.id, compound.id);
  const workups = (await workupsUsing(db, member.group.id, [compound.id])).get(compound.id) ?? [];
  return Response.json({ ...compound, siteWarnings: await siteWarnings(compound), partitionData, workups });
});
