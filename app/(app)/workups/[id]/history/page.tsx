import Link from "next/link";
import { pageFailure, requirePageMember } from "@/lib/authz/page";
import { Card, PageHeader } from "@/components/ui/page-header";
import { buttonClass } from "@/components/ui/button";
import { formatDateTime, formatNumber } from "@/components/ui/format";
import { Notice } from "@/components/ui/notice";
import { getDb } from "@/lib/db/client";
import { getWorkupDetail } from "@/lib/workups/queries";
import { diffVersions, listVersions } from "@/lib/workups/history";
import { versionPairSchema } from "@/lib/workups/schemas";
import { VersionDiffView } from "@/components/workup/detail/version-diff";
import { groupMembers } from "../../_lib/editor-data";

export const metadata = { title: "Workup history" };

/** Every saved version (who, when, predicted recovery) and what changed between any two. */
export default async function WorkupHistoryPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<{ from?: string; to?: string }> }) {
  const { id } = await params;
  const query = await searchParams;
  const member = await requirePageMember("data:read", { returnTo: `/workups/${id}/history` });
  const db = await getDb();
  const workup = await getWorkupDetail(db, member.group.id, id).catch(pageFailure);
  const [versions, members] = await Promise.all([listVersions(db, member.group.id, id), groupMembers(member)]);
  const latest = versions[0]?.version ?? workup.version;
  const pair = versionPairSchema.safeParse({ from: query.from ?? Math.max(1, latest - 1), to: query.to ?? latest });
  const known = new Set(versions.map((v) => v.version));
  const usable = pair.success && known.has(pair.data.from) && known.has(pair.data.to);
  const diff = usable ? await diffVersions(db, member.group.id, id, pair.data.from, pair.data.to) : null;
  const names = Object.fromEntries(members.map((m) => [m.id, m.name]));
  return (
    <>
      <PageHeader title={`History: ${workup.header.title}`} description={`${versions.length} saved version${versions.length === 1 ? "" : "s"}; every save keeps the one before.`}
        actions={<Link href={`/workups/${id}`} className={buttonClass("ghost")}>Back to the record</Link>} />
      <div className="grid gap-6 lg:grid-cols-5">
        <Card title="Versions" className="lg:col-span-2">
          <table className="w-full text-sm">
            <thead className="text-left text-xs text-stone-500"><tr><th scope="col" className="font-normal">Version</th><th scope="col" className="font-normal">Saved by</th><th scope="col" className="font-normal">When</th><th scope="col" className="text-right font-normal">Predicted</th></tr></thead>
            <tbody className="divide-y divide-stone-100">
              {versions.map((v) => (
                <tr key={v.version}>
                  <td className="py-1.5 font-medium">{v.version}</td>
                  <td>{v.editedBy?.name ?? "unknown"}</td>
                  <td className="text-xs text-stone-600">{formatDateTime(v.createdAt)}</td>
                  <td className="text-right tabular-nums">{v.productRecovery !== null ? `${formatNumber(v.productRecovery * 100, 0)} %` : "—"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </Card>
        <Card title="What changed" className="lg:col-span-3">
          <form method="get" className="mb-4 flex flex-wrap items-end gap-2 text-sm">
            {(["from", "to"] as const).map((k) => (
              <div key={k}>
                <label htmlFor={`v-${k}`} className="block text-xs font-medium text-stone-700">{k === "from" ? "From version" : "To version"}</label>
                <select id={`v-${k}`} name={k} defaultValue={pair.success ? pair.data[k] : undefined} className="mt-0.5 rounded-md border border-stone-300 px-2 py-1.5">
                  {versions.map((v) => <option key={v.version} value={v.version}>{v.version}</option>)}
                </select>
              </div>
            ))}
            <button type="submit" className={buttonClass("secondary")}>Compare</button>
          </form>
          {!usable && versions.length > 1 ? <Notice tone="warning">Choose two saved versions to compare.</Notice> : null}
          {versions.length <= 1 ? <p className="text-sm text-stone-600">Only one version so far.</p> : null}
          {diff && pair.success ? (
            <>
              <p className="mb-2 text-sm text-stone-600">From version {Math.min(pair.data.from, pair.data.to)} to version {Math.max(pair.data.from, pair.data.to)}:</p>
              <VersionDiffView diff={diff} names={names} />
            </>
          ) : null}
        </Card>
      </div>
    </>
  );
}
