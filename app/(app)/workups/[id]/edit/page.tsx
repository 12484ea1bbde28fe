import Link from "next/link";
import { pageFailure, requirePageMember } from "@/lib/authz/page";
import { Card, PageHeader } from "@/components/ui/page-header";
import { buttonClass } from "@/components/ui/button";
import { getWorkup } from "../../_lib/queries";

export const metadata = { title: "Edit workup" };

/** Placeholder for the workup editor: already guarded for writing, so viewers get 403 and other groups 404. */
export default async function EditWorkupPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const member = await requirePageMember("data:write", { returnTo: `/workups/${id}/edit` });
  const workup = await getWorkup(member, id).catch(pageFailure);
  return (
    <>
      <PageHeader title={`Edit: ${workup.title}`} actions={<Link href={`/workups/${workup.id}`} className={buttonClass("ghost")}>Back to the record</Link>} />
      <Card>
        <p className="text-sm text-stone-600" data-testid="editor-placeholder">
          The editor for version {workup.version} of this workup is not built yet.
        </p>
      </Card>
    </>
  );
}
