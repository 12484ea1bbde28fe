// POST /api/v1/predict: the server's prediction of a spec with the group's library, nothing written.
import { type Db } from "@/lib/db/client";
import { parseInput } from "@/lib/errors";
import { assertEngineBudget, predictOffThread } from "@/lib/workers/engine";
import { groupLibrary } from "./library";
import { seedFromId, type StoredPredictionResult } from "./prediction";
import { predictRequestSchema } from "./schemas";

export interface PredictResponse extends StoredPredictionResult {
  engineVersion: string;
  productKey: string | null;
  productRecovery: number | null;
  recoveryLow: number | null;
  recoveryHigh: number | null;
}

/**
 * `userKey` names whose heavy slots the engine work takes (lib/workers/limits.ts). The work is refused with 422 beyond
 * the engine budget before any of it runs, and runs on an engine thread, off the event loop.
 */
export async function predictSpec(db: Db, groupId: string, body: unknown, userKey: string): Promise<PredictResponse> {
  const request = parseInput(predictRequestSchema, body);
  const spec = (body as { spec: unknown }).spec;
  assertEngineBudget(spec, request.draws, { spec: "spec", draws: "draws" });
  const library = await groupLibrary(db, groupId);
  const p = await predictOffThread(userKey, spec, { library, draws: request.draws, seed: request.seed ?? seedFromId(groupId) });
  return {
    engineVersion: p.engineVersion, productKey: p.productKey, productRecovery: p.productRecovery,
    recoveryLow: p.recoveryLow, recoveryHigh: p.recoveryHigh, ...p.result,
  };
}
