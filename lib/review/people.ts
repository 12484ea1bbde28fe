/**
 * A review is about procedures, not a ranking of people: per-person statistics are shown only in aggregate, or to the
 * person concerned and the group lead (the review's privacy rule). A lead sees each chemist by
 * name; anyone else sees their own figures beside everyone else's taken together, and may filter only by themselves.
 */
import { maySeePerson } from "@/lib/authz/people";
import { groupStats, type GroupStat, type ReviewRow } from "./aggregate";

export interface Viewer {
  groupId: string;
  userId: string;
  isLead: boolean;
}

export const YOU = "You";
export const EVERYONE_ELSE = "Everyone else";
export const NOT_RECORDED = "Not recorded";

export function chemistFilterFor(viewer: Viewer, requested: string | undefined): { chemist: string | undefined; notice: string | null } {
  // The same rule the guard enforces for the workup list and its exports (lib/authz/people.ts maySeePerson).
  if (!requested || maySeePerson({ role: viewer.isLead ? "lead" : "member", user: { id: viewer.userId } }, requested)) return { chemist: requested, notice: null };
  return { chemist: undefined, notice: "Only a group lead can look at another chemist's workups on their own; the chemist filter was not applied." };
}

export function chemistStats(rows: readonly ReviewRow[], viewer: Viewer, names: ReadonlyMap<string, string>): GroupStat[] {
  if (viewer.isLead) {
    return groupStats(rows, (r) => [r.chemistId ?? ""], (id) => (id ? (names.get(id) ?? "Former member") : NOT_RECORDED));
  }
  return groupStats(rows, (r) => [r.chemistId === viewer.userId ? "self" : "rest"], (key) => (key === "self" ? YOU : EVERYONE_ELSE));
}
