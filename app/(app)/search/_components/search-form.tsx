import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { Field, FieldErrors, inputClass } from "@/components/ui/field";
import { type SearchMode } from "@/lib/compounds/schemas";

const TABS: { mode: SearchMode; label: string }[] = [
  { mode: "similarity", label: "Similar structures" },
  { mode: "substructure", label: "Substructure" },
  { mode: "text", label: "Name, synonym or tag" },
];

/** A plain GET form: every search has a URL that can be bookmarked and shared within the group. */
export function SearchForm({ mode, params, errors }: { mode: SearchMode; params: Record<string, string | undefined>; errors?: Record<string, string[]> }) {
  return (
    <div className="rounded-lg border border-stone-200 bg-white shadow-xs">
      <nav aria-label="Kind of search" className="flex flex-wrap gap-1 border-b border-stone-200 px-3 pt-3">
        {TABS.map((t) => (
          <Link
            key={t.mode}
            href={`/search?mode=${t.mode}`}
            aria-current={t.mode === mode ? "page" : undefined}
            className={`rounded-t-md px-3 py-2 text-sm font-medium ${t.mode === mode ? "border border-b-white border-stone-200 bg-white text-teal-900 -mb-px" : "text-stone-600 hover:text-stone-900"}`}
          >
            {t.label}
          </Link>
        ))}
      </nav>
      <form method="get" action="/search" className="grid gap-4 p-5 sm:grid-cols-4" role="search">
        <input type="hidden" name="mode" value={mode} />
        <div className="space-y-1 sm:col-span-4">
          <label htmlFor="search-query" className="block text-sm font-medium text-stone-800">
            {mode === "similarity" ? "Structure (SMILES)" : mode === "substructure" ? "Fragment (SMILES or SMARTS)" : "Text"}
          </label>
          <input
            id="search-query" name="query" defaultValue={params["query"] ?? ""} required
            className={`${inputClass} ${mode === "text" ? "" : "font-mono"}`} spellCheck={false}
            placeholder={mode === "similarity" ? "e.g. CCN(CC)CC(=O)Nc1c(C)cccc1C" : mode === "substructure" ? "e.g. c1ccccc1C(=O)N" : "e.g. lidocaine, amine, series B"}
            aria-invalid={errors?.["query"] ? true : undefined} aria-describedby={errors?.["query"] ? "search-query-errors" : undefined}
          />
          <FieldErrors id="search-query-errors" errors={errors?.["query"]} />
        </div>
        {mode === "similarity" ? (
          <>
            <Field label="Lowest similarity (Tanimoto, 0–1)" name="threshold" type="number" step="0.05" min={0} max={1} defaultValue={params["threshold"] ?? "0.3"} errors={errors?.["threshold"]} />
            <Field label="Most hits" name="topK" type="number" min={1} max={200} defaultValue={params["topK"] ?? "20"} errors={errors?.["topK"]} />
          </>
        ) : null}
        {mode === "substructure" ? (
          <fieldset className="space-y-1 text-sm sm:col-span-2">
            <legend className="font-medium text-stone-800">Read the fragment as</legend>
            {(["smiles", "smarts"] as const).map((t) => (
              <label key={t} className="mr-4 inline-flex items-center gap-1.5">
                <input type="radio" name="queryType" value={t} defaultChecked={(params["queryType"] ?? "smiles") === t} />
                {t === "smiles" ? "SMILES (a molecule drawn as a fragment)" : "SMARTS (a pattern)"}
              </label>
            ))}
          </fieldset>
        ) : null}
        <div className="flex items-end sm:col-span-4">
          <button type="submit" className={buttonClass("primary")}>Search</button>
        </div>
      </form>
    </div>
  );
}
