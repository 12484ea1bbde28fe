// The per-person privacy rule, as part of the guard: a review is about procedures, not a ranking of people, so
// figures singled out for one chemist are open only to that chemist and to the group's leads (common practice for
// group reviews: per-person results are discussed in aggregate or privately). Every place that can narrow
// workups, outcomes or deviations to one person (the review page, the workup list and its API, the CSV export)
// asks here.
import { ForbiddenError } from "@/lib/errors";

export const PERSON_FILTER_REFUSED = "Only a group lead can look at another chemist's workups on their own.";

export function maySeePerson(member: { role: string; user: { id: string } }, personId: string): boolean {
  return member.role === "lead" || personId === member.user.id;
}

/** Throws 403 when `personId` (a chemist filter) names someone else and the member is not a lead. */
export function assertMaySeePerson(member: { role: string; user: { id: string } }, personId: string | null | undefined): void {
  if (personId && !maySeePerson(member, personId)) throw new ForbiddenError(PERSON_FILTER_REFUSED);
}
