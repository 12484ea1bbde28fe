import Link from "next/link";
import { redirect } from "next/navigation";
import { requirePageMember } from "@/lib/authz/page";
import { EmptyState, PageHeader } from "@/components/ui/page-header";
import { buttonClass } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { formatDate } from "@/components/ui/format";
import { getDb } from "@/lib/db/client";
import { JobProgressPanel } from "@/lib/jobs/components/job-progress";
import { jobsStatus } from "@/lib/jobs/status";
import { partitionSummary } from "@/lib/partition/queries";

export const metadata = { title: "Partition data" };

function value(row: Awaited<ReturnType<typeof partitionSummary>>[number]): string {
  const p = row.pooled;
  if (p.estimate !== null && p.se !== null) return `${p.estimate.toFixed(2)} ± ${p.se.toFixed(2)}`;
  return [p.lowerBound !== null ? `≥ ${p.lowerBound.toFixed(2)}` : "", p.upperBound !== null ? `≤ ${p.upperBound.toFixed(2)}` : ""].filter(Boolean).join(", ") || "—";
}

export default async function PartitionPage({ searchParams }: { searchParams: Promise<{ compound?: string }> }) {
  const member = await requirePageMember("data:read", { returnTo: "/partition" });
  const { compound } = await searchParams;
  if (compound && /^[A-Za-z0-9_-]{1,64}$/.test(compound)) redirect(`/partition/${compound}`);
  const db = await getDb();
  const [rows, compounds, jobs] = await Promise.all([
    partitionSummary(db, member.group.id),
    db.compound.findMany({ where: { groupId: member.group.id }, select: { id: true, name: true }, orderBy: { name: "asc" } }),
    jobsStatus(db, member.group.id),
  ]);
  return (
    <>
      <PageHeader title="Partition data"
        description="The group's own partition coefficients: measured in dedicated experiments or learned from workups with reported outcomes, pooled per compound and solvent system. Predictions use them in place of the structure estimate." />
      <div className="mb-6"><JobProgressPanel initial={jobs} /></div>
      <form action="/partition" method="get" className="mb-6 flex flex-wrap items-end gap-3" aria-label="Open a compound's partition data">
        <div className="min-w-64 space-y-1">
          <label htmlFor="compound" className="block text-sm font-medium text-stone-800">Compound</label>
          <select id="compound" name="compound" className={inputClass} required defaultValue="">
            <option value="" disabled>Choose a compound…</option>
            {compounds.map((c) => <option key={c.id} value={c.id}>{c.name}</option>)}
          </select>
        </div>
        <button type="submit" className={buttonClass("secondary")}>Open</button>
      </form>
      {rows.length === 0 ? (
        <EmptyState title="No partition data yet.">Open a compound to add a shake-flask or layer-assay measurement; values inferred from reported workups appear here too.</EmptyState>
      ) : (
        <div className="overflow-x-auto rounded-lg border border-stone-200 bg-white shadow-xs">
          <table className="min-w-full divide-y divide-stone-200 text-sm">
            <caption className="sr-only">Pooled partition values of {member.group.name}</caption>
            <thead className="bg-stone-50 text-left text-xs font-semibold uppercase tracking-wide text-stone-500">
              <tr>
                <th scope="col" className="px-4 py-2.5">Compound</th>
                <th scope="col" className="px-4 py-2.5">Solvent / water</th>
                <th scope="col" className="px-4 py-2.5 text-right">Group log K</th>
                <th scope="col" className="px-4 py-2.5 text-right">n</th>
                <th scope="col" className="px-4 py-2.5">Notes</th>
                <th scope="col" className="px-4 py-2.5">Last recorded</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-stone-100">
              {rows.map((r) => (
                <tr key={`${r.compoundId}-${r.solventKey}`} className="hover:bg-stone-50">
                  <td className="px-4 py-2.5"><Link href={`/partition/${r.compoundId}`} className="font-medium text-teal-800 hover:underline">{r.compoundName}</Link></td>
                  <td className="px-4 py-2.5 text-stone-700">{r.solventName}</td>
                  <td className="px-4 py-2.5 text-right tabular-nums">{value(r)}</td>
                  <td className="px-4 py-2.5 text-right tabular-nums">{r.pooled.n}</td>
                  <td className="px-4 py-2.5 text-xs text-stone-500">
                    {[r.pooled.outliers.length ? `${r.pooled.outliers.length} outlier${r.pooled.outliers.length === 1 ? "" : "s"}` : "", r.excluded ? `${r.excluded} excluded` : "", r.pooled.boundConflict ?? ""].filter(Boolean).join("; ") || "—"}
                  </td>
                  <td className="whitespace-nowrap px-4 py-2.5 text-stone-600">{formatDate(r.lastRecorded)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </>
  );
}
