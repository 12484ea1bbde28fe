import Link from "next/link";
import { type ReactNode } from "react";
import { can } from "@/lib/authz";
import { pageFailure, requirePageMember } from "@/lib/authz/page";
import { Card, PageHeader } from "@/components/ui/page-header";
import { Badge } from "@/components/ui/badge";
import { buttonClass } from "@/components/ui/button";
import { formatDate, formatDateTime, formatNumber } from "@/components/ui/format";
import { getDb } from "@/lib/db/client";
import { resolveLibrary } from "@/lib/chem/library";
import { getWorkupDetail } from "@/lib/workups/queries";
import { purityMethodWords } from "@/lib/workups/schemas";
import { groupLibrary } from "@/lib/workups/library";
import { listVersions } from "@/lib/workups/history";
import { stepWords } from "@/lib/workups-client/describe";
import { StatusBadge } from "@/components/workup/detail/status-badge";
import { ComponentsView } from "@/components/workup/detail/components-view";
import { StepsView } from "@/components/workup/detail/steps-view";
import { OutcomeForm } from "@/components/workup/detail/outcome-form";
import { OutcomeResult } from "@/components/workup/detail/outcome-result";
import { FoundCauseForm } from "@/components/review/found-cause-form";
import { PredictionOverview, combineSteps } from "@/components/workup/prediction/prediction-overview";
import { MixtureView } from "@/components/workup/detail/mixture-view";
import { PartitionProvenance } from "@/lib/partition/components/partition-provenance";
import { ProcedureText } from "@/components/workup/detail/procedure-text";
import { Attachments } from "@/components/workup/detail/attachments";
import { NotebookLink } from "@/components/workup/detail/notebook-link";
import { RefreshWhileIntervalPending } from "@/components/workup/detail/interval-pending";
import { INTERVAL_WORDS } from "@/lib/workups/interval-state";
import { listAttachments } from "@/lib/attachments/service";
import { renderProcedure, stepsOf } from "@/lib/procedure/render";

export const metadata = { title: "Workup" };


function amount(mmol: number | null): string {
  return mmol === null ? "—" : `${formatNumber(mmol)} mmol`;
}

