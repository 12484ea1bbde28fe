// Where a workup's Monte Carlo interval stands (Workup.intervalState): a save stores the point prediction and queues
// the interval (lib/jobs/interval.ts). Shared by the reads, the API and the pages.
export const INTERVAL_STATES = ["ready", "pending", "failed"] as const;

export type IntervalState = (typeof INTERVAL_STATES)[number];

/** The words every view uses for a state other than "ready". */
export const INTERVAL_WORDS: Record<Exclude<IntervalState, "ready">, string> = {
  pending: "interval being computed",
  failed: "interval could not be computed",
};
