/**
 * Work-up operations. Each separation says which stream is kept (`keep`); the other can be
 * saved under a name (`saveAs`) for a later combine or back-extraction, otherwise it goes to waste. Wash, extract
 * and back-extract are the same physics with different defaults for the kept stream.
 * Parsed (output) fields carry their canonical unit in the name: volumeMl, massG, amountMmol, temperatureC.
 */
import { z } from "zod";
import { strictObject } from "./schema-strict";
import { amountSchema, massSchema, pHSchema, pressureSchema, temperatureSchema, volumeSchema } from "./schema-quantities";

const key = (label: string) => z.string({ error: `${label} is required` }).trim().min(1, { error: `${label} is required` });
const streamName = z.string().trim().min(1, { error: "saveAs must not be empty" }).max(64, { error: "saveAs must be ≤ 64 characters" });
const portions = z
  .number({ error: "portions must be a number" })
  .int({ error: "portions must be a whole number" })
  .min(1, { error: "portions must be ≥ 1" })
  .max(50, { error: "portions must be ≤ 50" })
  .default(1);
const liquidLayer = z.enum(["organic", "aqueous"], { error: () => "keep must be 'organic' or 'aqueous'" });

export const observationSchema = strictObject({
    pH: pHSchema("observed pH").optional(),
    volumeOrganic: volumeSchema("observed organic volume").optional(),
    volumeAqueous: volumeSchema("observed aqueous volume").optional(),
    interface: z.enum(["sharp", "hazy", "rag", "emulsion", "solids"]).optional(),
    settleMinutes: z.number().min(0, { error: "settleMinutes must be ≥ 0" }).optional(),
    gas: z.boolean().optional(),
    exotherm: z.boolean().optional(),
    precipitate: z.boolean().optional(),
  })
  .transform(({ volumeOrganic, volumeAqueous, ...rest }) => ({
    ...rest,
    volumeOrganicMl: volumeOrganic,
    volumeAqueousMl: volumeAqueous,
  }));

const common = {
  /** The step's stable id, kept with it so merges and the history follow it (lib/workups/step-ids.ts); unused by the engine. */
  id: z.string().regex(/^[A-Za-z0-9_-]{1,64}$/, { error: "id must be 1–64 letters, digits, '_' or '-'" }).optional(),
  label: z.string().max(200).optional(),
  temperature: temperatureSchema("temperature").optional(),
  observed: observationSchema.optional(),
};

/** The step id stays with the stored spec; the parsed operation the engine reads has no use for it. */
function withCommon<T extends { temperature?: number | undefined; id?: string | undefined }>(o: T) {
  const { temperature, id: _id, ...rest } = o;
  return { ...rest, temperatureC: temperature };
}

const charge = strictObject({ type: z.literal("charge"), solvent: key("solvent"), volume: volumeSchema(), ...common })
  .transform(({ volume, ...o }) => ({ ...withCommon(o), volumeMl: volume }));

const reactiveSpecies = strictObject({
  name: key("reactive species name"),
  amount: amountSchema("reactive species amount"),
  /** mol of gas (H₂ for hydrides and active metals) released per mol quenched; omitted = not estimated. */
  gasPerMol: z.number().min(0).max(10).optional(),
}).transform(({ amount, ...r }) => ({ ...r, amountMmol: amount }));

const quench = strictObject({
  type: z.literal("quench"),
  reagent: key("reagent"),
  volume: volumeSchema().optional(),
  amount: amountSchema().optional(),
  mode: z.enum(["normal", "inverse"]).default("normal"),
  reactive: reactiveSpecies.optional(),
  ...common,
}).refine((o) => o.volume !== undefined || o.amount !== undefined, { error: "quench needs a volume or an amount of reagent", path: ["volume"] })
  .transform(({ volume, amount, ...o }) => ({ ...withCommon(o), volumeMl: volume, amountMmol: amount }));

const wash = strictObject({
  type: z.literal("wash"), reagent: key("reagent"), volume: volumeSchema("volume per portion"), portions,
  keep: liquidLayer.default("organic"), saveAs: streamName.optional(), ...common,
}).transform(({ volume, ...o }) => ({ ...withCommon(o), volumeMl: volume }));

const extract = strictObject({
  type: z.literal("extract"), solvent: key("solvent"), volume: volumeSchema("volume per portion"), portions,
  keep: liquidLayer.default("organic"), saveAs: streamName.optional(), ...common,
}).transform(({ volume, ...o }) => ({ ...withCommon(o), volumeMl: volume }));

