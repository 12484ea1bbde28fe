/**
 * The group library's entries, checked with the same shape the engine reads (lib/chem/data/solvents.ts SolventProps,
 * lib/chem/data/reagents.ts ReagentProps): every number carries its source and how sure the group is of it. Bounds
 * are wide physical limits, there to catch a slipped decimal, not to judge the chemistry. Browser-safe.
 */
import { z } from "zod";
import { ACID_SYSTEMS, STRONG_ION_CHARGE, type ReagentProps } from "@/lib/chem/data/reagents";
import { type SolventProps } from "@/lib/chem/data/solvents";

export const CONFIDENCES = ["confirmed", "confirmed_digitized", "derived", "secondary", "memory", "assumed"] as const;
export const SOLVENT_FAMILIES = ["water", "ester", "ether", "chlorinated", "aromatic", "alkane", "alcohol", "nitrile", "ketone", "amide", "sulfoxide"] as const;
export const REAGENT_PURPOSES = ["acid", "base", "buffer", "neutral", "salt", "reducing", "complexing"] as const;
export const STRONG_IONS = Object.keys(STRONG_ION_CHARGE) as (keyof typeof STRONG_ION_CHARGE)[];
export const ACID_SYSTEM_KEYS = Object.keys(ACID_SYSTEMS) as (keyof typeof ACID_SYSTEMS)[];

const number = (label: string, min: number, max: number) =>
  z.number({ error: `${label} must be a number` }).refine(Number.isFinite, { error: `${label} must be finite` })
    .refine((v) => v >= min && v <= max, { error: `${label} must be between ${min} and ${max}` });

/** A value with its source key (data/sources.ts, or the group's own reference) and confidence. */
const sourced = (label: string, min: number, max: number) => z.object({
  value: number(label, min, max),
  source: z.string({ error: `name the source of the ${label}` }).trim().min(1, { error: `name the source of the ${label}` }).max(300, { error: "source must be ≤ 300 characters" }),
  confidence: z.enum(CONFIDENCES, { error: () => `confidence must be one of ${CONFIDENCES.join(", ")}` }),
  tempC: number(`temperature of the ${label}`, -50, 200).optional(),
});

export const libraryKeySchema = z.string({ error: "key is required" }).trim()
  .regex(/^[a-z0-9][a-z0-9_.-]{0,39}$/, { error: "key: 1–40 lower-case letters, digits, '_', '-' or '.', as used in workup records" });

const line = z.object({ a: number("slope a", -5, 5), b: number("intercept b", -10, 10) });

export const solventPropsSchema = z.object({
  key: libraryKeySchema,
  name: z.string({ error: "name is required" }).trim().min(1, { error: "name is required" }).max(100),
  family: z.enum(SOLVENT_FAMILIES, { error: () => "choose the solvent family" }),
  density: sourced("density (g/mL)", 0.4, 3),
  bpC: sourced("boiling point (°C)", -50, 400),
  logP: sourced("log P", -5, 10),
  waterMiscible: z.boolean(),
  solventInWaterWtPct: sourced("solubility in water (wt %)", 0, 100).nullable(),
  waterInSolventWtPct: sourced("water in the solvent (wt %)", 0, 100).nullable(),
  chlorinated: z.boolean(),
  peroxideFormer: z.boolean(),
  ionPairCapable: z.boolean(),
  dipolarAprotic: z.boolean(),
  reproductiveToxicant: z.boolean(),
  partition: z.object({
    donor: line, acceptor: line, se: number("standard error", 0.01, 3),
    source: z.string().trim().min(1, { error: "name the source of the partition lines" }).max(300),
    confidence: z.enum(CONFIDENCES),
  }).nullable(),
  ionLogKOffset: number("ion log K offset", -12, 2),
  ionPairLogKOffset: number("ion-pair log K offset", -12, 2),
  cosolvency: z.object({ m: number("cosolvency slope m", -5, 5), n: number("cosolvency intercept n", -5, 5), source: z.string().trim().min(1).max(300), confidence: z.enum(CONFIDENCES) }).nullable(),
}).superRefine((s, ctx) => {
  if (s.waterMiscible) {
    if (s.partition) ctx.addIssue({ code: "custom", path: ["partition"], message: "a water-miscible solvent forms no layer: leave the partition lines empty" });
    return;
  }
  if (!s.partition) ctx.addIssue({ code: "custom", path: ["partition"], message: "a solvent that forms a layer needs partition lines (log K = a·log P + b)" });
  if (!s.solventInWaterWtPct) ctx.addIssue({ code: "custom", path: ["solventInWaterWtPct"], message: "give the solvent's solubility in water" });
  if (!s.waterInSolventWtPct) ctx.addIssue({ code: "custom", path: ["waterInSolventWtPct"], message: "give the water content of the wet solvent" });
}) satisfies z.ZodType<SolventProps>;

const amounts = <K extends string>(keys: readonly K[], label: string) =>
  z.partialRecord(z.enum(keys as unknown as [K, ...K[]]), number(label, 0, 30));

export const reagentPropsSchema = z.object({
  key: libraryKeySchema,
  name: z.string({ error: "name is required" }).trim().min(1, { error: "name is required" }).max(100),
  kind: z.enum(["solution", "solid"], { error: () => "kind must be solution or solid" }),
  purpose: z.enum(REAGENT_PURPOSES, { error: () => "choose what the reagent is for" }),
  density: sourced("density (g/mL)", 0.5, 3).nullable(),
  basis: sourced("concentration or molar mass", 0, 2000),
  ions: amounts(STRONG_IONS, "strong-ion amount"),
  systems: amounts(ACID_SYSTEM_KEYS, "acid–base system amount"),
  solubilityGPer100g: sourced("solubility (g/100 g water)", 0, 500).optional(),
  note: z.string().trim().max(500).optional(),
}).superRefine((r, ctx) => {
  if (r.kind === "solution" && !r.density) ctx.addIssue({ code: "custom", path: ["density"], message: "a solution needs its density" });
  if (r.kind === "solid" && !(r.basis.value > 0)) ctx.addIssue({ code: "custom", path: ["basis", "value"], message: "a solid needs its molar mass (g/mol)" });
}) satisfies z.ZodType<ReagentProps>;

export type SolventPropsInput = z.input<typeof solventPropsSchema>;
export type ReagentPropsInput = z.input<typeof reagentPropsSchema>;
