import Link from "next/link";
import { can } from "@/lib/authz";
import { pageFailure, requirePageMember } from "@/lib/authz/page";
import { Card, PageHeader } from "@/components/ui/page-header";
import { buttonClass } from "@/components/ui/button";
import { formatDate, formatDateTime, formatNumber } from "@/components/ui/format";
import { StatusBadge } from "../_components/status-badge";
import { ComponentsList, MixtureList, OperationsList } from "../_components/spec-view";
import { getWorkup } from "../_lib/queries";

export const metadata = { title: "Workup" };

function amount(mmol: number | null): string {
  return mmol === null ? "—" : `${formatNumber(mmol)} mmol`;
}

export default async function WorkupPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const member = await requirePageMember("data:read", { returnTo: `/workups/${id}` });
  const workup = await getWorkup(member, id).catch(pageFailure);
  const prediction = workup.predictions[0];
  const header: [string, string][] = [
    ["Date", formatDate(workup.performedOn)],
    ["Chemist", workup.chemistName ?? "—"],
    ["Notebook reference", workup.notebookRef || "—"],
    ["Reaction scale", amount(workup.scaleMmol)],
    ["Expected product", amount(workup.expectedProductMmol)],
    ["Product assayed before workup", amount(workup.assayedProductMmol)],
    ["Version", `${workup.version} · last changed ${formatDateTime(workup.updatedAt)}`],
  ];
  return (
    <>
      <PageHeader
        title={workup.title}
        description={<StatusBadge status={workup.status} />}
        actions={
          <>
            <Link href="/workups" className={buttonClass("ghost")}>All workups</Link>
            {can(member, "data:write") ? <Link href={`/workups/${workup.id}/edit`} className={buttonClass("primary")}>Edit</Link> : null}
          </>
        }
      />
      <div className="grid gap-6 lg:grid-cols-3">
        <Card title="Record" className="lg:col-span-1">
          <dl className="space-y-2 text-sm">
            {header.map(([k, v]) => (
              <div key={k}>
                <dt className="text-stone-500">{k}</dt>
                <dd className="text-stone-900">{v}</dd>
              </div>
            ))}
          </dl>
        </Card>
        <div className="space-y-6 lg:col-span-2">
          <Card title="Prediction and outcome">
            {prediction?.productRecovery != null ? (
              <p className="text-sm text-stone-700">
                Predicted product recovery {formatNumber(prediction.productRecovery * 100, 0)} %
                {prediction.recoveryLow != null && prediction.recoveryHigh != null
                  ? ` (likely between ${formatNumber(prediction.recoveryLow * 100, 0)} and ${formatNumber(prediction.recoveryHigh * 100, 0)} %)`
                  : ""}
                , engine {prediction.engineVersion}, for version {prediction.workupVersion}.
              </p>
            ) : (
              <p className="text-sm text-stone-500">No stored prediction.</p>
            )}
            {workup.outcome ? (
              <p className="mt-2 text-sm text-stone-700">
                Isolated {formatNumber(workup.outcome.isolatedMassMg, 1)} mg
                {workup.outcome.purityPct != null ? `, ${formatNumber(workup.outcome.purityPct, 1)} % pure (${workup.outcome.purityMethod.replace("_", " ")})` : ""}
                {workup.outcome.recoveryPct != null ? `, recovery ${formatNumber(workup.outcome.recoveryPct, 1)} %` : ""}.
              </p>
            ) : (
              <p className="mt-2 text-sm text-stone-500">No outcome reported yet.</p>
            )}
          </Card>
          <Card title="Components">
            <ComponentsList spec={workup.spec} />
          </Card>
          <Card title="Starting mixture">
            <MixtureList spec={workup.spec} />
          </Card>
          <Card title="Steps">
            <OperationsList spec={workup.spec} />
          </Card>
        </div>
      </div>
    </>
  );
}
