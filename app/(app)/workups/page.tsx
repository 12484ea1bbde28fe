import Link from "next/link";
import { can } from "@/lib/authz";
import { requirePageMember } from "@/lib/authz/page";
import { maySeePerson } from "@/lib/authz/people";
import { EmptyState, PageHeader } from "@/components/ui/page-header";
import { buttonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { getDb } from "@/lib/db/client";
import { ValidationError } from "@/lib/errors";
import { resolveLibrary } from "@/lib/chem/library";
import { groupLibrary } from "@/lib/workups/library";
import { listWorkups, type WorkupListPage } from "@/lib/workups/queries";
import { FILTER_KEYS, FilterForm, filterQuery, type FilterValues } from "@/components/workup/list/filter-form";
import { FlaggedStrip } from "@/components/workup/list/flagged-strip";
import { WorkupTable } from "@/components/workup/list/workup-table";
import { compoundChoices, flaggedWorkups } from "./_lib/list-data";
import { groupMembers } from "./_lib/editor-data";

export const metadata = { title: "Workups" };

type Search = FilterValues & { cursor?: string };

function firstValues(raw: Record<string, string | string[] | undefined>): Search {
  const pick = (k: string) => {
    const v = raw[k];
    return (Array.isArray(v) ? v[0] : v)?.trim() || undefined;
  };
  return Object.fromEntries([...FILTER_KEYS, "cursor"].map((k) => [k, pick(k)]).filter(([, v]) => v !== undefined)) as Search;
}

export default async function WorkupsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const values = firstValues(await searchParams);
  const member = await requirePageMember("data:read", { returnTo: "/workups", person: values.chemistId });
  const { cursor, ...filter } = values;
  const db = await getDb();
  let page: WorkupListPage = { rows: [], next: null };
  let errors: Record<string, string[]> = {};
  try {
    page = await listWorkups(db, member.group.id, values);
  } catch (error) {
    if (!(error instanceof ValidationError)) throw error;
    errors = error.fieldErrors;
  }
  const [flagged, compounds, members, overrides] = await Promise.all([
    flaggedWorkups(db, member.group.id), compoundChoices(db, member.group.id), groupMembers(member), groupLibrary(db, member.group.id),
  ]);
  const library = resolveLibrary(overrides);
  const solvents = Object.values(library.solvents).map((s) => ({ value: s.key, label: s.name })).sort((a, b) => a.label.localeCompare(b.label, "en"));
  const filtered = FILTER_KEYS.some((k) => filter[k]);
  return (
    <>
      <PageHeader
        title="Workups"
        description={`Every workup recorded in ${member.group.name}, newest first.`}
        actions={
          <>
            <Link href="/library" className={buttonClass("ghost")}>Solvent and wash library</Link>
            {can(member, "data:write") ? <Link href="/workups/new" className={buttonClass("primary")}>New workup</Link> : null}
          </>
        }
      />
      {!filtered && !cursor ? <FlaggedStrip items={flagged.items} total={flagged.total} href="/workups?flagged=true" /> : null}
      <FilterForm values={filter} errors={errors}
        compounds={compounds.map((c) => ({ value: c.id, label: c.name }))} solvents={solvents} chemists={members.filter((m) => maySeePerson(member, m.id)).map((m) => ({ value: m.id, label: m.name }))} />
      {Object.keys(errors).length > 0 ? <div className="mb-4"><Notice tone="error" title="This filter cannot be used">{Object.values(errors).flat().join(" ")}</Notice></div> : null}
      {page.rows.length === 0 ? (
        <EmptyState title={cursor ? "No more workups." : filtered ? "No workup matches this filter." : "No workups recorded yet."}>
          {cursor || filtered ? <Link href="/workups" className="text-teal-700 underline">Back to all workups, newest first</Link> : null}
        </EmptyState>
      ) : (
        <WorkupTable rows={page.rows} caption={`Workups of ${member.group.name}`} />
      )}
      <nav aria-label="Pages" className="mt-4 flex flex-wrap items-center justify-between gap-3 text-sm">
        {cursor ? <Link href={`/workups${filterQuery(filter)}`} className={buttonClass("ghost")}>← Newest</Link> : <span />}
        <a href={`/api/v1/workups.csv${filterQuery(filter)}`} className="text-teal-800 underline" download>Export this list as CSV</a>
        {page.next ? <Link href={`/workups${filterQuery(filter, { cursor: page.next })}`} className={buttonClass("secondary")}>Older →</Link> : <span />}
      </nav>
    </>
  );
}
