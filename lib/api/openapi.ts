// The OpenAPI 3.1 document of /api/v1, generated from the route list and its zod schemas (zod 4's z.toJSONSchema;
// JSON Schema 2020-12 is OpenAPI 3.1's schema dialect). Request bodies are described as the client sends them
// (io: "input": units and dates as written, defaults optional).
import { z } from "zod";
import { workupInputSchema } from "@/lib/chem/schema";
import { ENGINE_VERSION } from "@/lib/chem/version";
import { errorBodySchema } from "./responses";
import { API_ROUTES, type ApiRoute } from "./routes";

type Json = Record<string, unknown>;

const STATUS_TEXT: Record<number, string> = {
  400: "Malformed request: the body is not JSON, or is empty",
  401: "Not signed in, or the API token is missing, malformed or revoked",
  403: "The caller's role does not allow this (viewers cannot write)",
  404: "No such record in the caller's group (another group's ids answer the same)",
  409: "Conflict: the record changed since the version the caller read",
  413: "The body is larger than the route's limit",
  422: "Validation failed; `error.fields` names each field with its messages (also: more engine work than one request may ask for, the limit stated)",
  429: "The caller already has as many heavy requests running as allowed; wait the Retry-After seconds",
  503: "The instance is saturated (engine threads or database connections busy past the wait limit); nothing was written; retry after Retry-After seconds",
  500: "Unexpected error; quote `error.id`",
};

function generated(schema: z.ZodType, io: "input" | "output"): Json {
  const { $schema: _dialect, ...rest } = z.toJSONSchema(schema, { io, unrepresentable: "any", reused: "inline" }) as Json;
  return rest;
}

/** Schemas embedded in several bodies, described once under components and referred to by $ref. */
const SHARED: [string, z.ZodType][] = [["WorkupSpec", workupInputSchema]];
const sharedText = new Map(SHARED.map(([name, schema]) => [JSON.stringify(generated(schema, "input")), name]));

function withRefs(node: unknown): unknown {
  if (Array.isArray(node)) return node.map(withRefs);
  if (node === null || typeof node !== "object") return node;
  const name = sharedText.get(JSON.stringify(node));
  if (name) return { $ref: `#/components/schemas/${name}` };
  return Object.fromEntries(Object.entries(node).map(([k, v]) => [k, withRefs(v)]));
}

function jsonSchema(schema: z.ZodType, io: "input" | "output"): Json {
  return withRefs(generated(schema, io)) as Json;
}

function parameters(route: ApiRoute): Json[] {
  const path = [...route.path.matchAll(/\{(\w+)\}/g)].map((m) => ({
    name: m[1], in: "path", required: true, schema: { type: "string" },
  }));
  const query = route.query
    ? Object.entries((jsonSchema(route.query, "input")["properties"] ?? {}) as Record<string, Json>).map(([name, schema]) => ({
        name, in: "query", required: false, schema,
      }))
    : [];
  return [...path, ...query];
}

function operation(route: ApiRoute, components: Record<string, Json>): Json {
  const ref = (name: string | undefined, schema: z.ZodType | undefined, io: "input" | "output"): Json | undefined => {
    if (!schema) return undefined;
    if (!name) return jsonSchema(schema, io);
    components[name] ??= jsonSchema(schema, io);
    return { $ref: `#/components/schemas/${name}` };
  };
  const responses: Json = {};
  const success = route.success;
  const body = ref(success.name, success.schema, "output");
  responses[String(success.status)] = {
    description: success.description,
    ...(success.status !== 204 ? { content: { [success.contentType ?? "application/json"]: { schema: body ?? { type: "string" } } } } : {}),
  };
  const errors = route.permission ? [401, ...route.errors, 500] : route.errors;
  for (const status of errors) {
    responses[String(status)] = { description: STATUS_TEXT[status] ?? "Error", content: { "application/json": { schema: { $ref: "#/components/schemas/Error" } } } };
  }
  const requestSchema = route.body ? ref(route.body.contentType ? undefined : route.body.name, route.body.schema, "input") : undefined;
  return {
    summary: route.summary,
    ...(route.description ? { description: route.description } : {}),
    operationId: `${route.method}${route.path.replace(/^\/api\/v1/, "").replace(/[{}.]/g, "").split("/").map((p) => p.charAt(0).toUpperCase() + p.slice(1)).join("")}`,
    ...(route.permission ? { security: [{ bearerToken: [] }, { session: [] }], "x-permission": route.permission } : { security: [] }),
    parameters: parameters(route),
    ...(route.body
      ? {
          requestBody: {
            required: true,
            description: `At most ${route.body.limit}.`,
            content: { [route.body.contentType ?? "application/json"]: { schema: route.body.contentType ? { type: "string" } : requestSchema } },
          },
        }
      : {}),
    responses,
  };
}

let cached: Json | undefined;

export function openApiDocument(): Json {
  if (cached) return cached;
  const components: Record<string, Json> = { Error: jsonSchema(errorBodySchema, "output") };
  for (const [name, schema] of SHARED) components[name] = generated(schema, "input");
  const paths: Record<string, Json> = {};
  for (const route of API_ROUTES) {
    const item = (paths[route.path] ??= {});
    item[route.method] = operation(route, components);
  }
  cached = {
    openapi: "3.1.0",
    info: {
      title: "Layerwise API",
      version: "1",
      description:
        "Workup records of a chemistry group with the engine's prediction of where each component goes " +
        `(engine ${ENGINE_VERSION}). Authenticate with "Authorization: Bearer lw_…" (an API token from Settings) or a ` +
        "signed-in session. Every id is scoped to the caller's group.",
    },
    servers: [{ url: "/" }],
    paths,
    components: {
      schemas: components,
      securitySchemes: {
        bearerToken: { type: "http", scheme: "bearer", description: "Personal API token, created and revoked under Settings → API tokens" },
        session: { type: "apiKey", in: "cookie", name: "next-auth.session-token" },
      },
    },
  };
  return cached;
}
