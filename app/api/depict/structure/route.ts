import { memberRoute } from "@/lib/authz/route";
import { parseInput, ValidationError } from "@/lib/errors";
import { depict, depictionParamsSchema, StructureError, svgResponse } from "@/lib/compounds/depiction";
import { z } from "zod";

const querySchema = z.object({ smiles: z.string().trim().min(1, { error: "smiles is required" }).max(2000) });

/** Draws a SMILES that is not stored (the search page's query): GET /api/depict/structure?smiles=…&w=&h= */
export const GET = memberRoute("data:read", async (request) => {
  const raw = Object.fromEntries(new URL(request.url).searchParams);
  const { smiles } = parseInput(querySchema, raw);
  const options = parseInput(depictionParamsSchema, raw);
  try {
    return svgResponse(await depict(smiles, options), null, request);
  } catch (error) {
    if (error instanceof StructureError) throw new ValidationError({ smiles: [error.message] }, error.message);
    throw error;
  }
});
