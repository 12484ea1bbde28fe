import Link from "next/link";
import { can } from "@/lib/authz";
import { pageFailure, requirePageMember } from "@/lib/authz/page";
import { getDb } from "@/lib/db/client";
import { getCompound, partitionDataFor, workupsUsing } from "@/lib/compounds/queries";
import { siteWarnings } from "@/lib/compounds/site-warnings";
import { Badge } from "@/components/ui/badge";
import { buttonClass } from "@/components/ui/button";
import { Card, PageHeader } from "@/components/ui/page-header";
import { DeleteCompound } from "../_components/delete-compound";
import { Depiction } from "../_components/depiction";
import { PartitionTable } from "../_components/partition-table";
import { PropertiesCard } from "../_components/properties-card";
import { SitesCard } from "../_components/sites-card";
import { WorkupTable } from "../_components/workup-table";

export const metadata = { title: "Compound" };

export default async function CompoundPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const member = await requirePageMember("data:read", { returnTo: `/compounds/${id}` });
  const db = await getDb();
  const compound = await getCompound(db, member.group.id, id).catch((e: unknown) => pageFailure(e));
  const [observations, workups] = [await partitionDataFor(db, member.group.id, compound.id), await workupsUsing(db, member.group.id, [compound.id])];
  const used = workups.get(compound.id) ?? [];
  const warnings = await siteWarnings(compound);
  const editable = can(member, "data:write");
  const similarHref = `/search?mode=similarity&query=${encodeURIComponent(compound.canonicalSmiles)}`;
  return (
    <>
      <PageHeader
        title={compound.name}
        description={
          <span className="flex flex-wrap items-center gap-1.5">
            {compound.synonyms.length > 0 ? <span>Also known as {compound.synonyms.join(", ")}.</span> : null}
            {compound.tags.map((t) => <Link key={t} href={`/compounds?tag=${encodeURIComponent(t)}`}><Badge tone="accent">{t}</Badge></Link>)}
          </span>
        }
        actions={
          <>
            <Link href="/compounds" className={buttonClass("ghost")}>All compounds</Link>
            <Link href={similarHref} className={buttonClass("secondary")}>Find similar compounds</Link>
            {editable && used.length === 0 && observations.length === 0 ? <DeleteCompound compoundId={compound.id} name={compound.name} /> : null}
          </>
        }
      />
      <div className="grid gap-6 lg:grid-cols-5">
        <Card title="Structure" className="lg:col-span-2">
          <Depiction compoundId={compound.id} name={compound.name} width={360} height={270} />
          <p className="mt-2 break-all font-mono text-xs text-stone-600" aria-label="Canonical SMILES">{compound.canonicalSmiles}</p>
        </Card>
        <div className="lg:col-span-3">
          <PropertiesCard compound={compound} editable={editable} />
        </div>
      </div>
      <div className="mt-6 space-y-6">
        <SitesCard compound={compound} editable={editable} warnings={warnings} />
        <Card title={`Workups that used it (${used.length})`}>
          <WorkupTable workups={used} caption={`Workups of ${member.group.name} that used ${compound.name}`} />
        </Card>
        <Card title={`The group's partition data (${observations.length})`}>
          <PartitionTable observations={observations} />
          <Link href={`/partition/${compound.id}`} className="mt-3 inline-block text-sm text-teal-800 underline">
            Pooled values and all measurements
          </Link>
        </Card>
      </div>
    </>
  );
}
