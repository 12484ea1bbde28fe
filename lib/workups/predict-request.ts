// POST /api/v1/predict: the server's prediction of a spec with the group's library, nothing written.
import { type Db } from "@/lib/db/client";
import { parseInput } from "@/lib/errors";
import { groupLibrary } from "./library";
import { computePrediction, seedFromId, type StoredPredictionResult } from "./prediction";
import { predictRequestSchema } from "./schemas";

export interface PredictResponse extends StoredPredictionResult {
  engineVersion: string;
  productKey: string | null;
  productRecovery: number | null;
  recoveryLow: number | null;
  recoveryHigh: number | null;
}

export async function predictSpec(db: Db, groupId: string, body: unknown): Promise<PredictResponse> {
  const request = parseInput(predictRequestSchema, body);
  const library = await groupLibrary(db, groupId);
  const spec = (body as { spec: unknown }).spec;
  const p = computePrediction(spec, { library, draws: request.draws, seed: request.seed ?? seedFromId(groupId) });
  return {
    engineVersion: p.engineVersion, productKey: p.productKey, productRecovery: p.productRecovery,
    recoveryLow: p.recoveryLow, recoveryHigh: p.recoveryHigh, ...p.result,
  };
}