const backExtract = strictObject({
  type: z.literal("back_extract"), reagent: key("reagent"), volume: volumeSchema("volume per portion"), portions,
  keep: liquidLayer.default("aqueous"), saveAs: streamName.optional(), ...common,
}).transform(({ volume, ...o }) => ({ ...withCommon(o), volumeMl: volume }));

const separate = strictObject({ type: z.literal("separate"), keep: liquidLayer, saveAs: streamName.optional(), ...common })
  .transform(withCommon);

const combine = strictObject({
  type: z.literal("combine"),
  streams: z.array(streamName).min(1, { error: "combine needs at least one saved stream" }),
  ...common,
}).transform(withCommon);

const adjustPh = strictObject({
  type: z.literal("adjust_ph"), reagent: key("reagent"), volume: volumeSchema().optional(), amount: amountSchema().optional(),
  targetPh: pHSchema("targetPh").optional(), ...common,
}).refine((o) => [o.volume, o.amount, o.targetPh].filter((v) => v !== undefined).length === 1, {
  error: "adjust_ph needs exactly one of volume, amount or targetPh", path: ["volume"],
}).transform(({ volume, amount, ...o }) => ({ ...withCommon(o), volumeMl: volume, amountMmol: amount }));

const addSalt = strictObject({
  type: z.literal("add_salt"), salt: key("salt"), mass: massSchema().optional(), saturate: z.boolean().optional(), ...common,
}).refine((o) => (o.mass !== undefined) !== (o.saturate === true), { error: "add_salt needs either a mass or saturate: true", path: ["mass"] })
  .transform(({ mass, ...o }) => ({ ...withCommon(o), massG: mass, saturate: o.saturate ?? false }));

const removeCosolvent = strictObject({
  type: z.literal("remove_cosolvent"), solvent: key("solvent"),
  fractionRemoved: z.number().gt(0, { error: "fractionRemoved must be > 0" }).max(1, { error: "fractionRemoved must be ≤ 1" }).default(0.95),
  ...common,
}).transform(withCommon);

const rinse = strictObject({ solvent: key("rinse solvent"), volume: volumeSchema("rinse volume") })
  .transform(({ volume, solvent }) => ({ solvent, volumeMl: volume }));

const dry = strictObject({ type: z.literal("dry"), agent: key("agent"), mass: massSchema().optional(), rinse: rinse.optional(), ...common })
  .transform(({ mass, ...o }) => ({ ...withCommon(o), massG: mass }));

const filter = strictObject({
  type: z.literal("filter"),
  keep: z.enum(["filtrate", "solid"], { error: () => "keep must be 'filtrate' or 'solid'" }).default("filtrate"),
  /** Components the chemist saw (or expects) as a solid; they go to the solid fraction. */
  solidComponents: z.array(key("component key")).default([]),
  cakeMass: massSchema("cake mass").optional(),
  rinse: rinse.optional(),
  saveAs: streamName.optional(),
  ...common,
}).transform(({ cakeMass, ...o }) => ({ ...withCommon(o), cakeMassG: cakeMass }));

const concentrate = strictObject({
  type: z.literal("concentrate"),
  method: z.enum(["rotavap", "high_vacuum", "n2_stream", "distillation"]).default("rotavap"),
  bath: temperatureSchema("bath temperature").optional(),
  pressure: pressureSchema().optional(),
  /** Total time on the evaporator, min; omitted: until the solvent is gone plus a few minutes (evaporation.ts). */
  minutes: z.number({ error: "minutes must be a number" }).gt(0, { error: "minutes must be > 0" }).max(10080, { error: "minutes must be ≤ 10080 (one week)" }).optional(),
  /** Whether the stream was tested for peroxides before concentration (asked for ether streams: peroxide-forming ethers, common practice). */
  peroxideTested: z.boolean().optional(),
  ...common,
}).transform(({ bath, pressure, ...o }) => ({ ...withCommon(o), bathC: bath ?? 40, pressureMbar: pressure }));

export const operationSchema = z.discriminatedUnion("type", [
  charge, quench, wash, extract, backExtract, separate, combine, adjustPh, addSalt, removeCosolvent, dry, filter, concentrate,
]);

export type OperationRaw = z.input<typeof operationSchema>;
export type Operation = z.output<typeof operationSchema>;
export type OperationType = Operation["type"];
export type OperationOf<T extends OperationType> = Extract<Operation, { type: T }>;
