// The synthetic study behind synthetic-study.test.ts, kept apart so that its loop can be read on its own.
import { simulateWorkup } from "@/lib/chem/predict";
import { createRng } from "@/lib/chem/random";
import { inferFromOutcome } from "@/lib/partition/inferred";
import { poolObservations, type ObservationForPool } from "@/lib/partition/pooled";
import { DESIGNS, extraction, PRODUCT, recoveryAt } from "./synthetic";

export const DEFAULTS_NOTE = "volumes ±5 %, recovery ±3 points, true log K uniform on [0.2, 1.0]";
const VOLUME_SD = 0.05;
const RECOVERY_SD = 0.03;

export interface StudyOptions {
  seed: number;
  repeats: number;
  workupsPerRepeat: number;
  /** Multiplies the half-width of every pooled interval (1 = as the app computes it); for the negative control. */
  intervalScale?: number;
}

export interface StudyResult {
  pooled: number;
  coverage: number;
  bias: number;
  rmsError: number;
  fits: number;
  leftOut: number;
}

export function runStudy(options: StudyOptions): StudyResult {
  const rng = createRng(options.seed);
  const scale = options.intervalScale ?? 1;
  let pooled = 0, covered = 0, sumError = 0, sumSquared = 0, fits = 0, leftOut = 0;
  for (let r = 0; r < options.repeats; r++) {
    const truth = 0.2 + 0.8 * rng.uniform();
    const observations: ObservationForPool[] = [];
    for (let w = 0; w < options.workupsPerRepeat; w++) {
      const [aqueousMl, organicMl, portions] = DESIGNS[(r + w) % DESIGNS.length] as [number, number, number];
      const recorded = extraction(aqueousMl, organicMl, portions);
      const actual = extraction(aqueousMl * (1 + VOLUME_SD * rng.normal()), organicMl * (1 + VOLUME_SD * rng.normal()), portions);
      const reported = recoveryAt(actual, truth) + RECOVERY_SD * rng.normal();
      fits++;
      const inference = inferFromOutcome({ spec: recorded, productKey: PRODUCT, recovery: reported, basis: "assayed", purityMethod: "qnmr", flags: [] }, simulateWorkup);
      if (!inference.use || inference.bound !== "value") {
        leftOut++;
        continue;
      }
      observations.push({
        id: `${r}-${w}`, logK: inference.logK, logKSe: inference.se, kind: "inferred", bound: "value", weight: inference.weight, excluded: false, createdAt: new Date(w),
      });
    }
    const p = poolObservations(observations);
    if (p.estimate === null || p.interval === null) continue;
    pooled++;
    const half = ((p.interval[1] - p.interval[0]) / 2) * scale;
    if (Math.abs(p.estimate - truth) <= half) covered++;
    sumError += p.estimate - truth;
    sumSquared += (p.estimate - truth) ** 2;
  }
  return { pooled, coverage: covered / pooled, bias: sumError / pooled, rmsError: Math.sqrt(sumSquared / pooled), fits, leftOut };
}
