import { requirePageMember } from "@/lib/authz/page";
import { getDb } from "@/lib/db/client";
import { ValidationError } from "@/lib/errors";
import { searchSchema, SEARCH_MODES, type SearchMode } from "@/lib/compounds/schemas";
import { compoundSearch, type SearchResult } from "@/lib/compounds/search-service";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/page-header";
import { SearchForm } from "./_components/search-form";
import { SearchResults } from "./_components/search-results";

export const metadata = { title: "Search compounds" };

type Params = Record<string, string | undefined>;

export default async function SearchPage({ searchParams }: { searchParams: Promise<Params> }) {
  const member = await requirePageMember("data:read", { returnTo: "/search" });
  const params = await searchParams;
  const mode: SearchMode = SEARCH_MODES.find((m) => m === params["mode"]) ?? "similarity";
  let result: SearchResult | null = null;
  let problem: { message: string; fields: Record<string, string[]> } | null = null;
  if (params["query"]?.trim()) {
    const parsed = searchSchema.safeParse({ ...params, mode });
    if (!parsed.success) {
      const error = ValidationError.fromZod(parsed.error);
      problem = { message: error.message, fields: error.fieldErrors };
    } else {
      try {
        result = await compoundSearch().search(await getDb(), member.group.id, parsed.data);
      } catch (error) {
        if (!(error instanceof ValidationError)) throw error;
        problem = { message: error.message, fields: error.fieldErrors };
      }
    }
  }
  return (
    <>
      <PageHeader
        title="Search compounds"
        description={`Find ${member.group.name}'s compounds by similarity, by a substructure, or by name, synonym or tag, and see how the workups that used them went.`}
      />
      <SearchForm mode={mode} params={params} errors={problem?.fields} />
      <div className="mt-6">
        {problem && !problem.fields["query"] ? <Notice tone="error" title={problem.message} /> : null}
        {result ? <SearchResults result={result} query={params["query"] ?? ""} queryType={params["queryType"]} /> : null}
      </div>
    </>
  );
}
