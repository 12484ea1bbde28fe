// The calibration figures of the review, for the page and the API alike: one loader, one shape.
import { type Db } from "@/lib/db/client";
import { parseInput } from "@/lib/errors";
import { calibration, calibrationByLevel, type CalibrationPoint } from "./aggregate";
import { reviewFilterSchema } from "./filters";
import { type Viewer } from "./people";
import { loadReview } from "./queries";

export interface CalibrationReport {
  /** Outcomes judged against a predictive distribution (older judgements carry no quantile and are left out). */
  n: number;
  levels: CalibrationPoint[];
  /** Share inside the stored 95 % interval, and workups flagged for review, over all judged outcomes. */
  withinInterval: number | null;
  flagged: number;
  /** Set when a filter was dropped because this viewer may not use it. */
  notice: string | null;
}

export async function calibrationReport(db: Db, viewer: Viewer, query: unknown): Promise<CalibrationReport> {
  const filters = parseInput(reviewFilterSchema, query);
  const data = await loadReview(db, viewer, filters);
  const levels = calibrationByLevel(data.rows);
  const summary = calibration(data.rows);
  return { n: levels[0]?.n ?? 0, levels, withinInterval: summary.withinInterval, flagged: summary.flagged, notice: data.notice };
}
