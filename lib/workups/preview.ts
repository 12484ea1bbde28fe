// What the editor shows before a save must match what the save stores: both lay the group's pooled partition values
// and the registry's log P and pKa sites of the linked compounds over the spec (lib/partition/overlay.ts).
import { z } from "zod";
import { parseInput } from "@/lib/errors";
import { groupValuesForLinks } from "@/lib/partition/group-values";
import { type GroupValues } from "@/lib/partition/overlay";
import { type Client } from "./context";
import { groupLibrary } from "./library";
import { assertEngineBudget, predictOffThread } from "@/lib/workers/engine";
import { SAVE_DRAWS, seedFromId } from "./prediction";
import { siteFlags } from "./site-flags";
import { componentLinkSchema } from "./schemas";
import { type PredictionSummary } from "./service";

const previewLinksSchema = z.array(componentLinkSchema).max(50, { error: "at most 50 component links" });

export type PreviewLinks = z.input<typeof previewLinksSchema>;

/** The group's values for the linked compounds, by component key (another group's compound ids give nothing). */
export async function previewGroupValues(db: Client, groupId: string, links: unknown): Promise<GroupValues> {
  return groupValuesForLinks(db, groupId, parseInput(previewLinksSchema, links));
}

/**
 * The prediction a save would store, without saving. Without `links`, a saved workup's own links apply; the seed
 * follows the workup id (or the group's id for a new workup), as on save.
 */
export async function previewPrediction(
  db: Client, groupId: string, spec: unknown, options: { workupId?: string; links?: unknown; userKey?: string } = {},
): Promise<PredictionSummary> {
  assertEngineBudget(spec, SAVE_DRAWS);
  const links = options.links !== undefined
    ? parseInput(previewLinksSchema, options.links)
    : options.workupId
      ? await db.workupComponent.findMany({ where: { groupId, workupId: options.workupId }, select: { key: true, compoundId: true } })
      : [];
  const [library, groupValues] = await Promise.all([groupLibrary(db, groupId), groupValuesForLinks(db, groupId, links)]);
  // On an engine thread in the caller's heavy slots (lib/workers/engine.ts), like a save.
  const p = await predictOffThread(options.userKey ?? groupId, spec, {
    library, seed: seedFromId(options.workupId ?? groupId), draws: SAVE_DRAWS, groupValues, extraFlags: await siteFlags(spec),
  });
  const { flags, cautions } = p.result.prediction;
  return { engineVersion: p.engineVersion, productKey: p.productKey, productRecovery: p.productRecovery, recoveryLow: p.recoveryLow, recoveryHigh: p.recoveryHigh, flags, cautions };
}
