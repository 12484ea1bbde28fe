import Link from "next/link";
import { can } from "@/lib/authz";
import { requirePageMember } from "@/lib/authz/page";
import { EmptyState, PageHeader } from "@/components/ui/page-header";
import { buttonClass } from "@/components/ui/button";
import { formatDate, formatNumber } from "@/components/ui/format";
import { Badge } from "@/components/ui/badge";
import { StatusBadge } from "./_components/status-badge";
import { decodeCursor, listWorkups } from "./_lib/queries";

export const metadata = { title: "Workups" };

export default async function WorkupsPage({ searchParams }: { searchParams: Promise<{ after?: string }> }) {
  const member = await requirePageMember("data:read", { returnTo: "/workups" });
  const { after } = await searchParams;
  const { rows, next, chemists } = await listWorkups(member, decodeCursor(after));
  return (
    <>
      <PageHeader
        title="Workups"
        description={`Every workup recorded in ${member.group.name}, newest first.`}
        actions={can(member, "data:write") ? <span className="text-sm text-stone-500">The workup editor is on its way.</span> : null}
      />
      {rows.length === 0 ? (
        <EmptyState title={after ? "No more workups." : "No workups recorded yet."}>
          {after ? <Link href="/workups" className="text-teal-700 underline">Back to the newest</Link> : null}
        </EmptyState>
      ) : (
        <div className="overflow-x-auto rounded-lg border border-stone-200 bg-white shadow-xs">
          <table className="min-w-full divide-y divide-stone-200 text-sm">
            <caption className="sr-only">Workups of {member.group.name}</caption>
            <thead className="bg-stone-50 text-left text-xs font-semibold uppercase tracking-wide text-stone-500">
              <tr>
                <th scope="col" className="px-4 py-2.5">Title</th>
                <th scope="col" className="px-4 py-2.5">Date</th>
                <th scope="col" className="px-4 py-2.5">Chemist</th>
                <th scope="col" className="px-4 py-2.5">Notebook</th>
                <th scope="col" className="px-4 py-2.5">Outcome</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-stone-100">
              {rows.map((w) => (
                <tr key={w.id} className="hover:bg-stone-50">
                  <td className="px-4 py-2.5">
                    <Link href={`/workups/${w.id}`} className="font-medium text-teal-800 hover:underline focus-visible:outline-2 focus-visible:outline-teal-600">
                      {w.title}
                    </Link>
                  </td>
                  <td className="whitespace-nowrap px-4 py-2.5 text-stone-600">{formatDate(w.performedOn)}</td>
                  <td className="px-4 py-2.5 text-stone-600">{(w.chemistId && chemists.get(w.chemistId)) ?? "—"}</td>
                  <td className="px-4 py-2.5 font-mono text-xs text-stone-600">{w.notebookRef || "—"}</td>
                  <td className="whitespace-nowrap px-4 py-2.5">
                    <StatusBadge status={w.status} />
                    {w.flagged ? <span className="ml-2"><Badge tone="low">Flagged</Badge></span> : null}
                    {w.deviationPct !== null ? <span className="ml-2 text-xs text-stone-500">{w.deviationPct > 0 ? "+" : ""}{formatNumber(w.deviationPct, 1)} %</span> : null}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      <nav aria-label="Pages" className="mt-4 flex justify-between text-sm">
        {after ? <Link href="/workups" className={buttonClass("ghost")}>Newest</Link> : <span />}
        {next ? <Link href={`/workups?after=${encodeURIComponent(next)}`} className={buttonClass("secondary")}>Older workups</Link> : null}
      </nav>
    </>
  );
}
