import Link from "next/link";
import { notFound } from "next/navigation";
import { requirePageMember } from "@/lib/authz/page";
import { PageHeader } from "@/components/ui/page-header";
import { buttonClass } from "@/components/ui/button";
import { REAGENT_FIELDS, SOLVENT_FIELDS, toForm } from "@/lib/library/form-model";
import { EntryForm } from "../../_components/entry-form";

export const metadata = { title: "New library entry" };

/** A new solvent or reagent for the group (leads only: library:manage). */
export default async function NewLibraryEntryPage({ params }: { params: Promise<{ table: string }> }) {
  const { table } = await params;
  if (table !== "solvents" && table !== "reagents") notFound();
  await requirePageMember("library:manage", { returnTo: `/library/${table}/new` });
  const blank = table === "solvents"
    ? { ...toForm(SOLVENT_FIELDS, {}), family: "ester", waterMiscible: "false", chlorinated: "false", peroxideFormer: "false", reproductiveToxicant: "false", dipolarAprotic: "false", ionPairCapable: "false", ionLogKOffset: "-3.5", ionPairLogKOffset: "-3" }
    : { ...toForm(REAGENT_FIELDS, {}), kind: "solution", purpose: "salt" };
  return (
    <>
      <PageHeader title={table === "solvents" ? "Add a solvent" : "Add an aqueous reagent or salt"}
        description="Give every number its source (a handbook table, a paper, a notebook page) and say how sure you are of it."
        actions={<Link href="/library" className={buttonClass("ghost")}>Back to the library</Link>} />
      <EntryForm table={table} initial={blank} isNew removable={null} />
    </>
  );
}
