// Workups with outcomes for the review and partition browser tests, created through the JSON API with the signed-in
// browser's session (the real guard, validation and prediction). People and titles are invented; acetanilide is real:
// M = 135.17 g/mol, log P 1.16 (PhysProp experimental log Kow, from memory).
import { expect, type APIRequestContext } from "@playwright/test";

export const ACETANILIDE_SMILES = "CC(=O)Nc1ccccc1";
const MOLAR_MASS = 135.17;

export interface ExtractionOptions {
  title: string;
  performedOn: string;
  solvent: "etoac" | "dcm";
  chemistId?: string;
  /** A stated log K for the solvent (literature, ±0.1; a value chosen for the tests) instead of the log P estimate. */
  statedLogK?: number;
}

/** 5 mmol acetanilide from 60 mL water into 2 × 30 mL solvent, dried and concentrated. */
export function extractionBody(o: ExtractionOptions, compoundId?: string) {
  return {
    header: { title: o.title, performedOn: o.performedOn, chemistId: o.chemistId ?? null, notebookRef: "E2E", expectedProductMmol: 5, assayedProductMmol: 5 },
    spec: {
      components: [{
        key: "acetanilide", name: "Acetanilide", role: "product", smiles: ACETANILIDE_SMILES, molarMass: MOLAR_MASS, amount: { value: 5, unit: "mmol" },
        logP: { value: 1.16, provenance: "literature", source: "PhysProp experimental log Kow (from memory)" },
        ...(o.statedLogK !== undefined ? { logK: { [o.solvent]: { value: o.statedLogK, provenance: "literature", se: 0.1, source: "test value" } } } : {}),
      }],
      mixture: { solvents: [{ solvent: "water", volume: { value: 60, unit: "mL" } }] },
      operations: [
        { type: "extract", solvent: o.solvent, volume: { value: 30, unit: "mL" }, portions: 2, keep: "organic" },
        { type: "dry", agent: "na2so4", mass: { value: 3, unit: "g" } },
        { type: "concentrate" },
      ],
    },
    links: compoundId ? [{ key: "acetanilide", compoundId }] : [],
  };
}

export async function me(request: APIRequestContext): Promise<{ id: string; name: string }> {
  const response = await request.get("/api/v1/me");
  expect(response.ok()).toBe(true);
  return ((await response.json()) as { user: { id: string; name: string } }).user;
}

/**
 * Saves the workup and reports a recovery of `factor` times the predicted one (qNMR, or weight only): 1 is as
 * predicted, 0.6 a clear shortfall. Returns the workup id.
 */
export async function workupWithOutcome(request: APIRequestContext, o: ExtractionOptions, factor: number, options: { compoundId?: string; weightOnly?: boolean } = {}): Promise<string> {
  // Cookie-carried writes must say they come from our own pages (the CSRF check), as the app's own fetches do.
  const headers = { origin: `http://127.0.0.1:${process.env["LW_E2E_PORT"] ?? ""}` };
  const saved = await request.post("/api/v1/workups", { headers, data: extractionBody(o, options.compoundId) });
  expect(saved.status(), await saved.text()).toBe(201);
  const { id, prediction } = (await saved.json()) as { id: string; prediction: { productRecovery: number } };
  // The interval is computed in the background after the save; an outcome reported before it would wait unjudged.
  await expect.poll(async () => ((await (await request.get(`/api/v1/workups/${id}`)).json()) as { intervalState: string }).intervalState, { timeout: 30_000 }).toBe("ready");
  const mg = prediction.productRecovery * factor * 5 * MOLAR_MASS;
  const outcome = await request.post(`/api/v1/workups/${id}/outcome`, {
    headers,
    data: options.weightOnly
      ? { isolatedMassMg: Number(mg.toFixed(1)), purityMethod: "weight_only" }
      : { isolatedMassMg: Number((mg / 0.98).toFixed(1)), purityPct: 98, purityMethod: "qnmr" },
  });
  expect(outcome.ok(), await outcome.text()).toBe(true);
  return id;
}
