import Link from "next/link";
import { can } from "@/lib/authz";
import { requirePageMember } from "@/lib/authz/page";
import { getDb } from "@/lib/db/client";
import { listCompoundsSchema } from "@/lib/compounds/schemas";
import { listCompounds } from "@/lib/compounds/queries";
import { Badge } from "@/components/ui/badge";
import { buttonClass } from "@/components/ui/button";
import { formatNumber } from "@/components/ui/format";
import { EmptyState, PageHeader } from "@/components/ui/page-header";
import { Depiction } from "./_components/depiction";
import { Formula } from "./_components/formula";

export const metadata = { title: "Compounds" };

export default async function CompoundsPage({ searchParams }: { searchParams: Promise<{ after?: string; tag?: string }> }) {
  const member = await requirePageMember("data:read", { returnTo: "/compounds" });
  const raw = await searchParams;
  const parsed = listCompoundsSchema.safeParse(raw);
  const options = parsed.success ? parsed.data : listCompoundsSchema.parse({});
  const { rows, next } = await listCompounds(await getDb(), member.group.id, options);
  const tagQuery = options.tag ? `&tag=${encodeURIComponent(options.tag)}` : "";
  return (
    <>
      <PageHeader
        title="Compounds"
        description={`The structures registered in ${member.group.name}, with their properties, acid–base sites and the workups that used them.`}
        actions={
          <>
            <Link href="/search" className={buttonClass("secondary")}>Search</Link>
            {can(member, "data:write") ? <Link href="/compounds/new" className={buttonClass("primary")}>Register compounds</Link> : null}
          </>
        }
      />
      {options.tag ? (
        <p className="mb-4 text-sm text-stone-600">
          Tagged <Badge tone="accent">{options.tag}</Badge> · <Link href="/compounds" className="text-teal-700 underline">show all</Link>
        </p>
      ) : null}
      {rows.length === 0 ? (
        <EmptyState title={options.after ? "No more compounds." : "No compounds registered yet."}>
          {can(member, "data:write") && !options.after ? <Link href="/compounds/new" className="text-teal-700 underline">Register the first ones from SMILES or an SD file</Link> : null}
        </EmptyState>
      ) : (
        <div className="overflow-x-auto rounded-lg border border-stone-200 bg-white shadow-xs">
          <table className="min-w-full divide-y divide-stone-200 text-sm">
            <caption className="sr-only">Compounds of {member.group.name}</caption>
            <thead className="bg-stone-50 text-left text-xs font-semibold uppercase tracking-wide text-stone-500">
              <tr>
                <th scope="col" className="px-4 py-2.5"><span className="sr-only">Structure</span></th>
                <th scope="col" className="px-4 py-2.5">Name</th>
                <th scope="col" className="px-4 py-2.5">Formula</th>
                <th scope="col" className="px-4 py-2.5 text-right">M (g/mol)</th>
                <th scope="col" className="px-4 py-2.5 text-right">log P</th>
                <th scope="col" className="px-4 py-2.5">Tags</th>
                <th scope="col" className="px-4 py-2.5 text-right">Workups</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-stone-100">
              {rows.map((c) => (
                <tr key={c.id} className="hover:bg-stone-50">
                  <td className="px-4 py-1.5"><Depiction compoundId={c.id} name={c.name} width={96} height={72} /></td>
                  <td className="px-4 py-2.5">
                    <Link href={`/compounds/${c.id}`} className="font-medium text-teal-800 hover:underline">{c.name}</Link>
                  </td>
                  <td className="px-4 py-2.5 text-stone-700"><Formula formula={c.formula} /></td>
                  <td className="px-4 py-2.5 text-right tabular-nums text-stone-700">{formatNumber(c.molarMass, 2)}</td>
                  <td className="px-4 py-2.5 text-right tabular-nums text-stone-700">
                    {c.logP !== null ? formatNumber(c.logP, 2) : c.crippenLogP !== null ? <span title="Estimated from the structure (Wildman–Crippen)">{formatNumber(c.crippenLogP, 2)}*</span> : "—"}
                  </td>
                  <td className="px-4 py-2.5">
                    <span className="flex flex-wrap gap-1">
                      {c.tags.map((t) => <Link key={t} href={`/compounds?tag=${encodeURIComponent(t)}`}><Badge>{t}</Badge></Link>)}
                    </span>
                  </td>
                  <td className="px-4 py-2.5 text-right tabular-nums text-stone-700">{c.workupCount}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <p className="border-t border-stone-100 px-4 py-2 text-xs text-stone-500">* estimated from the structure (Wildman–Crippen); no measured or literature value recorded.</p>
        </div>
      )}
      <nav aria-label="Pages" className="mt-4 flex justify-between text-sm">
        {options.after ? <Link href={`/compounds${tagQuery ? `?${tagQuery.slice(1)}` : ""}`} className={buttonClass("ghost")}>First page</Link> : <span />}
        {next ? <Link href={`/compounds?after=${encodeURIComponent(next)}${tagQuery}`} className={buttonClass("secondary")}>Next page</Link> : null}
      </nav>
    </>
  );
}
