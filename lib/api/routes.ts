// Every route of the JSON API with the zod schemas of its input and output. The OpenAPI document is generated from
// this list, and a test checks the list against the route files under app/api/v1, so a new route cannot go
// undocumented.
import { type z } from "zod";
import { type Permission } from "@/lib/authz/permissions";
import { listCompoundsSchema, registerCompoundsSchema } from "@/lib/compounds/schemas";
import { CSV_COLUMNS_DOC } from "@/lib/workups/csv-columns";
import { groupExportSchema } from "@/lib/workups/export-format";
import { foundCauseInputSchema } from "@/lib/workups/found-cause-schema";
import {
  createWorkupSchema, outcomeInputSchema, predictRequestSchema, updateWorkupSchema, versionPairSchema, workupListFilterFields, workupListFilterSchema,
} from "@/lib/workups/schemas";
import {
  listPageSchema, looseObject, meSchema, outcomeReportSchema, predictResponseSchema, savedWorkupSchema, versionDiffSchema,
  versionListSchema, workupDetailSchema, calibrationReportSchema, foundCauseRecordSchema,
} from "./responses";
import { reviewFilterSchema } from "@/lib/review/filters";
import { uploadQuerySchema } from "@/lib/attachments/schemas";

export type HttpMethod = "get" | "post" | "put" | "delete";

export interface ApiRoute {
  method: HttpMethod;
  /** OpenAPI path template, e.g. /api/v1/workups/{id}. */
  path: string;
  summary: string;
  description?: string;
  /** Null: no sign-in needed. */
  permission: Permission | null;
  query?: z.ZodObject;
  body?: { name: string; schema: z.ZodType; contentType?: string; limit: string };
  success: { status: number; name?: string; schema?: z.ZodType; contentType?: string; description: string };
  /** Error statuses this route can answer besides 401/500. */
  errors: number[];
}

const readErrors = [403, 404, 422];
const writeErrors = [400, 403, 404, 413, 422];
/** Routes that run the engine or import in bulk: 429 when the caller's heavy slots are taken, 503 when the instance is saturated. */
const heavyErrors = [429, 503];