export default async function WorkupPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const member = await requirePageMember("data:read", { returnTo: `/workups/${id}` });
  const db = await getDb();
  // One round of queries: the workup, its library, versions and attachments together (all scoped by group; a miss
  // is the 404 whichever answers first).
  const [workup, overrides, versions, attachments] = await Promise.all([
    getWorkupDetail(db, member.group.id, id), groupLibrary(db, member.group.id),
    listVersions(db, member.group.id, id, { found: true }), listAttachments(db, member.group.id, id),
  ]).catch(pageFailure);
  const library = resolveLibrary(overrides);
  const stored = workup.prediction;
  const prediction = stored?.result.prediction ?? null;
  const analysis = workup.outcome?.analysis ?? null;
  const writer = can(member, "data:write");
  const operations = Array.isArray(workup.spec.operations) ? workup.spec.operations : [];
  // Predictions stored before partition sources were recorded have no `partition` field.
  const partitionSources = Array.isArray(stored?.result.partition) ? stored.result.partition : null;
  const partitionNames = Object.fromEntries([
    ...workup.components.map((c) => [c.key, c.name] as const),
    ...Object.entries(library.solvents).map(([key, s]) => [`solvent:${key}`, s.name] as const),
  ]);
  const links = new Map(workup.components.flatMap((c) => (c.compound ? [[c.key, c.compound] as const] : [])));
  const intervalPending = workup.intervalState === "pending";
  const intervalNote = workup.intervalState !== "ready"
    ? INTERVAL_WORDS[workup.intervalState]
    : stored?.result.uncertainty ? `${stored.result.uncertainty.draws} draws` : "no interval stored";
  const header: [string, ReactNode][] = [
    ["Date", formatDate(workup.header.performedOn)],
    ["Chemist", workup.chemistName ?? "—"],
    ["Notebook reference", workup.header.notebookRef || "—"],
    ["Notebook entry", <NotebookLink key="url" url={workup.header.notebookUrl} />],
    ["Reaction scale", amount(workup.header.scaleMmol)],
    ["Expected product", amount(workup.header.expectedProductMmol)],
    ["Product assayed before the workup", amount(workup.header.assayedProductMmol)],
    ["Version", `${workup.version} · saved ${formatDateTime(workup.updatedAt)}${workup.updatedBy ? ` by ${workup.updatedBy.name}` : ""}`],
  ];
  return (
    <>
      <PageHeader
        title={workup.header.title}
        description={<span className="flex flex-wrap items-center gap-2"><StatusBadge status={workup.status} intervalPending={intervalPending} />{workup.flagged ? <Badge tone="low">Flagged for review</Badge> : null}</span>}
        actions={
          <>
            <Link href="/workups" className={buttonClass("ghost")}>All workups</Link>
            {writer ? <Link href={`/workups/new?copy=${workup.id}`} className={buttonClass("secondary")}>Copy as new</Link> : null}
            {writer ? <Link href={`/workups/${workup.id}/edit`} className={buttonClass("primary")}>Edit</Link> : null}
          </>
        }
      />
      <div className="grid gap-6 lg:grid-cols-3">
        <div className="space-y-6 lg:col-span-1">
          <Card title="Record">
            <dl className="space-y-2 text-sm">
              {header.map(([k, v]) => (
                <div key={k}><dt className="text-stone-500">{k}</dt><dd className="text-stone-900">{v}</dd></div>
              ))}
            </dl>
          </Card>
          <Card title="Outcome">
            {analysis ? <OutcomeResult analysis={analysis} intervalPending={intervalPending} /> : <p className="text-sm text-stone-600">{workup.outcome ? "Reported, but not compared with a prediction." : "No outcome reported yet."}</p>}
            {workup.outcome ? (
              <p className="mt-2 text-xs text-stone-500">
                Isolated {formatNumber(workup.outcome.isolatedMassMg, 1)} mg{workup.outcome.purityPct !== null ? `, ${formatNumber(workup.outcome.purityPct, 1)} % pure` : ""} ({purityMethodWords(workup.outcome.purityMethod)})
                {workup.outcome.reportedBy ? `, reported by ${workup.outcome.reportedBy.name}` : ""}.
                {workup.outcome.notes ? <span className="block italic">“{workup.outcome.notes}”</span> : null}
              </p>
            ) : null}
            {workup.outcome && (workup.outcome.foundCause || workup.flagged || analysis?.deviation.status === "below" || analysis?.deviation.status === "inconclusive") ? (
              <FoundCauseForm workupId={workup.id} canRecord={can(member, "data:write")}
                found={workup.outcome.foundCause ? { cause: workup.outcome.foundCause.cause, note: workup.outcome.foundCause.note } : null} />
            ) : null}
            {writer ? (
              <details className="mt-3" open={!workup.outcome}>
                <summary className="cursor-pointer text-sm font-medium text-teal-800">{workup.outcome ? "Update the outcome" : "Report the outcome"}</summary>
                <div className="mt-3">
                  <OutcomeForm
                    workupId={workup.id} productKey={prediction?.productKey ?? null}
                    steps={operations.map((op) => stepWords(op, library).title)}
                    components={workup.components.map((c) => ({ key: c.key, name: c.name }))}
                    defaults={workup.outcome ? { isolatedMassMg: workup.outcome.isolatedMassMg, purityPct: workup.outcome.purityPct, purityMethod: workup.outcome.purityMethod, notes: workup.outcome.notes } : null}
                  />
                </div>
              </details>
            ) : null}
          </Card>
          <Card title="History">
            <ol className="space-y-1 text-sm">
              {versions.slice(0, 5).map((v) => (
                <li key={v.version}>
                  <span className="font-medium">Version {v.version}</span>
                  <span className="text-stone-600"> · {v.editedBy?.name ?? "unknown"} · {formatDateTime(v.createdAt)}</span>
                  {v.productRecovery !== null ? <span className="text-stone-500"> · predicted {formatNumber(v.productRecovery * 100, 0)} %</span> : null}
                </li>
              ))}
            </ol>
            {versions.length === 0 ? <p className="text-sm text-stone-500">No saved versions (this record was written outside the editor).</p> : null}
            {versions.length > 1 ? <Link href={`/workups/${workup.id}/history`} className="mt-2 inline-block text-sm text-teal-800 underline">Compare versions</Link> : null}
          </Card>
        </div>
        <div className="space-y-6 lg:col-span-2">
          <Card title="Prediction">
            {stored && prediction ? (
              <>
                <p className="mb-3 text-xs text-stone-500">
                  Engine {stored.engineVersion}, computed for version {stored.workupVersion} on {formatDateTime(stored.createdAt)}
                  {stored.result.uncertainty ? `; interval from ${stored.result.uncertainty.draws} Monte Carlo draws (seed ${stored.result.uncertainty.seed})` : ""}.
                </p>
                {workup.intervalState !== "ready" ? (
                  <p className="mb-3 rounded-md border border-stone-200 bg-stone-50 px-3 py-2 text-sm text-stone-700" role="status" data-testid="interval-state">
                    {intervalPending
                      ? "The Monte Carlo interval of this version is being computed; this page updates when it is ready."
                      : `The Monte Carlo interval of this version could not be computed${writer ? "; saving the workup again tries once more" : ""}.`}
                    {intervalPending ? <RefreshWhileIntervalPending /> : null}
                  </p>
                ) : null}
                <PredictionOverview
                  prediction={prediction} intervals={stored.result.uncertainty?.components ?? null}
                  combinedAt={combineSteps(operations as { type?: unknown; streams?: unknown }[])}
                  intervalNote={intervalNote} reported={analysis?.reported?.recovery ?? null}
                />
                <div className="mt-4 border-t border-stone-200 pt-3">
                  <h3 className="mb-2 text-sm font-semibold text-stone-800">Partition coefficients used</h3>
                  {partitionSources && partitionSources.length > 0
                    ? <PartitionProvenance sources={partitionSources} names={partitionNames} />
                    : <p className="text-sm text-stone-500">{partitionSources ? "No water-immiscible organic solvent in this workup." : "Not recorded with this prediction (it predates source tracking)."}</p>}
                </div>
              </>
            ) : (
              <p className="text-sm text-stone-600">No stored prediction for this record. It may predate the engine or not fit today&apos;s schema; {writer ? "open the editor, fix what it marks, and save." : "a member can fix it in the editor."}</p>
            )}
          </Card>
          <Card title="Components"><ComponentsView spec={workup.spec} links={links} /></Card>
          <Card title="Starting mixture"><MixtureView spec={workup.spec} library={library} /></Card>
          <Card title="Steps"><StepsView spec={workup.spec} prediction={prediction} library={library} /></Card>
          <Card title="Attachments">
            <Attachments workupId={workup.id} initial={attachments} writer={writer} hasOutcome={workup.outcome !== null} />
          </Card>
          <Card title="Procedure text">
            <ProcedureText paragraph={renderProcedure(stepsOf(operations))} printHref={`/workups/${workup.id}/procedure`} />
          </Card>
        </div>
      </div>
    </>
  );
}
