import Link from "next/link";
import { pageFailure, requirePageMember } from "@/lib/authz/page";
import { PageHeader } from "@/components/ui/page-header";
import { buttonClass } from "@/components/ui/button";
import { getDb } from "@/lib/db/client";
import { getWorkupDetail } from "@/lib/workups/queries";
import { WorkupEditor } from "@/components/workup/editor/workup-editor";
import { snapshotOfDetail } from "@/components/workup/editor/snapshot";
import { editorStateOf } from "@/lib/workups-client/from-spec";
import { editorContext } from "../../_lib/editor-data";

export const metadata = { title: "Edit workup" };

/** Guarded for writing: a viewer gets 403, another group's id 404. */
export default async function EditWorkupPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const member = await requirePageMember("data:write", { returnTo: `/workups/${id}/edit` });
  const workup = await getWorkupDetail(await getDb(), member.group.id, id).catch(pageFailure);
  const { members, library } = await editorContext(member);
  const base = snapshotOfDetail(workup);
  return (
    <>
      <PageHeader
        title={`Edit: ${workup.header.title}`}
        description={`Version ${workup.version}. Saving keeps this version in the history and adds a new one.`}
        actions={<Link href={`/workups/${workup.id}`} className={buttonClass("ghost")}>Back to the record</Link>}
      />
      <WorkupEditor workupId={workup.id} baseVersion={workup.version} initial={editorStateOf(workup.header, workup.spec, base.links)} base={base} members={members} library={library} />
    </>
  );
}
