import Link from "next/link";
import { can } from "@/lib/authz";
import { pageFailure, requirePageMember } from "@/lib/authz/page";
import { Card, PageHeader } from "@/components/ui/page-header";
import { buttonClass } from "@/components/ui/button";
import { getDb } from "@/lib/db/client";
import { JobProgressPanel } from "@/lib/jobs/components/job-progress";
import { jobsStatus } from "@/lib/jobs/status";
import { MeasurementForm } from "@/lib/partition/components/measurement-form";
import { compoundPartition } from "@/lib/partition/queries";
import { ObservationsTable } from "../_components/observations-table";
import { SolventHistory } from "../_components/solvent-history";

export const metadata = { title: "Partition data" };

export default async function CompoundPartitionPage({ params }: { params: Promise<{ compoundId: string }> }) {
  const { compoundId } = await params;
  const member = await requirePageMember("data:read", { returnTo: `/partition/${compoundId}` });
  const db = await getDb();
  const data = await compoundPartition(db, member.group.id, compoundId).catch(pageFailure);
  const jobs = await jobsStatus(db, member.group.id);
  return (
    <>
      <PageHeader
        title={`Partition data: ${data.compound.name}`}
        description="log K of the neutral form between each organic solvent and water (organic over aqueous). Measured values count fully; values inferred from workups count half and only where the record allows."
        actions={
          <>
            <Link href={`/compounds/${data.compound.id}`} className={buttonClass("ghost")}>Compound</Link>
            <a href={`/api/v1/partition/${data.compound.id}?format=csv`} className={buttonClass("secondary")} download>Export CSV</a>
          </>
        }
      />
      <div className="mb-6"><JobProgressPanel key={jobs.active.map((j) => j.id).join(",")} initial={jobs} /></div>
      <div className="space-y-6">
        {data.solvents.length === 0 ? (
          <p className="text-sm text-stone-600">No observations yet: predictions for {data.compound.name} use the estimate from its log P.</p>
        ) : (
          data.solvents.map((s) => <SolventHistory key={s.solventKey} compoundName={data.compound.name} solvent={s} />)
        )}
        <Card title={`Observations (${data.observations.length})`}>
          <ObservationsTable observations={data.observations} compoundId={data.compound.id} canExclude={can(member, "library:manage")} />
        </Card>
        {can(member, "data:write") ? (
          <Card title="Add a measurement">
            <MeasurementForm compoundId={data.compound.id} solvents={data.solventChoices} />
          </Card>
        ) : null}
      </div>
    </>
  );
}
