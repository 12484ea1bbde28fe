/**
 * Planner options (`layerwise plan`): also accepted as the optional `plan` object of a workup description, where
 * the app keeps it with the spec and the command line reads it.
 */
import { z } from "zod";
import { strictObject } from "./schema-strict";

export const planOptionsSchema = strictObject({
  /** Component to recover; default the first with role "product". */
  product: z.string().trim().min(1, { error: "product must name a component key" }).optional(),
  targetRecovery: z.number({ error: "targetRecovery must be a number" }).gt(0, { error: "targetRecovery must be > 0" }).lt(1, { error: "targetRecovery must be < 1" }).default(0.95),
  maxImpurityLeft: z.number({ error: "maxImpurityLeft must be a number" }).gt(0, { error: "maxImpurityLeft must be > 0" }).lt(1, { error: "maxImpurityLeft must be < 1" }).default(0.01),
  /** Organic solvent (library key); default the first water-immiscible solvent of the mixture or extraction. */
  solvent: z.string().trim().min(1).optional(),
  maxPortions: z.number().int().min(1).max(10, { error: "maxPortions must be ≤ 10" }).default(5),
});
export type PlanOptions = z.input<typeof planOptionsSchema>;
