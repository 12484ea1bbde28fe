/**
 * What the group's past outcomes teach the judgement of the next one: the stored predictive cases with their
 * reported values (for the hierarchical loss, assay and yield model) and the causes the group's shortfalls were
 * put down to (for the cause frequencies). Pure; the loader is lib/workups/group-model.ts.
 */
import { ASSAY_METHODS, HANDLING_STEPS, type HistoryCase } from "@/lib/chem/predictive";
import { CAUSE_PRIOR, CAUSE_PRIOR_WEIGHT, type CauseCode } from "./causes";
import { type OutcomeAnalysis } from "./analysis";

const finite = (v: unknown): v is number => typeof v === "number" && Number.isFinite(v);

/** A stored analysis as a history case, or null when it predates the predictive model or is malformed. */
export function historyCaseOf(analysis: unknown): HistoryCase | null {
  const p = (analysis as Partial<OutcomeAnalysis> | null)?.predictive;
  const c = p?.case;
  if (!p || !c || !finite(p.observedLog) || !finite(c.engine?.recovery)) return null;
  if (!(ASSAY_METHODS as readonly string[]).includes(c.assay)) return null;
  const handling = Object.fromEntries(HANDLING_STEPS.map((s) => [s, finite(c.handling?.[s]) ? c.handling[s] : 0]));
  return {
    engine: { recovery: c.engine.recovery, low: finite(c.engine.low) ? c.engine.low : null, high: finite(c.engine.high) ? c.engine.high : null },
    handling, assay: c.assay, crudeAssayed: c.crudeAssayed === true, chemist: typeof c.chemist === "string" ? c.chemist : null,
    family: typeof c.family === "string" ? c.family : null,
    observedLog: p.observedLog, yieldLog: finite(p.yieldLog) ? p.yieldLog : null,
  };
}

/** One past outcome: its stored analysis and, when the group reviewed it, the cause it found. */
export interface PastOutcome {
  analysis: unknown;
  foundCause?: string | null;
}

/**
 * Cause frequencies: the common-practice figures as CAUSE_PRIOR_WEIGHT pseudo-counts, plus each shortfall the group
 * found the cause of counted in full towards that cause ("other" towards none of the modelled ones), and each other
 * shortfall judged "below" counted towards its ranked causes in proportion to their plausibility (together at most
 * one count, like a finding).
 */
export function causeFrequencies(past: readonly PastOutcome[]): Record<CauseCode, number> {
  const counts = Object.fromEntries(Object.entries(CAUSE_PRIOR).map(([k, v]) => [k, v * CAUSE_PRIOR_WEIGHT])) as Record<CauseCode, number>;
  for (const { analysis: a, foundCause } of past) {
    if (foundCause !== undefined && foundCause !== null) {
      if (foundCause in counts) counts[foundCause as CauseCode] += FOUND_WEIGHT;
      continue;
    }
    const analysis = a as Partial<OutcomeAnalysis> | null;
    if (analysis?.deviation?.status !== "below") continue;
    for (const cause of analysis.causes ?? []) {
      if (cause.code in counts && finite(cause.score)) counts[cause.code] += RANKED_WEIGHT * cause.score;
    }
  }
  const total = Object.values(counts).reduce((s, v) => s + v, 0);
  return Object.fromEntries(Object.entries(counts).map(([k, v]) => [k, v / total])) as Record<CauseCode, number>;
}

/** Weight of a cause the group found, and of a shortfall's ranked causes (plausibility-weighted) without a finding. */
const FOUND_WEIGHT = 1;
const RANKED_WEIGHT = 1;
