/**
 * One zod schema per workup input, shared by the editor form, the server actions, the REST routes, the CSV importer
 * and the OpenAPI document, so the two sides never disagree. Browser-safe: zod and lib/chem's schema only.
 * Amounts in the header are mmol; masses mg; percentages 0–100.
 */
import { z } from "zod";
import { workupInputSchema } from "@/lib/chem/schema";
import { strictObject } from "@/lib/chem/schema-strict";

export const PURITY_METHODS = ["qnmr", "hplc", "gc", "weight_only"] as const;
export type PurityMethodName = (typeof PURITY_METHODS)[number];
/** How each purity method is named on screen and in messages. */
export const PURITY_METHOD_WORDS: Record<PurityMethodName, string> = { qnmr: "qNMR", hplc: "HPLC", gc: "GC", weight_only: "weight only" };
/** A stored purity method in words; one this version does not know is shown without its underscores. */
export function purityMethodWords(method: string): string {
  return (PURITY_METHOD_WORDS as Record<string, string | undefined>)[method] ?? method.replace(/_/g, " ");
}
export const OUTCOME_STATUSES = ["as_expected", "below", "above", "inconclusive", "unknown"] as const;
export type OutcomeStatusName = (typeof OUTCOME_STATUSES)[number];

/** Largest amount accepted in a header field: 10 kmol, far above any bench or kilo-lab workup. */
const MAX_MMOL = 1e7;

const optionalMmol = (label: string) =>
  z
    .number({ error: `${label} must be a number (mmol)` })
    .positive({ error: `${label} must be > 0 mmol` })
    .max(MAX_MMOL, { error: `${label} must be ≤ 10 kmol` })
    .nullable()
    .optional();

const recordId = (label: string) =>
  z.string({ error: `${label} must be an id` }).trim().min(1, { error: `${label} must not be empty` }).max(64, { error: `${label} is too long` });

/** Dates the databases store without surprises (PostgreSQL has no year 0; the year 10000 needs five digits). */
export const EARLIEST_DAY = "1800-01-01";
export const LATEST_DAY = "9999-12-31";

/** A calendar date as YYYY-MM-DD (the day the workup was run), stored as midnight UTC. */
export const isoDateSchema = (label: string) =>
  z.iso.date({ error: `${label} must be a date written YYYY-MM-DD` })
    // Only a well-formed date is range-checked, so a malformed one gets the one message that says what is wrong.
    .refine((day) => !/^\d{4}-\d{2}-\d{2}$/.test(day) || (day >= EARLIEST_DAY && day <= LATEST_DAY), { error: `${label} must be between ${EARLIEST_DAY} and ${LATEST_DAY}` })
    .transform((day) => new Date(`${day}T00:00:00.000Z`));


/** Longest notebook address accepted: electronic notebooks' entry links are a few hundred characters at most. */
export const NOTEBOOK_URL_MAX = 2000;

/**
 * The address of the notebook entry: blank, or an absolute http(s) URL (no javascript:, data: or file: links, no user
 * name or password inside). Stored as typed, trimmed.
 */
export const notebookUrlSchema = z
  .string({ error: "Notebook entry address must be text" })
  .trim()
  // One message per address: the first thing wrong with it.
  .superRefine((text, ctx) => {
    const problem = notebookUrlProblem(text);
    if (problem) ctx.addIssue({ code: "custom", message: problem });
  })
  .default("");

/** True when `text` is a notebook address the schema accepts and there is one (pages link only such addresses). */
export function isNotebookUrl(text: string): boolean {
  return text !== "" && notebookUrlProblem(text) === null;
}

function notebookUrlProblem(text: string): string | null {
  if (text === "") return null;
  if (text.length > NOTEBOOK_URL_MAX) return `Notebook entry address must be ≤ ${NOTEBOOK_URL_MAX} characters`;
  const url = webAddress(text);
  if (!url) return "Notebook entry address must be a web address starting with http:// or https://";
  if (url.username !== "" || url.password !== "") return "Notebook entry address must not contain a user name or password";
  return null;
}

