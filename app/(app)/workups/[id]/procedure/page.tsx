import { headers } from "next/headers";
import Link from "next/link";
import { z } from "zod";
import { pageFailure, requirePageMember } from "@/lib/authz/page";
import { formatDate } from "@/components/ui/format";
import { getDb } from "@/lib/db/client";
import { resolveLibrary } from "@/lib/chem/library";
import { isNotebookUrl } from "@/lib/workups/schemas";
import { getWorkupDetail } from "@/lib/workups/queries";
import { groupLibrary } from "@/lib/workups/library";
import { describeOperation } from "@/lib/workups-client/describe";
import { renderProcedure, stepsOf } from "@/lib/procedure/render";
import "./print.css";

export const metadata = { title: "Printable procedure" };

const paperSchema = z.enum(["a4", "letter"]).catch("a4");
const PAGE_SIZE = { a4: "A4 portrait", letter: "letter portrait" } as const;


/** One page to take to the hood: the steps with their amounts, the cautions at their step, and the record's address. */
export default async function ProcedurePage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<{ paper?: string }> }) {
  const { id } = await params;
  const paper = paperSchema.parse((await searchParams).paper);
  const member = await requirePageMember("data:read", { returnTo: `/workups/${id}/procedure` });
  const db = await getDb();
  const workup = await getWorkupDetail(db, member.group.id, id).catch(pageFailure);
  const library = resolveLibrary(await groupLibrary(db, member.group.id));
  const stored = Array.isArray(workup.spec.operations) ? workup.spec.operations : [];
  const cautions = workup.prediction?.result.prediction.cautions ?? [];
  const h = await headers();
  const host = h.get("host") ?? "localhost";
  const proto = h.get("x-forwarded-proto") ?? "http";
  const address = `${proto}://${host}/workups/${workup.id}`;
  return (
    <article className="procedure-sheet mx-auto max-w-[180mm] space-y-4 bg-white p-6 text-[11pt] leading-snug text-black">
      <style>{`@media print { @page { size: ${PAGE_SIZE[paper]}; margin: 15mm; } }`}</style>
      <nav className="procedure-controls flex flex-wrap gap-3 text-sm" aria-label="Printing">
        <Link href={`/workups/${workup.id}`} className="text-teal-800 underline">Back to the workup</Link>
        <Link href={`?paper=a4`} className="text-teal-800 underline" aria-current={paper === "a4" ? "page" : undefined}>A4</Link>
        <Link href={`?paper=letter`} className="text-teal-800 underline" aria-current={paper === "letter" ? "page" : undefined}>Letter</Link>
        <span className="text-stone-600">Use the browser&apos;s print command; the page fits one sheet of {paper === "a4" ? "A4" : "Letter"}.</span>
      </nav>
      <header>
        <h1 className="text-lg font-semibold">{workup.header.title}</h1>
        <p className="text-sm">
          {formatDate(workup.header.performedOn)} · {workup.chemistName ?? "chemist not recorded"}
          {workup.header.notebookRef ? ` · notebook ${workup.header.notebookRef}` : ""} · version {workup.version}
        </p>
        <p className="text-xs">Record: {address}</p>
        {isNotebookUrl(workup.header.notebookUrl) ? <p className="break-all text-xs">Notebook entry: {workup.header.notebookUrl}</p> : null}
      </header>
      <section>
        <h2 className="text-sm font-semibold uppercase tracking-wide">Steps</h2>
        <ol className="mt-1 list-decimal space-y-1 pl-6">
          {stored.map((op, i) => {
            const here = cautions.filter((c) => c.step === i);
            return (
              <li key={i}>
                <span className="mr-2 inline-block h-3 w-3 border border-black align-middle" aria-hidden="true" />
                {describeOperation(op, library)}
                {here.map((c, j) => <p key={j} className="mt-0.5 border-l-4 border-black pl-2 text-[10pt]"><strong>Caution:</strong> {c.text}</p>)}
              </li>
            );
          })}
        </ol>
      </section>
      <section>
        <h2 className="text-sm font-semibold uppercase tracking-wide">As written for the notebook</h2>
        <p className="mt-1">{renderProcedure(stepsOf(stored))}</p>
      </section>
      {cautions.some((c) => c.step < 0 || c.step >= stored.length) ? (
        <section>
          <h2 className="text-sm font-semibold uppercase tracking-wide">General cautions</h2>
          <ul className="mt-1 list-disc pl-6 text-[10pt]">{cautions.filter((c) => c.step < 0 || c.step >= stored.length).map((c, i) => <li key={i}>{c.text}</li>)}</ul>
        </section>
      ) : null}
    </article>
  );
}