export const API_ROUTES: ApiRoute[] = [
  { method: "get", path: "/api/v1/me", summary: "Who the caller is, in which group, with which permissions", permission: "data:read",
    success: { status: 200, name: "Me", schema: meSchema, description: "the member" }, errors: [403] },
  { method: "get", path: "/api/v1/workups", summary: "List the group's workups, newest first", permission: "data:read",
    description: "Keyset-paginated on (performedOn desc, id asc): pass the previous page's `next` as `cursor`.",
    query: workupListFilterSchema, success: { status: 200, name: "WorkupListPage", schema: listPageSchema, description: "one page" }, errors: [403, 422] },
  { method: "post", path: "/api/v1/workups", summary: "Create a workup; the server computes and stores its prediction", permission: "data:write",
    body: { name: "CreateWorkup", schema: createWorkupSchema, limit: "1 MB" },
    success: { status: 201, name: "SavedWorkup", schema: savedWorkupSchema, description: "created at version 1" }, errors: [400, 403, 413, 422, ...heavyErrors] },
  { method: "get", path: "/api/v1/workups/{id}", summary: "A workup with its spec, latest prediction and outcome", permission: "data:read",
    success: { status: 200, name: "WorkupDetail", schema: workupDetailSchema, description: "the workup" }, errors: readErrors },
  { method: "put", path: "/api/v1/workups/{id}", summary: "Save a new version", permission: "data:write",
    description: "`baseVersion` must be the version you read; a stale one is refused with 409 and nothing is saved.",
    body: { name: "UpdateWorkup", schema: updateWorkupSchema, limit: "1 MB" },
    success: { status: 200, name: "SavedWorkup", schema: savedWorkupSchema, description: "the new version" }, errors: [...writeErrors, 409, ...heavyErrors] },
  { method: "delete", path: "/api/v1/workups/{id}", summary: "Delete a workup with its versions, predictions and outcome", permission: "data:write",
    success: { status: 204, description: "deleted" }, errors: [403, 404] },
  { method: "post", path: "/api/v1/workups/{id}/outcome", summary: "Report what was isolated; answers recovery, deviation, status and likely causes", permission: "data:write",
    body: { name: "OutcomeInput", schema: outcomeInputSchema, limit: "1 MB" },
    success: { status: 200, name: "OutcomeReport", schema: outcomeReportSchema, description: "the comparison with the prediction" }, errors: [...writeErrors, 409] },
  { method: "post", path: "/api/v1/workups/{id}/outcome/found-cause", summary: "Record the cause the group found for a shortfall at review (null clears it)", permission: "data:write",
    description: "Does not change this workup's judgement; the group's later judgements rank causes with the findings counted. 404 when the workup has no reported outcome.",
    body: { name: "FoundCauseInput", schema: foundCauseInputSchema, limit: "1 MB" },
    success: { status: 200, name: "FoundCause", schema: foundCauseRecordSchema, description: "the finding as stored" }, errors: writeErrors },
  { method: "get", path: "/api/v1/workups/{id}/versions", summary: "Every version, newest first, with who saved it and when", permission: "data:read",
    success: { status: 200, name: "VersionList", schema: versionListSchema, description: "the history" }, errors: readErrors },
  { method: "get", path: "/api/v1/workups/{id}/diff", summary: "What changed between two versions", permission: "data:read",
    query: versionPairSchema, success: { status: 200, name: "VersionDiff", schema: versionDiffSchema, description: "the changes" }, errors: readErrors },
  { method: "get", path: "/api/v1/workups.csv", summary: "The filtered list as CSV (same filters as the list; no cursor)", permission: "data:read",
    query: workupListFilterFields.omit({ cursor: true, limit: true }),
    description: `One row per workup. Columns: ${CSV_COLUMNS_DOC}.`,
    success: { status: 200, contentType: "text/csv", description: "one row per workup" }, errors: [403, 422] },
  { method: "post", path: "/api/v1/workups/import", summary: "Import past workups and outcomes from CSV, all or nothing", permission: "data:write",
    description:
      "The same columns as the CSV export; nothing is written if any row has an error. With `Accept: application/x-ndjson` the answer " +
      "streams one line per row checked or written ({type: progress, phase, done, total}) and ends with {type: result, ok, created | errors}; " +
      `otherwise 201 with the created rows or 422 with every row's errors. Columns: ${CSV_COLUMNS_DOC}.`,
    body: { name: "WorkupCsv", schema: looseObject, contentType: "text/csv", limit: "10 MB" },
    success: { status: 201, schema: looseObject, description: "created rows (or NDJSON progress lines and a result line)" }, errors: [400, 403, 413, 422, ...heavyErrors] },
  { method: "get", path: "/api/v1/review/calibration", summary: "How often the group's predictive intervals contained the reported outcome, by level", permission: "data:read",
    query: reviewFilterSchema,
    success: { status: 200, name: "CalibrationReport", schema: calibrationReportSchema, description: "coverage per interval level" }, errors: [403, 422] },
  { method: "get", path: "/api/v1/group/export", summary: "The whole group as JSON (compounds, workups with versions, outcomes, predictions, partition data, library)", permission: "data:read",
    success: { status: 200, name: "GroupExport", schema: groupExportSchema, description: "the export document" }, errors: [403] },
  { method: "post", path: "/api/v1/group/import", summary: "Load a group export into this group, which must hold no compounds or workups", permission: "library:manage",
    body: { name: "GroupExport", schema: groupExportSchema, limit: "100 MB" },
    success: { status: 201, name: "ImportCounts", schema: looseObject, description: "rows created per kind" }, errors: [400, 403, 409, 413, 422] },
  { method: "post", path: "/api/v1/predict", summary: "Predict a workup with the group's library, saving nothing", permission: "data:read",
    description: "The engine's work is bounded: portion-steps × (components + 4) × (draws + 1) at most 600,000 work units and portion-steps × components at most 20,000; beyond either, 422 names the field and states the limit.",
    body: { name: "PredictRequest", schema: predictRequestSchema, limit: "1 MB" },
    success: { status: 200, name: "PredictResponse", schema: predictResponseSchema, description: "point prediction and interval" }, errors: [400, 403, 413, 422, ...heavyErrors] },
  { method: "get", path: "/api/v1/compounds", summary: "List or search the group's compounds (mode=similarity|substructure|text)", permission: "data:read",
    query: listCompoundsSchema, success: { status: 200, schema: looseObject, description: "compounds or search hits" }, errors: [403, 422] },
  { method: "post", path: "/api/v1/compounds", summary: "Register compounds from SMILES, SDF or MOL text, all or nothing", permission: "data:write",
    body: { name: "RegisterCompounds", schema: registerCompoundsSchema, limit: "10 MB" },
    success: { status: 201, schema: looseObject, description: "created and skipped" }, errors: [400, 403, 422] },
  { method: "get", path: "/api/v1/compounds/{id}", summary: "A compound with its properties, partition data and workups", permission: "data:read",
    success: { status: 200, schema: looseObject, description: "the compound" }, errors: readErrors },
  { method: "get", path: "/api/v1/partition/{compoundId}", summary: "A compound's partition observations and pooled value per solvent (?format=csv for a file)", permission: "data:read",
    success: { status: 200, schema: looseObject, description: "observations and pooled values" }, errors: readErrors },
  { method: "get", path: "/api/v1/jobs", summary: "The group's background jobs waiting or running, with progress, and the last one finished", permission: "data:read",
    success: { status: 200, schema: looseObject, description: "job status" }, errors: [403] },
  { method: "get", path: "/api/v1/workups/{id}/attachments", summary: "Files kept with the workup and its outcome (no bytes)", permission: "data:read",
    success: { status: 200, schema: looseObject, description: "the attachments" }, errors: readErrors },
  { method: "post", path: "/api/v1/workups/{id}/attachments", summary: "Attach a file (image, PDF or plain-text data, at most 10 MB); its type is read from its content", permission: "data:write",
    query: uploadQuerySchema, body: { name: "AttachmentBytes", schema: looseObject, contentType: "application/octet-stream", limit: "10 MB" },
    success: { status: 201, schema: looseObject, description: "the attachment" }, errors: [403, 404, 413, 415, 422] },
  { method: "get", path: "/api/v1/attachments/{id}", summary: "The file as uploaded (?download=1 to save it rather than open it)", permission: "data:read",
    success: { status: 200, contentType: "application/octet-stream", description: "the file" }, errors: readErrors },
  { method: "delete", path: "/api/v1/attachments/{id}", summary: "Delete an attachment", permission: "data:write",
    success: { status: 204, description: "deleted" }, errors: readErrors },
  { method: "get", path: "/api/v1/attachments/{id}/thumbnail", summary: "The preview of an image attachment", permission: "data:read",
    success: { status: 200, contentType: "image/jpeg", description: "PNG or JPEG preview" }, errors: readErrors },
  { method: "put", path: "/api/v1/attachments/{id}/thumbnail", summary: "Store the preview of an image attachment (PNG or JPEG, at most 200 kB)", permission: "data:write",
    body: { name: "ThumbnailBytes", schema: looseObject, contentType: "image/jpeg", limit: "200 kB" },
    success: { status: 204, description: "stored" }, errors: [403, 404, 413, 415, 422] },
  { method: "get", path: "/api/v1/openapi.json", summary: "This document", permission: null,
    success: { status: 200, schema: looseObject, description: "OpenAPI 3.1" }, errors: [] },
];