/** The URL when `text` is an absolute http(s) address with a host, else null. */
function webAddress(text: string): URL | null {
  if (!/^https?:\/\//i.test(text)) return null;
  try {
    const url = new URL(text);
    return (url.protocol === "http:" || url.protocol === "https:") && url.hostname !== "" ? url : null;
  } catch {
    return null;
  }
}

export const workupHeaderSchema = strictObject({
  title: z.string({ error: "Title is required" }).trim().min(1, { error: "Give the workup a title" }).max(200, { error: "Title must be ≤ 200 characters" }),
  performedOn: isoDateSchema("Date run"),
  /** A member of the group; null or omitted when not recorded. */
  chemistId: recordId("Chemist").nullable().optional(),
  /** Notebook book/page or electronic page id. */
  notebookRef: z.string().trim().max(100, { error: "Notebook reference must be ≤ 100 characters" }).default(""),
  /** Address of the electronic notebook entry; "" when none. */
  notebookUrl: notebookUrlSchema,
  /** Reaction scale: mmol of the limiting reagent. */
  scaleMmol: optionalMmol("Reaction scale"),
  /** Theoretical product amount. */
  expectedProductMmol: optionalMmol("Expected product"),
  /** Product present before the workup by an in-process assay (qNMR/HPLC), when one was taken. */
  assayedProductMmol: optionalMmol("Product assayed before the workup"),
});

/** Which registered compound each spec component is (by the component's key in the spec). */
export const componentLinkSchema = strictObject({
  key: z.string({ error: "key is required" }).trim().min(1, { error: "key is required" }).max(64),
  compoundId: recordId("compoundId").nullable(),
});

const saveFields = {
  header: workupHeaderSchema,
  spec: workupInputSchema,
  links: z.array(componentLinkSchema).max(50, { error: "at most 50 component links" }).default([]),
};

function linksMatchSpec(
  input: { spec: { components: { key: string }[] }; links: { key: string }[] },
  ctx: z.RefinementCtx,
) {
  const keys = new Set(input.spec.components.map((c) => c.key));
  const seen = new Set<string>();
  input.links.forEach((link, i) => {
    if (!keys.has(link.key)) ctx.addIssue({ code: "custom", path: ["links", i, "key"], message: `no component '${link.key}' in the spec` });
    if (seen.has(link.key)) ctx.addIssue({ code: "custom", path: ["links", i, "key"], message: `component '${link.key}' is linked twice` });
    seen.add(link.key);
  });
}

/** Body of a create: header, the engine's spec (units at every quantity) and compound links. */
export const createWorkupSchema = strictObject(saveFields).superRefine(linksMatchSpec);

/** Body of an update: the same, plus the version the editor opened (a stale one is refused with 409). */
export const updateWorkupSchema = strictObject({
    ...saveFields,
    baseVersion: z.number({ error: "baseVersion must be the version number you opened" }).int().min(1, { error: "baseVersion must be ≥ 1" }),
  })
  .superRefine(linksMatchSpec);

export const LAYER_PHASES = ["organic", "aqueous", "emulsion", "solid"] as const;

/** Assay of the product (or another component) in one stream of one step, to locate losses. */
export const layerAssaySchema = strictObject({
  step: z.number({ error: "step must be a number" }).int({ error: "step must be a whole number" }).min(1, { error: "step must be ≥ 1" }).max(200),
  phase: z.enum(LAYER_PHASES, { error: () => `phase must be one of ${LAYER_PHASES.join(", ")}` }),
  /** Spec component key; the product when omitted. */
  compoundKey: z.string().trim().min(1).max(64).optional(),
  amountMmol: z.number({ error: "amountMmol must be a number" }).min(0, { error: "amountMmol must be ≥ 0" }).max(MAX_MMOL),
  volumeMl: z.number().positive({ error: "volumeMl must be > 0" }).max(1e6).optional(),
  portion: z.number().int().min(1).max(50).optional(),
});

export const outcomeInputSchema = strictObject({
    isolatedMassMg: z
      .number({ error: "Isolated mass must be a number (mg)" })
      .min(0, { error: "Isolated mass must be ≥ 0 mg" })
      .max(1e9, { error: "Isolated mass must be ≤ 1000 kg" }),
    /** Mass % of product in the isolated material; required unless the method is weight_only (then taken as 100 %). */
    purityPct: z.number({ error: "Purity must be a number (mass %)" }).gt(0, { error: "Purity must be > 0 %" }).max(100, { error: "Purity must be ≤ 100 %" }).nullable().optional(),
    purityMethod: z.enum(PURITY_METHODS, { error: () => `Purity measured by must be one of ${PURITY_METHODS.map((m) => PURITY_METHOD_WORDS[m]).join(", ")}` }),
    layerAssays: z.array(layerAssaySchema).max(100, { error: "at most 100 layer assays" }).default([]),
    notes: z.string().max(5000, { error: "Notes must be ≤ 5000 characters" }).default(""),
  })
  .superRefine((o, ctx) => {
    if (o.purityMethod !== "weight_only" && (o.purityPct === null || o.purityPct === undefined)) {
      ctx.addIssue({ code: "custom", path: ["purityPct"], message: `Purity is required when it was measured by ${PURITY_METHOD_WORDS[o.purityMethod]}` });
    }
  });

const booleanParam = z.union([
  z.boolean(),
  z.enum(["true", "false", "1", "0", ""], { error: () => "must be true or false" }).transform((v) => v === "true" || v === "1"),
]);

/** List filters; every field optional. Query strings and form values arrive as strings and are coerced here. */
export const workupListFilterFields = z
  .object({
    /** Words matched in the title, notebook reference and component / compound names (all words must match). */
    q: z.string().trim().max(200, { error: "search text must be ≤ 200 characters" }).optional(),
    compoundId: recordId("compoundId").optional(),
    /** Solvent key as used in specs (e.g. etoac, dcm). */
    solvent: z.string().trim().toLowerCase().min(1).max(64).optional(),
    chemistId: recordId("Chemist").optional(),
    from: isoDateSchema("from").optional(),
    to: isoDateSchema("to").optional(),
    flagged: booleanParam.optional(),
    status: z.enum(OUTCOME_STATUSES, { error: () => `status must be one of ${OUTCOME_STATUSES.join(", ")}` }).optional(),
    /** Opaque cursor from the previous page's `next`. */
    cursor: z.string().max(200).optional(),
    limit: z.coerce.number({ error: "limit must be a number" }).int().min(1, { error: "limit must be ≥ 1" }).max(200, { error: "limit must be ≤ 200" }).default(25),
  });

export const workupListFilterSchema = workupListFilterFields.refine((f) => !f.from || !f.to || f.from <= f.to, { error: "the start date must not be after the end date", path: ["to"] });

/** Prediction without saving (POST /api/v1/predict). */
export const predictRequestSchema = strictObject({
  spec: workupInputSchema,
  /** Monte Carlo draws for the interval; 0 skips the interval. */
  draws: z.number().int().min(0).max(2000, { error: "draws must be ≤ 2000" }).default(400),
  seed: z.number().int().min(1).max(2 ** 31 - 1).optional(),
});

/** Versions are a 32-bit integer column: a larger number is refused here, not by the database. */
const versionNumber = (label: string) =>
  z.coerce.number({ error: `${label} must be a version number` }).int({ error: `${label} must be a whole number` }).min(1, { error: `${label} must be ≥ 1` })
    .max(2_147_483_647, { error: `${label} is larger than any version` });

/** Two versions to compare (GET /workups/{id}/diff?from=&to=). */
export const versionPairSchema = z.object({ from: versionNumber("from"), to: versionNumber("to") });

export type WorkupHeaderInput = z.input<typeof workupHeaderSchema>;
export type WorkupHeader = z.output<typeof workupHeaderSchema>;
export type ComponentLink = z.output<typeof componentLinkSchema>;
export type CreateWorkupInput = z.input<typeof createWorkupSchema>;
export type CreateWorkup = z.output<typeof createWorkupSchema>;
export type UpdateWorkupInput = z.input<typeof updateWorkupSchema>;
export type UpdateWorkup = z.output<typeof updateWorkupSchema>;
export type OutcomeInputRaw = z.input<typeof outcomeInputSchema>;
export type OutcomeInput = z.output<typeof outcomeInputSchema>;
export type LayerAssay = z.output<typeof layerAssaySchema>;
export type WorkupListFilterInput = z.input<typeof workupListFilterSchema>;
export type WorkupListFilter = z.output<typeof workupListFilterSchema>;
export type PredictRequest = z.output<typeof predictRequestSchema>;
