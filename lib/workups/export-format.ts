/**
 * The whole-group export document (GET /api/v1/group/export, POST /api/v1/group/import). Records refer to each other
 * by `ref` (the id they had in the exporting database); an import gives every record a new id and rewrites the refs.
 * People are referred to by ref too and matched by email to members of the importing group (else left empty).
 * JSON blobs (specs, snapshots, engine results, analyses, library properties) travel unchanged.
 */
import { z } from "zod";
import { notebookUrlSchema, PURITY_METHODS, OUTCOME_STATUSES } from "./schemas";
import { fileNameSchema } from "@/lib/attachments/schemas";

export const EXPORT_FORMAT = "layerwise.group-export";
export const EXPORT_FORMAT_VERSION = 1;

const ref = z.string().min(1).max(64);
const personRef = ref.nullable();
const timestamp = z.iso.datetime({ error: "must be an ISO 8601 date-time" });
const json = z.json();
const jsonObject = z.record(z.string(), json);

const libraryEntry = z.object({ key: z.string().min(1).max(64), name: z.string().max(200), props: jsonObject, builtin: z.boolean(), updatedAt: timestamp });

const compound = z.object({
  ref, name: z.string().min(1).max(500), synonyms: z.array(z.string()), tags: z.array(z.string()), canonicalSmiles: z.string().min(1),
  molfile: z.string().nullable(), formula: z.string(), molarMass: z.number().positive(), crippenLogP: z.number().nullable(),
  tpsa: z.number().nullable(), logP: z.number().nullable(), logPSource: z.string().nullable(), pKas: json,
  fingerprint: z.base64().nullable(), notes: z.string(), createdBy: personRef, createdAt: timestamp, updatedAt: timestamp,
});

const observation = z.object({
  ref, compound: ref, solventKey: z.string(), aqueousPh: z.number().nullable(), temperatureC: z.number(), logK: z.number(),
  logKSe: z.number().nullable(), kind: z.enum(["measured", "inferred"]), bound: z.enum(["value", "lower", "upper"]), method: z.string(),
  weight: z.number(), excluded: z.boolean(), workup: ref.nullable(), details: json, createdBy: personRef, createdAt: timestamp,
});

const workup = z.object({
  ref, title: z.string().min(1).max(200), performedOn: timestamp, chemist: personRef, notebookRef: z.string(),
  // Absent in exports written before the field existed.
  notebookUrl: notebookUrlSchema,
  scaleMmol: z.number().nullable(), expectedProductMmol: z.number().nullable(), assayedProductMmol: z.number().nullable(),
  spec: jsonObject, version: z.number().int().min(1), searchText: z.string(), solventKeys: z.array(z.string()), flagged: z.boolean(),
  deviationPct: z.number().nullable(), status: z.enum(OUTCOME_STATUSES), createdBy: personRef, updatedBy: personRef,
  createdAt: timestamp, updatedAt: timestamp,
  components: z.array(z.object({
    key: z.string(), name: z.string(), role: z.enum(["product", "starting_material", "reagent", "byproduct", "impurity", "catalyst", "other"]),
    amountMmol: z.number(), compound: ref.nullable(),
  })),
  versions: z.array(z.object({ version: z.number().int().min(1), snapshot: jsonObject, editedBy: personRef, createdAt: timestamp })).min(1),
  predictions: z.array(z.object({
    workupVersion: z.number().int().min(1), engineVersion: z.string(), result: json, productRecovery: z.number().nullable(),
    recoveryLow: z.number().nullable(), recoveryHigh: z.number().nullable(), createdAt: timestamp,
  })),
  outcome: z.object({
    isolatedMassMg: z.number(), purityPct: z.number().nullable(), purityMethod: z.enum(PURITY_METHODS), layerAssays: json,
    recoveryPct: z.number().nullable(), analysis: json, notes: z.string(), reportedBy: personRef, createdAt: timestamp, updatedAt: timestamp,
  }).nullable(),
  /** Files kept with the workup or its outcome, bytes in base64 (absent in exports made before attachments existed). */
  attachments: z.array(z.object({
    fileName: fileNameSchema, mediaType: z.string(), target: z.enum(["workup", "outcome"]), sha256: z.string().regex(/^[0-9a-f]{64}$/),
    data: z.base64(), thumbnail: z.base64().nullable(), createdBy: personRef, createdAt: timestamp,
  })).default([]),
});

export const groupExportSchema = z.object({
  format: z.literal(EXPORT_FORMAT, { error: `format must be "${EXPORT_FORMAT}"` }),
  formatVersion: z.literal(EXPORT_FORMAT_VERSION, { error: `formatVersion must be ${EXPORT_FORMAT_VERSION}` }),
  exportedAt: timestamp,
  engineVersion: z.string(),
  group: z.object({ name: z.string() }),
  people: z.array(z.object({ ref, name: z.string(), email: z.string() })),
  solvents: z.array(libraryEntry),
  reagents: z.array(libraryEntry),
  compounds: z.array(compound),
  observations: z.array(observation),
  workups: z.array(workup),
});

export type GroupExport = z.output<typeof groupExportSchema>;
export type ExportedWorkup = GroupExport["workups"][number];
export type ExportedCompound = GroupExport["compounds"][number];
