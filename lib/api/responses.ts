// Response shapes of the JSON API, for the OpenAPI document only (the services' TypeScript types are the contract
// in code). Kept shallow where a body carries the engine's full output, which lib/chem/types.ts documents.
import { z } from "zod";
import { INTERVAL_STATES } from "@/lib/workups/interval-state";
import { OUTCOME_STATUSES } from "@/lib/workups/schemas";
import { FOUND_CAUSES } from "@/lib/workups/found-cause-schema";

const fraction = z.number().describe("fraction 0–1");
const nullableFraction = fraction.nullable();
const person = z.object({ id: z.string(), name: z.string() });
const intervalState = z.enum(INTERVAL_STATES).describe(
  "pending: the Monte Carlo interval (recoveryLow/High, predictedLowPct/HighPct) and the judgement of a reported outcome are being computed in the background after a save; GET the workup again for them. failed: the interval could not be computed; saving again retries. ready: done",
);

export const errorBodySchema = z.object({
  error: z.object({
    code: z.string().describe("unauthenticated, forbidden, not_found, conflict, bad_request, payload_too_large, validation, rate_limited (429, Retry-After), overloaded (503, Retry-After), internal"),
    message: z.string(),
    fields: z.record(z.string(), z.array(z.string())).optional().describe("validation messages by field path, e.g. spec.operations.2.volume.value"),
    id: z.string().optional().describe("reference of an unexpected error in the server log"),
  }),
});

const flag = z.object({ code: z.string(), severity: z.enum(["info", "warning", "danger"]), title: z.string(), step: z.number().optional(), cause: z.string(), remedy: z.string() });
const caution = z.object({ code: z.string(), step: z.number(), text: z.string() });

export const predictionSummarySchema = z.object({
  engineVersion: z.string(),
  productKey: z.string().nullable(),
  productRecovery: nullableFraction,
  recoveryLow: nullableFraction.describe("2.5th percentile of the Monte Carlo draws"),
  recoveryHigh: nullableFraction.describe("97.5th percentile of the Monte Carlo draws"),
  flags: z.array(flag),
  cautions: z.array(caution),
});

export const savedWorkupSchema = z.object({
  id: z.string(),
  version: z.number().int(),
  flagged: z.boolean(),
  status: z.enum(OUTCOME_STATUSES),
  deviationPct: z.number().nullable(),
  intervalState,
  prediction: predictionSummarySchema.describe("the point prediction of the saved version; recoveryLow and recoveryHigh are null while intervalState is pending"),
});

export const listPageSchema = z.object({
  rows: z.array(z.object({
    id: z.string(), title: z.string(), performedOn: z.iso.date(), chemist: person.nullable(), notebookRef: z.string(),
    version: z.number().int(), status: z.enum(OUTCOME_STATUSES), flagged: z.boolean(), deviationPct: z.number().nullable(),
    reportedRecoveryPct: z.number().nullable(), predictedRecoveryPct: z.number().nullable(),
    predictedLowPct: z.number().nullable(), predictedHighPct: z.number().nullable(), intervalState, updatedAt: z.iso.datetime(),
  })),
  next: z.string().nullable().describe("cursor of the next page; null on the last page"),
});

export const workupDetailSchema = z.object({
  id: z.string(), version: z.number().int().describe("send as baseVersion when saving"),
  header: z.object({
    title: z.string(), performedOn: z.iso.date(), chemistId: z.string().nullable(), notebookRef: z.string(), notebookUrl: z.string(),
    scaleMmol: z.number().nullable(), expectedProductMmol: z.number().nullable(), assayedProductMmol: z.number().nullable(),
  }),
  spec: z.record(z.string(), z.unknown()).describe("the spec as saved, units included"),
  components: z.array(z.object({ key: z.string(), name: z.string(), role: z.string(), amountMmol: z.number(), compound: person.nullable() })),
  status: z.enum(OUTCOME_STATUSES), flagged: z.boolean(), deviationPct: z.number().nullable(), intervalState,
  prediction: z.record(z.string(), z.unknown()).nullable().describe("latest stored prediction with the engine's full result"),
  outcome: z.record(z.string(), z.unknown()).nullable(),
});

