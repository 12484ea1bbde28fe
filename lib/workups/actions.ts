"use server";
// Server actions for the workup editor, the outcome form and the history view. Each starts with the guard
// (memberAction), validates with the shared schemas inside the service, and returns an ActionResult for the form:
// { ok: true, data } or { ok: false, status, message, fieldErrors } (422 field messages keyed like "header.title",
// "spec.operations.2.volume.value"; 409 with the stale-version message; 404 for another group's workup).
import { revalidatePath } from "next/cache";
import { actionArg, listArg, objectArg, recordIdArg, versionArg } from "@/lib/api/action-args";
import { memberAction } from "@/lib/authz/action";
import { getDb } from "@/lib/db/client";
import { type ActionResult } from "@/lib/errors";
import { type GroupValues } from "@/lib/partition/overlay";
import { actorOf } from "./context";
import { type VersionDiff } from "./diff";
import { diffVersions, listVersions, type VersionEntry } from "./history";
import { recordFoundCause, type FoundCauseRecord } from "./found-cause";
import { reportOutcome, type OutcomeReport } from "./outcome";
import { previewGroupValues, previewPrediction, type PreviewLinks } from "./preview";
import { getWorkupDetail, listWorkups, type WorkupDetail, type WorkupListPage } from "./queries";
import { type CreateWorkupInput, type OutcomeInputRaw, type UpdateWorkupInput, type WorkupListFilterInput } from "./schemas";
import { createWorkup, deleteWorkup, updateWorkup, type PredictionSummary, type SavedWorkup } from "./service";

function revalidate(id?: string): void {
  revalidatePath("/workups");
  if (id) revalidatePath(`/workups/${id}`);
}

export async function createWorkupAction(input: CreateWorkupInput): Promise<ActionResult<SavedWorkup>> {
  return memberAction("data:write", async (member) => {
    const saved = await createWorkup(await getDb(), actorOf(member), actionArg("input", objectArg("input"), input));
    revalidate(saved.id);
    return saved;
  });
}

/** `input.baseVersion` is the version the editor opened (WorkupDetail.version). */
export async function updateWorkupAction(id: string, input: UpdateWorkupInput): Promise<ActionResult<SavedWorkup>> {
  return memberAction("data:write", async (member) => {
    const workupId = actionArg("id", recordIdArg("id"), id);
    const saved = await updateWorkup(await getDb(), actorOf(member), workupId, actionArg("input", objectArg("input"), input));
    revalidate(workupId);
    return saved;
  });
}

export async function deleteWorkupAction(id: string): Promise<ActionResult<{ id: string }>> {
  return memberAction("data:write", async (member) => {
    const workupId = actionArg("id", recordIdArg("id"), id);
    await deleteWorkup(await getDb(), actorOf(member), workupId);
    revalidate();
    return { id: workupId };
  });
}

/** The cause the group found for a shortfall at review; `input` is { cause, note } (cause null clears it). */
export async function recordFoundCauseAction(workupId: string, input: unknown): Promise<ActionResult<FoundCauseRecord>> {
  return memberAction("data:write", async (member) => {
    const id = actionArg("workupId", recordIdArg("workupId"), workupId);
    const found = await recordFoundCause(await getDb(), actorOf(member), id, actionArg("input", objectArg("input"), input));
    revalidatePath("/review");
    revalidate(id);
    return found;
  });
}

export async function reportOutcomeAction(workupId: string, input: OutcomeInputRaw): Promise<ActionResult<OutcomeReport>> {
  return memberAction("data:write", async (member) => {
    const id = actionArg("workupId", recordIdArg("workupId"), workupId);
    const report = await reportOutcome(await getDb(), actorOf(member), id, actionArg("input", objectArg("input"), input));
    revalidate(id);
    return report;
  });
}

export async function getWorkupAction(id: string): Promise<ActionResult<WorkupDetail>> {
  return memberAction("data:read", async (member) => getWorkupDetail(await getDb(), member.group.id, actionArg("id", recordIdArg("id"), id)));
}

export async function listWorkupsAction(filter: WorkupListFilterInput): Promise<ActionResult<WorkupListPage>> {
  return memberAction("data:read", async (member) => listWorkups(await getDb(), member.group.id, actionArg("filter", objectArg("filter"), filter)));
}

export async function listVersionsAction(workupId: string): Promise<ActionResult<VersionEntry[]>> {
  return memberAction("data:read", async (member) => listVersions(await getDb(), member.group.id, actionArg("workupId", recordIdArg("workupId"), workupId)));
}

export async function diffVersionsAction(workupId: string, from: number, to: number): Promise<ActionResult<VersionDiff>> {
  return memberAction("data:read", async (member) => diffVersions(
    await getDb(), member.group.id, actionArg("workupId", recordIdArg("workupId"), workupId),
    actionArg("from", versionArg("from"), from), actionArg("to", versionArg("to"), to),
  ));
}

/**
 * The server's prediction with its interval, without saving (the editor predicts in the browser while typing; this
 * is the same computation a save stores, for a "check on the server" button): the group's values for `links` (or,
 * without them, the saved workup's links) are laid over the spec, and the seed follows the workup id, as on save.
 */
export async function predictAction(spec: unknown, workupId?: string, links?: PreviewLinks): Promise<ActionResult<PredictionSummary>> {
  return memberAction("data:read", async (member) => previewPrediction(await getDb(), member.group.id, actionArg("spec", objectArg("spec"), spec), {
    workupId: actionArg("workupId", recordIdArg("workupId").optional(), workupId),
    links: actionArg("links", listArg("links", 50).optional(), links),
    userKey: member.user.id,
  }));
}

/** The group's pooled partition values and registry properties for the editor's linked components, by component key. */
export async function groupValuesAction(links: PreviewLinks): Promise<ActionResult<GroupValues>> {
  return memberAction("data:read", async (member) => previewGroupValues(await getDb(), member.group.id, actionArg("links", listArg("links", 50), links)));
}
