import { Badge } from "@/components/ui/badge";
import { formatNumber } from "@/components/ui/format";
import { Card } from "@/components/ui/page-header";
import type { CompoundDetail } from "@/lib/compounds/queries";
import type { StoredPKa } from "@/lib/compounds/schemas";
import { Depiction } from "./depiction";
import { PKaEditor } from "./pka-editor";

const MAX_SITES = 12;

function ProvenanceBadge({ entry }: { entry: StoredPKa }) {
  if (entry.provenance === "estimated") return <Badge tone="neutral">estimated from structure</Badge>;
  if (entry.provenance === "group") return <Badge tone="accent">group value</Badge>;
  return <Badge tone="good">{entry.provenance}</Badge>;
}

/** Ionizable sites with their pKa: estimates from the site class, or measured and literature values that replace them. */
export function SitesCard({ compound, editable, warnings = [] }: { compound: CompoundDetail; editable: boolean; warnings?: string[] }) {
  const sites = compound.pKas;
  return (
    <Card title={`Ionizable sites (${sites.length})`}>
      <p className="mb-3 text-sm text-stone-600">
        Estimated sites carry their class&apos;s default pKa with a wide uncertainty; replace them with a measured or literature value when there is one.
        For a base the value is the pKa of its conjugate acid (BH⁺).
      </p>
      {warnings.length > 0 ? (
        <ul className="mb-3 space-y-1 rounded border border-amber-300 bg-amber-50 px-3 py-2 text-sm text-amber-900" data-testid="site-warnings">
          {warnings.map((w) => <li key={w}>{w}</li>)}
        </ul>
      ) : null}
      {sites.length === 0 ? (
        <p className="text-sm text-stone-500" data-testid="no-sites">No ionizable site found: the compound is treated as neutral at every pH.</p>
      ) : (
        <div className="overflow-x-auto">
          <table className="min-w-full text-sm" data-testid="sites">
            <caption className="sr-only">Ionizable sites of {compound.name}</caption>
            <thead className="text-left text-xs font-semibold uppercase tracking-wide text-stone-500">
              <tr>
                <th scope="col" className="px-3 py-2"><span className="sr-only">Site drawing</span></th>
                <th scope="col" className="px-3 py-2">Site</th>
                <th scope="col" className="px-3 py-2">Kind</th>
                <th scope="col" className="px-3 py-2 text-right">pKa</th>
                <th scope="col" className="px-3 py-2">Value</th>
                <th scope="col" className="px-3 py-2">Source</th>
                {editable ? <th scope="col" className="px-3 py-2"><span className="sr-only">Edit</span></th> : null}
              </tr>
            </thead>
            <tbody className="divide-y divide-stone-100">
              {sites.map((entry, index) => (
                <tr key={`${index}-${entry.site}`} className="align-top">
                  <td className="px-3 py-1.5">{entry.atoms?.length ? <Depiction compoundId={compound.id} name={`${compound.name}, ${entry.site}`} width={110} height={80} highlight={entry.atoms} /> : null}</td>
                  <td className="px-3 py-2 text-stone-800">{entry.site || "—"}</td>
                  <td className="px-3 py-2 text-stone-600">{entry.kind}</td>
                  <td className="px-3 py-2 text-right tabular-nums font-medium">
                    {formatNumber(entry.value, 2)}{entry.se !== undefined ? <span className="font-normal text-stone-500"> ± {formatNumber(entry.se, 1)}</span> : null}
                  </td>
                  <td className="px-3 py-2">
                    <ProvenanceBadge entry={entry} />
                    {entry.estimate ? <p className="mt-1 text-xs text-stone-500">estimate was {formatNumber(entry.estimate.value, 2)}</p> : null}
                  </td>
                  <td className="max-w-sm px-3 py-2 text-xs text-stone-600">{entry.source || "—"}</td>
                  {editable ? <td className="px-3 py-2"><PKaEditor compoundId={compound.id} index={index} entry={entry} /></td> : null}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {editable && sites.length < MAX_SITES ? <div className="mt-3"><PKaEditor compoundId={compound.id} index={sites.length} /></div> : null}
    </Card>
  );
}
