import { toCsv, fileSlug } from "@/components/charts/csv";
import { memberRoute } from "@/lib/authz/route";
import { getDb } from "@/lib/db/client";
import { observationsCsv } from "@/lib/partition/csv";
import { compoundPartition } from "@/lib/partition/queries";

/**
 * GET /api/v1/partition/{compoundId}: the group's observations of one compound and the pooled value per solvent;
 * `?format=csv` gives the observations as a CSV file. Another group's compound answers 404.
 */
export const GET = memberRoute<{ compoundId: string }>("data:read", async (request, { member, params }) => {
  const data = await compoundPartition(await getDb(), member.group.id, params.compoundId);
  if (new URL(request.url).searchParams.get("format") === "csv") {
    return new Response(toCsv(observationsCsv(data.compound.name, data.observations)), {
      headers: {
        "Content-Type": "text/csv; charset=utf-8",
        "Content-Disposition": `attachment; filename="partition-${fileSlug(data.compound.name)}.csv"`,
        "Cache-Control": "no-store",
      },
    });
  }
  return Response.json({ compound: data.compound, solvents: data.solvents, observations: data.observations });
});
