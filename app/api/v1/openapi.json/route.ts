// GET: the OpenAPI 3.1 document of this API, generated from the zod schemas (lib/api/openapi.ts). Public: it
// describes the routes, not the data.
import { openApiDocument } from "@/lib/api/openapi";

export function GET(): Response {
  return Response.json(openApiDocument());
}
