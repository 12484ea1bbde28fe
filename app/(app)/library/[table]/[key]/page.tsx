import Link from "next/link";
import { notFound } from "next/navigation";
import { can } from "@/lib/authz";
import { pageFailure, requirePageMember } from "@/lib/authz/page";
import { Card, PageHeader } from "@/components/ui/page-header";
import { buttonClass } from "@/components/ui/button";
import { getDb } from "@/lib/db/client";
import { SOURCES } from "@/lib/chem/data/sources";
import { REAGENT_FIELDS, SOLVENT_FIELDS, toForm } from "@/lib/library/form-model";
import { reagentEntry, solventEntry } from "@/lib/library/service";
import { EntryForm } from "../../_components/entry-form";

export const metadata = { title: "Library entry" };

/** One entry: its values and sources for everyone; the editor for a lead. */
export default async function LibraryEntryPage({ params }: { params: Promise<{ table: string; key: string }> }) {
  const { table, key: rawKey } = await params;
  if (table !== "solvents" && table !== "reagents") notFound();
  const key = decodeURIComponent(rawKey);
  const member = await requirePageMember("data:read", { returnTo: `/library/${table}/${rawKey}` });
  const db = await getDb();
  const entry = await (table === "solvents" ? solventEntry(db, member.group.id, key) : reagentEntry(db, member.group.id, key)).catch(pageFailure);
  const fields = table === "solvents" ? SOLVENT_FIELDS : REAGENT_FIELDS;
  const form = toForm(fields, entry.props);
  const lead = can(member, "library:manage");
  const sources = [...new Set(Object.entries(form).filter(([k, v]) => k.endsWith(".source") && v).map(([, v]) => v))];
  return (
    <>
      <PageHeader title={entry.props.name} description={entry.origin === "shipped" ? "Shipped with Layerwise." : entry.origin === "changed" ? "The group's own values replace the shipped ones." : "Added by the group."}
        actions={<Link href="/library" className={buttonClass("ghost")}>Back to the library</Link>} />
      {lead ? (
        <EntryForm table={table} initial={form} isNew={false} removable={entry.origin === "changed" ? "revert" : entry.origin === "added" ? "delete" : null} />
      ) : (
        <Card title="Values">
          <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-sm">
            {fields.map((f) => {
              const v = f.kind === "sourced" ? form[`${f.path}.value`] : form[f.path];
              return v ? <div key={f.path} className="contents"><dt className="text-stone-500">{f.label}</dt><dd>{v}{f.kind === "sourced" && form[`${f.path}.source`] ? <span className="ml-2 text-xs text-stone-500">{form[`${f.path}.source`]}</span> : null}</dd></div> : null;
            })}
          </dl>
        </Card>
      )}
      {sources.length > 0 ? (
        <Card title="Sources" className="mt-6">
          <ul className="space-y-1 text-xs text-stone-600">{sources.map((s) => <li key={s}><span className="font-mono">{s}</span>{SOURCES[s] ? `: ${SOURCES[s]}` : ""}</li>)}</ul>
        </Card>
      ) : null}
    </>
  );
}
