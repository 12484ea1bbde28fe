import { requirePageMember } from "@/lib/authz/page";
import { PageHeader } from "@/components/ui/page-header";
import { getDb } from "@/lib/db/client";
import { getWorkupDetail } from "@/lib/workups/queries";
import { NotFoundError } from "@/lib/errors";
import { WorkupEditor } from "@/components/workup/editor/workup-editor";
import { snapshotOfDetail } from "@/components/workup/editor/snapshot";
import { editorStateOf, emptyEditorState } from "@/lib/workups-client/from-spec";
import { editorContext, todayUtc } from "../_lib/editor-data";
import { copiedHeader } from "@/lib/workups-client/template";
import { type EditorState } from "@/lib/workups-client/editor-types";

function copyOf(state: EditorState, today: string, chemistId: string): EditorState {
  return { ...state, header: copiedHeader(state.header, today, chemistId) };
}

export const metadata = { title: "New workup" };

/** The workup to copy; another group's id (or a stale link) just gives a blank form. */
async function copySource(groupId: string, id: string) {
  try {
    return await getWorkupDetail(await getDb(), groupId, id);
  } catch (error) {
    if (error instanceof NotFoundError) return null;
    throw error;
  }
}

/** A blank workup, or (with ?copy=<id>) a copy of one of the group's workups to adapt. */
export default async function NewWorkupPage({ searchParams }: { searchParams: Promise<{ copy?: string }> }) {
  const member = await requirePageMember("data:write", { returnTo: "/workups/new" });
  const { copy } = await searchParams;
  const { members, library } = await editorContext(member);
  const source = copy ? await copySource(member.group.id, copy) : null;
  const initial = source
    ? copyOf(editorStateOf(source.header, source.spec, snapshotOfDetail(source).links), todayUtc(), member.user.id)
    : emptyEditorState(todayUtc(), member.user.id);
  return (
    <>
      <PageHeader
        title="New workup"
        description={source ? `A copy of “${source.header.title}”: change what differs, then save it as a new record.` : "Write the workup down as it was run; the prediction follows as you type."}
      />
      <WorkupEditor workupId={null} baseVersion={null} initial={initial} base={null} members={members} library={library} />
    </>
  );
}
