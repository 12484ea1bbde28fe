// The review page's filters, read from the query string (one schema for the page, the CSV route and the tests).
import { z } from "zod";
import { EARLIEST_DAY, LATEST_DAY } from "@/lib/workups/schemas";

// The same range as the workup dates: a year 0 or 10000 reaches the date comparison and the database refuses it.
const day = (label: string) =>
  z.preprocess((v) => (v === "" ? undefined : v), z.iso.date({ error: `${label} must be a date written YYYY-MM-DD` })
    .refine((d) => !/^\d{4}-\d{2}-\d{2}$/.test(d) || (d >= EARLIEST_DAY && d <= LATEST_DAY), { error: `${label} must be between ${EARLIEST_DAY} and ${LATEST_DAY}` })
    .optional());
const id = z.preprocess((v) => (v === "" ? undefined : v), z.string().trim().min(1).max(64).optional());

export const reviewFilterSchema = z
  .object({
    from: day("from"),
    to: day("to"),
    /** A member's user id; only a lead may look at someone else's workups on their own (the review's privacy rule). */
    chemist: id,
    /** Organic solvent key of the solvent system. */
    solvent: z.preprocess((v) => (v === "" ? undefined : v), z.string().trim().toLowerCase().min(1).max(64).optional()),
  })
  .refine((f) => !f.from || !f.to || f.from <= f.to, { error: "the start date must not be after the end date", path: ["to"] });

export type ReviewFilters = z.output<typeof reviewFilterSchema>;

/** Query-string values as Next hands them to a page (a repeated key arrives as an array: the first one counts). */
export function firstValues(params: Record<string, string | string[] | undefined>): Record<string, string | undefined> {
  return Object.fromEntries(Object.entries(params).map(([k, v]) => [k, Array.isArray(v) ? v[0] : v]));
}

export function filterQuery(filters: ReviewFilters): string {
  const q = new URLSearchParams();
  for (const key of ["from", "to", "chemist", "solvent"] as const) {
    const v = filters[key];
    if (v) q.set(key, v);
  }
  return q.toString();
}
