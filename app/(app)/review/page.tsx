import "./print.css";
import { Suspense } from "react";
import { can, type MemberContext } from "@/lib/authz";
import { listOperationTypes } from "@/lib/chem/operation-types";
import { requirePageMember } from "@/lib/authz/page";
import { PageHeader } from "@/components/ui/page-header";
import { Notice } from "@/components/ui/notice";
import { getDb } from "@/lib/db/client";
import { JobProgressPanel } from "@/lib/jobs/components/job-progress";
import { jobsStatus } from "@/lib/jobs/status";
import { calibration, calibrationByLevel, groupStats, histogram, rankedFlagged } from "@/lib/review/aggregate";
import { firstValues, reviewFilterSchema, type ReviewFilters } from "@/lib/review/filters";
import { chemistStats } from "@/lib/review/people";
import { loadReview } from "@/lib/review/queries";
import { FilterForm } from "./_components/filter-form";
import { ReviewViews } from "./_components/review-views";
import { Summary } from "./_components/summary";
import { CalibrationView } from "./_components/calibration-view";

export const metadata = { title: "Review" };

const OPERATION_LABELS = new Map(listOperationTypes().map((t) => [t.type as string, t.label]));

export default async function ReviewPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const member = await requirePageMember("data:read", { returnTo: "/review" });
  const parsed = reviewFilterSchema.safeParse(firstValues(await searchParams));
  const filters: ReviewFilters = parsed.success ? parsed.data : {};
  // The header goes out at once; the figures, which read every reported workup of the period, stream in after it.
  return (
    <>
      <PageHeader title="Review"
        description={`Workups of ${member.group.name} with a reported outcome, compared with their predictions: where material went missing, in which procedures, and what probably caused it.`} />
      <Suspense fallback={<p className="text-sm text-stone-600" role="status">Reading the group&apos;s reported workups…</p>}>
        <ReviewBody member={member} filters={filters} filterIssues={parsed.success ? null : parsed.error.issues.map((i) => i.message).join("; ")} />
      </Suspense>
    </>
  );
}

async function ReviewBody({ member, filters, filterIssues }: { member: MemberContext; filters: ReviewFilters; filterIssues: string | null }) {
  const viewer = { groupId: member.group.id, userId: member.user.id, isLead: member.role === "lead" };
  const db = await getDb();
  const [data, jobs] = await Promise.all([loadReview(db, viewer, filters), jobsStatus(db, member.group.id)]);
  const solventNames = Object.fromEntries(data.solvents.map((s) => [s.key, s.name]));
  const rows = data.rows;
  const points = rows
    .filter((r) => r.predicted !== null && r.reported !== null)
    .map((r) => ({ id: r.id, title: r.title, performedOn: r.performedOn, predicted: r.predicted as number, reported: r.reported as number, low: r.low, high: r.high, series: r.solventSystem ?? "none" }));
  const summary = calibration(rows);
  return (
    <div className="space-y-6">
      <FilterForm filters={filters} options={{ chemists: data.chemists, solvents: data.solvents, isLead: viewer.isLead }} />
      {filterIssues ? <Notice tone="warning" title="Some filters were not understood and were left out.">{filterIssues}</Notice> : null}
      {data.notice ? <Notice tone="warning">{data.notice}</Notice> : null}
      {data.truncated ? <Notice tone="info">Only the {rows.length} most recent workups are shown; narrow the dates to see earlier ones.</Notice> : null}
      <JobProgressPanel key={jobs.active.map((j) => j.id).join(",")} initial={jobs} />
      <Summary summary={summary} filters={filters} solventNames={solventNames} chemistName={filters.chemist ? data.names.get(filters.chemist) : undefined} />
      <ReviewViews
        points={points}
        bins={histogram(rows.flatMap((r) => (r.deviationPct === null ? [] : [r.deviationPct])))}
        bySolvent={groupStats(rows, (r) => [r.solventSystem ?? "none"], (k) => (k === "none" ? "No organic solvent" : `${solventNames[k] ?? k} / water`))}
        byOperation={groupStats(rows, (r) => r.operationTypes, (k) => OPERATION_LABELS.get(k) ?? k)}
        byChemist={chemistStats(rows, viewer, data.names)}
        chemistNote={viewer.isLead
          ? "As the group's lead you see each chemist by name; members see only their own figures beside everyone else's together. Read these as questions about procedures, not as a ranking."
          : "Your own workups beside everyone else's taken together; only a lead sees other chemists by name."}
        flagged={rankedFlagged(rows)}
        solventNames={solventNames}
        canRecordCause={can(member, "data:write")}
      />
      <CalibrationView levels={calibrationByLevel(rows)} />
    </div>
  );
}
