/**
 * One zod schema per partition input, shared by the add-measurement form, its server action and the REST route.
 * Browser-safe: zod only. A measurement is the amount (or concentration) of the compound found in each layer after
 * equilibration, with the layer volumes, the aqueous pH measured after equilibration and the temperature
 * (record the conditions that define D: common practice).
 */
import { z } from "zod";

/** shake_flask: a dedicated equilibrium experiment (OECD TG 107 pattern); layer_assay: both layers of a routine separation assayed. */
export const MEASUREMENT_METHODS = ["shake_flask", "layer_assay"] as const;
export type MeasurementMethod = (typeof MEASUREMENT_METHODS)[number];
export const METHOD_LABELS: Record<MeasurementMethod, string> = { shake_flask: "Shake-flask", layer_assay: "Layer assay" };

/** amount: amount in each layer plus both volumes; concentration: concentration in each layer (volumes not needed). */
export const MEASUREMENT_BASES = ["amount", "concentration"] as const;
/** Which layer, if any, held less than the assay can see; its figure is then the detection limit and K is only bounded. */
export const DETECTION_LIMITED = ["none", "aqueous", "organic"] as const;

const recordId = (label: string) => z.string({ error: `${label} must be an id` }).trim().min(1, { error: `${label} is required` }).max(64);
const blankToUndefined = (v: unknown) => (v === "" || v === null ? undefined : v);
const optionalNumber = <S extends z.ZodType<number>>(schema: S) => z.preprocess(blankToUndefined, schema.optional());
const layerFigure = (label: string) =>
  z.coerce.number({ error: `${label} must be a number` }).min(0, { error: `${label} must be ≥ 0` }).max(1e9, { error: `${label} is too large` });
const volume = (label: string) =>
  optionalNumber(z.coerce.number({ error: `${label} must be a number (mL)` }).positive({ error: `${label} must be > 0 mL` }).max(1e6, { error: `${label} must be ≤ 1000 L` }));

export const measurementInputSchema = z
  .object({
    compoundId: recordId("compoundId"),
    /** Organic solvent of the solvent/water system, as the library names it (etoac, dcm, …). */
    solventKey: z.string({ error: "choose the organic solvent" }).trim().toLowerCase().min(1, { error: "choose the organic solvent" }).max(64),
    method: z.enum(MEASUREMENT_METHODS, { error: () => `method must be one of ${MEASUREMENT_METHODS.join(", ")}` }),
    /** Measured in the aqueous layer after equilibration; required when the compound has ionizable sites. */
    aqueousPh: optionalNumber(z.coerce.number({ error: "aqueous pH must be a number" }).min(-1, { error: "aqueous pH must be ≥ −1" }).max(15, { error: "aqueous pH must be ≤ 15" })),
    temperatureC: z.preprocess(blankToUndefined, z.coerce.number({ error: "temperature must be a number (°C)" }).min(0, { error: "temperature must be ≥ 0 °C" }).max(80, { error: "temperature must be ≤ 80 °C" }).default(25)),
    basis: z.enum(MEASUREMENT_BASES, { error: () => "say whether you entered amounts or concentrations" }),
    /** Amount or concentration in the organic layer, in any unit, the same for both layers. */
    organic: layerFigure("the organic figure"),
    aqueous: layerFigure("the aqueous figure"),
    organicVolumeMl: volume("organic volume"),
    aqueousVolumeMl: volume("aqueous volume"),
    /** Amount put in, same unit as the layer amounts, to check the mass balance. */
    totalAmount: optionalNumber(z.coerce.number({ error: "amount added must be a number" }).positive({ error: "amount added must be > 0" }).max(1e9)),
    belowDetection: z.preprocess(blankToUndefined, z.enum(DETECTION_LIMITED).default("none")),
    /** Standard error of log D from replicates, when known. */
    logDSe: optionalNumber(z.coerce.number({ error: "standard error must be a number" }).positive({ error: "standard error must be > 0" }).max(3, { error: "standard error must be ≤ 3 log units" })),
    notes: z.string().max(2000, { error: "notes must be ≤ 2000 characters" }).default(""),
  })
  .superRefine((m, ctx) => {
    if (m.basis === "amount") {
      if (m.organicVolumeMl === undefined) ctx.addIssue({ code: "custom", path: ["organicVolumeMl"], message: "give the organic layer's volume (amounts need volumes)" });
      if (m.aqueousVolumeMl === undefined) ctx.addIssue({ code: "custom", path: ["aqueousVolumeMl"], message: "give the aqueous layer's volume (amounts need volumes)" });
    }
    if (m.organic === 0 && m.belowDetection !== "organic") {
      ctx.addIssue({ code: "custom", path: ["organic"], message: "nothing found in the organic layer: enter the detection limit and mark the layer as below detection" });
    }
    if (m.aqueous === 0 && m.belowDetection !== "aqueous") {
      ctx.addIssue({ code: "custom", path: ["aqueous"], message: "nothing found in the aqueous layer: enter the detection limit and mark the layer as below detection" });
    }
    if (m.totalAmount !== undefined && m.basis !== "amount") {
      ctx.addIssue({ code: "custom", path: ["totalAmount"], message: "the mass balance needs amounts, not concentrations" });
    }
  });

export type MeasurementInputRaw = z.input<typeof measurementInputSchema>;
export type MeasurementInput = z.output<typeof measurementInputSchema>;

export const exclusionInputSchema = z.object({
  observationId: recordId("observationId"),
  excluded: z.boolean({ error: "excluded must be true or false" }),
  /** Why, for the audit trail. */
  reason: z.string().trim().max(500, { error: "reason must be ≤ 500 characters" }).default(""),
});
export type ExclusionInput = z.output<typeof exclusionInputSchema>;