const cause = z.object({
  code: z.string(), title: z.string(), change: z.string(), step: z.number().optional(), recovery: fraction,
  fractionOfGap: fraction.describe("share of the gap (predicted − reported) the cause closes at its most plausible size, capped at 1; the figure every view shows"),
  score: fraction.describe("posterior plausibility among the candidate causes (prior frequency × likelihood of the outcome)"), simulated: z.boolean(),
});

export const foundCauseRecordSchema = z.object({
  workupId: z.string(),
  cause: z.enum(FOUND_CAUSES).nullable().describe("the cause found at review, or null when none is recorded"),
  note: z.string(),
  recordedAt: z.string().nullable(),
});

export const outcomeReportSchema = z.object({
  workupId: z.string(),
  workupVersion: z.number().int(),
  recoveryPct: z.number().nullable(),
  analysis: z.object({
    reported: z.object({
      recovery: z.number().describe("isolated product over the product in the crude before the workup"), productMmol: z.number(), referenceMmol: z.number(),
      basis: z.enum(["assayed", "expected", "spec"]), crudeMmol: z.number().describe("product in the crude: the assay, or the reference × the group's reaction-yield figure"), purityAssumed: z.boolean(),
    }).nullable(),
    predicted: z.object({ recovery: fraction.describe("median of the predictive distribution, same basis"), low: nullableFraction, high: nullableFraction, engine: fraction.optional() }).nullable(),
    predictive: z.object({
      logMean: z.number(), logSd: z.number(), crudeLog: z.number(), observedLog: z.number(), yieldLog: z.number().nullable(),
      quantile: fraction.describe("predictive CDF at the reported value"),
      shortfallProbability: fraction.describe("posterior probability of a real shortfall; status below (flagged) from threshold"),
      threshold: fraction, level: fraction, historyN: z.number().int(), case: z.record(z.string(), z.unknown()),
    }).nullable().optional(),
    deviation: z.object({ status: z.enum(OUTCOME_STATUSES), deviationPct: z.number().nullable(), low: nullableFraction, high: nullableFraction, fallbackBand: z.boolean() }),
    flagged: z.boolean(),
    dangerFlags: z.array(z.string()),
    causes: z.array(cause),
    intervalPending: z.boolean().optional().describe("true: reported while the interval was being computed; status inconclusive and no deviation or causes until the background job judges it"),
  }),
});

export const versionListSchema = z.object({
  versions: z.array(z.object({ version: z.number().int(), editedBy: person.nullable(), createdAt: z.iso.datetime(), productRecovery: nullableFraction, engineVersion: z.string().nullable() })),
});

const change = z.object({ field: z.string(), from: z.unknown(), to: z.unknown() });
const step = z.object({ step: z.number().int(), type: z.string(), label: z.string().nullable() });
export const versionDiffSchema = z.object({
  header: z.array(change),
  components: z.object({ added: z.array(z.object({ key: z.string(), name: z.string() })), removed: z.array(z.object({ key: z.string(), name: z.string() })), changed: z.array(z.object({ key: z.string(), name: z.string(), changes: z.array(change) })) }),
  operations: z.object({ added: z.array(step), removed: z.array(step), changed: z.array(z.object({ fromStep: z.number().int(), toStep: z.number().int(), type: z.string(), changes: z.array(change) })) }),
  settings: z.array(change),
  unchanged: z.boolean(),
});

export const predictResponseSchema = predictionSummarySchema.omit({ flags: true, cautions: true }).extend({
  prediction: z.record(z.string(), z.unknown()).describe("the engine's full output: steps, phases, streams, flags, cautions"),
  uncertainty: z.record(z.string(), z.unknown()).nullable(),
});

export const meSchema = z.object({ user: person.extend({ email: z.string() }), group: z.object({ id: z.string(), name: z.string(), slug: z.string() }), role: z.string(), permissions: z.array(z.string()), via: z.enum(["session", "token"]) });

export const looseObject = z.record(z.string(), z.unknown());

export const calibrationReportSchema = z.object({
  n: z.number().int().describe("outcomes judged against a predictive distribution"),
  levels: z.array(z.object({
    level: fraction.describe("nominal level of the central predictive interval"), n: z.number().int(), inside: z.number().int(),
    share: nullableFraction.describe("share of outcomes inside; a calibrated model sits near the level"),
  })),
  withinInterval: nullableFraction, flagged: z.number().int(), notice: z.string().nullable(),
});
