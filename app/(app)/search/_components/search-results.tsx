import Link from "next/link";
import { Badge } from "@/components/ui/badge";
import { formatNumber } from "@/components/ui/format";
import { EmptyState } from "@/components/ui/page-header";
import { type SearchResult } from "@/lib/compounds/search-service";
import { Depiction } from "@/app/(app)/compounds/_components/depiction";
import { Formula } from "@/app/(app)/compounds/_components/formula";
import { WorkupTable } from "@/app/(app)/compounds/_components/workup-table";

function QueryDrawing({ smiles }: { smiles: string }) {
  const src = `/api/depict/structure?${new URLSearchParams({ smiles, w: "160", h: "120" }).toString()}`;
  // eslint-disable-next-line @next/next/no-img-element -- a server-drawn SVG; next/image would only proxy it
  return <img src={src} alt="The query structure" width={160} height={120} className="rounded border border-stone-200 bg-white" />;
}

export function SearchResults({ result, query, queryType }: { result: SearchResult; query: string; queryType?: string }) {
  const drawable = result.mode === "similarity" || (result.mode === "substructure" && queryType !== "smarts");
  const count = `${result.hits.length}${result.more ? "+" : ""} hit${result.hits.length === 1 && !result.more ? "" : "s"}`;
  return (
    <section aria-labelledby="results-heading" className="space-y-4">
      <div className="flex items-center gap-4">
        {drawable && !query.includes("\n") ? <QueryDrawing smiles={query} /> : null}
        <h2 id="results-heading" className="text-lg font-semibold text-stone-900">{count}</h2>
        {result.more ? <p className="text-sm text-stone-500">Showing the first {result.hits.length}; narrow the query to see the rest.</p> : null}
      </div>
      {result.hits.length === 0 ? (
        <EmptyState title="No compound of the group matches.">
          {result.mode === "similarity" ? "Try a lower similarity threshold." : "Try a smaller fragment or another spelling."}
        </EmptyState>
      ) : (
        <ol className="space-y-3" aria-label="Search hits">
          {result.hits.map((hit) => (
            <li key={hit.id} className="flex flex-col gap-4 rounded-lg border border-stone-200 bg-white p-4 shadow-xs sm:flex-row" data-testid="search-hit">
              <Depiction compoundId={hit.id} name={hit.name} width={150} height={110} />
              <div className="min-w-0 flex-1 space-y-2">
                <div className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
                  <Link href={`/compounds/${hit.id}`} className="text-base font-semibold text-teal-800 hover:underline">{hit.name}</Link>
                  {hit.similarity !== undefined ? (
                    <span className="text-sm tabular-nums text-stone-700" data-testid="similarity">similarity {formatNumber(hit.similarity, 2)}</span>
                  ) : null}
                  <span className="text-sm text-stone-500"><Formula formula={hit.formula} /></span>
                  {hit.tags.map((t) => <Badge key={t}>{t}</Badge>)}
                </div>
                {hit.synonyms.length > 0 ? <p className="text-xs text-stone-500">Also: {hit.synonyms.join(", ")}</p> : null}
                <WorkupTable compact workups={hit.workups} caption={`Workups that used ${hit.name}`} />
                {hit.workupCount > hit.workups.length ? (
                  <Link href={`/compounds/${hit.id}`} className="text-xs text-teal-700 underline">All {hit.workupCount} workups</Link>
                ) : null}
              </div>
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
