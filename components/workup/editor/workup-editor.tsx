"use client";
// The workup editor (new and edit): header, components, starting mixture and steps on the left, the live prediction
// on the right. Keyboard: Ctrl+Z / Ctrl+Shift+Z (or Ctrl+Y) undo and redo the last edit, Ctrl+S or Ctrl+Enter saves,
// Alt+↑/↓ moves the focused step, Alt+Shift+D duplicates it, Enter in "Add a step" adds one. Leaving with unsaved
// edits asks first, and unsaved edits to a saved workup are kept in the browser as a draft (draft.ts): reopening the
// page offers them back, merged three-way with whatever was saved meanwhile.
import { useRouter } from "next/navigation";
import Link from "next/link";
import { useCallback, useEffect, useMemo, useRef, useState, useTransition, type ReactNode } from "react";
import { getWorkupAction } from "@/lib/workups/actions";
import { type LibraryOverrides, resolveLibrary } from "@/lib/chem/library";
import { Button, buttonClass } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { ErrorSummary } from "@/components/ui/error-summary";
import { createWorkupAction, updateWorkupAction } from "@/lib/workups/actions";
import type { WorkupDetail } from "@/lib/workups/queries";
import type { JsonValue, WorkupSnapshot } from "@/lib/workups/record";
import { editorStateOf } from "@/lib/workups-client/from-spec";
import { browserStorage, clearDraft, loadDraft, saveDraft, type Draft } from "@/lib/workups-client/draft";
import { mergeSnapshots, same, type Choice, type MergeResult } from "@/lib/workups-client/merge";
import { type EditorState } from "@/lib/workups-client/editor-types";
import { saveInput } from "@/lib/workups-client/to-spec";
import { wordedMessages } from "@/lib/workups-client/field-labels";
import { useGroupValues } from "@/lib/workups-client/use-group-values";
import { useLivePrediction } from "@/lib/workups-client/use-live-prediction";
import { EditorContext, type EditorApi } from "./editor-context";
import { HeaderFields, type MemberChoice } from "./header-fields";
import { ComponentsSection } from "./components-section";
import { CompoundPicker } from "./compound-picker";
import { MixtureSection } from "./mixture-section";
import { OperationsSection } from "./operations-section";
import { PredictionPanel } from "./prediction-panel";
import { PredictionSheet, PredictionSummaryBar } from "./prediction-summary";
import { ConflictPanel, type TheirVersion } from "./conflict-panel";
import { ShortcutsHelp } from "./shortcuts-help";
import { revealIn, summaryItems } from "./error-items";
import { snapshotOfDetail, snapshotOfState } from "./snapshot";
import { useEditorState } from "./use-editor-state";
import { useLeaveGuard } from "./use-leave-guard";

export interface EditorProps {
  /** null for a new workup. */
  workupId: string | null;
  baseVersion: number | null;
  initial: EditorState;
  /** The version the form was opened from (for the conflict view); null for a new workup. */
  base: WorkupSnapshot | null;
  members: MemberChoice[];
  library: LibraryOverrides;
}

/** A merge in progress: the three snapshots, the user's choices, and the merged result last put into the form. */
interface MergeSession {
  base: WorkupSnapshot;
  mine: WorkupSnapshot;
  theirs: WorkupSnapshot;
  their: TheirVersion;
  choices: Record<string, Choice>;
  result: MergeResult;
}

/** A snapshot as the editor would send it back, so fields the form only normalizes do not count as changes. */
const normalized = (s: WorkupSnapshot): WorkupSnapshot => snapshotOfState(editorStateOf(s.header, s.spec, s.links));

function Section({ title, children, id }: { title: string; children: ReactNode; id: string }) {
  return (
    <section aria-labelledby={`${id}-h`} className="rounded-lg border border-stone-200 bg-white p-4 shadow-xs">
      <h2 id={`${id}-h`} className="mb-3 text-base font-semibold text-stone-900">{title}</h2>
      {children}
    </section>
  );
}

export function WorkupEditor({ workupId, baseVersion, initial, base, members, library }: EditorProps) {
  const router = useRouter();
  const editor = useEditorState(initial, library, workupId !== null);
  const { state, input } = editor;
  const resolved = useMemo(() => resolveLibrary(library), [library]);
  const groupValues = useGroupValues(input.links ?? []);
  const live = useLivePrediction(input.spec, library, { groupValues });
  const [version, setVersion] = useState(baseVersion);
  const [sheetOpen, setSheetOpen] = useState(false);
  const closeSheet = useCallback(() => setSheetOpen(false), []);
  const [opened, setOpened] = useState(base);
  const [baseline, setBaseline] = useState(() => JSON.stringify(input));
  const [failure, setFailure] = useState<string | null>(null);
  const [conflict, setConflict] = useState<string | null>(null);
  const [session, setSession] = useState<MergeSession | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [loading, startLoading] = useTransition();
  const [storage] = useState(browserStorage);
  const [draftChecked, setDraftChecked] = useState(false);
  const [offeredDraft, setOfferedDraft] = useState<Draft | null>(null);
  const [announcement, setAnnouncement] = useState("");
  const [saving, startSaving] = useTransition();
  const [attempt, setAttempt] = useState(0);
  const summaryRef = useRef<HTMLDivElement>(null);
  const dirty = JSON.stringify(input) !== baseline;
  useLeaveGuard(dirty && !saving);
  const names = Object.fromEntries(members.map((m) => [m.id, m.name]));
  const issueCount = Object.values(editor.checked).reduce((n, m) => n + m.length, 0);

  const messagesOf = (key: string) => wordedMessages(key, editor.visible(key), state);
  // The error summary lists each field in error once per message, top to bottom as the form shows them.
  const summary = attempt > 0 && editor.showAll
    ? summaryItems(Object.fromEntries(editor.visibleKeys().map((k) => [k, editor.visible(k)])), state)
    : [];
  const focusFirstProblem = () => setAttempt((n) => n + 1);

  const save = () => {
    editor.revealAll();
    setFailure(null);
    if (issueCount > 0) {
      setAnnouncement(`Not saved: ${issueCount} field${issueCount === 1 ? " needs" : "s need"} attention.`);
      focusFirstProblem();
      return;
    }
    startSaving(async () => {
      const result = workupId === null ? await createWorkupAction(input) : await updateWorkupAction(workupId, { ...input, baseVersion: version ?? 1 });
      if (result.ok) {
        setBaseline(JSON.stringify(input));
        setConflict(null);
        setSession(null);
        if (storage && workupId) clearDraft(storage, workupId);
        router.push(`/workups/${result.data.id}`);
        router.refresh();
        return;
      }
      if (result.status === 409) {
        setConflict(result.message);
        setSession(null);
      }
      else {
        if (result.fieldErrors) editor.setServerErrors(result.fieldErrors);
        setFailure(result.message);
        focusFirstProblem();
      }
    });
  };

  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      const mod = e.ctrlKey || e.metaKey;
      if (!mod || e.altKey) return;
      const key = e.key.toLowerCase();
      if (key === "z") { e.preventDefault(); if (e.shiftKey) editor.redo(); else editor.undo(); }
      else if (key === "y") { e.preventDefault(); editor.redo(); }
      else if (key === "s" || key === "enter") { e.preventDefault(); save(); }
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  });

  const formFrom = (snap: WorkupSnapshot) => editorStateOf(snap.header, snap.spec, snap.links);

  /** Merges `theirs` into the form (three-way against `base`) and makes it the base of the next save. */
  const startMerge = (base: WorkupSnapshot, theirsRaw: WorkupSnapshot, their: TheirVersion, mineRaw: WorkupSnapshot) => {
    const [b, t, m] = [normalized(base), normalized(theirsRaw), mineRaw];
    const result = mergeSnapshots(b, t, m);
    editor.apply(() => formFrom(result.merged), null);
    setVersion(their.version);
    setOpened(theirsRaw);
    setSession({ base: b, mine: m, theirs: t, their, choices: {}, result });
  };
  const theirVersionOf = (d: WorkupDetail): TheirVersion => ({ version: d.version, by: d.updatedBy?.name ?? null, at: d.updatedAt });
  const loadTheirs = () => startLoading(async () => {
    if (!workupId) return;
    const result = await getWorkupAction(workupId);
    if (!result.ok) return setProblem(result.message);
    setProblem(null);
    startMerge(opened ?? snapshotOfDetail(result.data), snapshotOfDetail(result.data), theirVersionOf(result.data), snapshotOfState(state));
  });
  /** A changed choice moves into the form three-way, so edits made since the merge stay. */
  const choose = (conflictId: string, choice: Choice) => {
    if (!session) return;
    const choices = { ...session.choices, [conflictId]: choice };
    const result = mergeSnapshots(session.base, session.theirs, session.mine, choices);
    const form = mergeSnapshots(session.result.merged, result.merged, snapshotOfState(state)).merged;
    editor.apply(() => formFrom(form), null);
    setSession({ ...session, choices, result });
  };
  const takeTheirs = () => {
    if (!session || !workupId) return;
    const next = formFrom(session.theirs);
    editor.replace(next);
    setConflict(null);
    setSession(null);
    setBaseline(JSON.stringify(saveInput(next)));
    if (storage) clearDraft(storage, workupId);
  };

  // Drafts: offered back once on opening; afterwards every unsaved edit is kept, and a clean form clears it.
  useEffect(() => {
    // After the first paint: the server-rendered form and the first client render must match (no storage there).
    const frame = requestAnimationFrame(() => {
      const found = workupId && storage && base !== null ? loadDraft(storage, workupId) : null;
      if (found && base !== null && !same(found.mine as unknown as JsonValue, normalized(base) as unknown as JsonValue)) setOfferedDraft(found);
      setDraftChecked(true);
    });
    return () => cancelAnimationFrame(frame);
  }, [workupId, storage, base]);
  useEffect(() => {
    if (!draftChecked || offeredDraft || !workupId || !storage || !opened || version === null) return;
    if (dirty) saveDraft(storage, { workupId, baseVersion: version, base: opened, mine: snapshotOfState(state), savedAt: new Date().toISOString() });
    else clearDraft(storage, workupId);
  }, [draftChecked, offeredDraft, workupId, storage, opened, version, dirty, state]);
  const restoreDraft = (d: Draft) => {
    setOfferedDraft(null);
    if (d.baseVersion === version || !opened) {
      editor.apply(() => formFrom(d.mine), null);
      return;
    }
    setConflict(`You had unsaved edits to version ${d.baseVersion}; version ${version ?? "?"} was saved since.`);
    startMerge(d.base, opened, { version: version ?? d.baseVersion, by: null, at: d.savedAt }, d.mine);
  };
  const discardDraft = () => {
    setOfferedDraft(null);
    if (storage && workupId) clearDraft(storage, workupId);
  };

  const api: EditorApi = {
    state, apply: editor.apply, messages: messagesOf, problemCount: editor.problemCount, touch: editor.touch,
    library: resolved, overrides: library, live,
  };
  return (
    <EditorContext.Provider value={api}>
      <PredictionSummaryBar open={sheetOpen} onToggle={() => setSheetOpen((o) => !o)} />
      <div data-editor className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem] xl:grid-cols-[minmax(0,1fr)_26rem]">
        <div role="form" aria-label={workupId ? "Edit workup" : "New workup"} className="min-w-0 space-y-5">
          <ErrorSummary items={summary} attempt={attempt} onReveal={revealIn(state)}
            title={`Not saved: ${summary.length} problem${summary.length === 1 ? "" : "s"} to fix`} />
          <Section title="Record" id="record"><HeaderFields members={members} /></Section>
          <Section title="Components" id="components">
            <div className="space-y-3">
              <ComponentsSection />
              <CompoundPicker onAdded={(i) => requestAnimationFrame(() => document.querySelectorAll<HTMLElement>("[data-testid=component-card]")[i]?.querySelector<HTMLElement>("input")?.focus())} />
            </div>
          </Section>
          <Section title="Starting mixture" id="mixture"><MixtureSection /></Section>
          <Section title="Steps" id="steps"><OperationsSection announce={setAnnouncement} /></Section>
        </div>
        <PredictionSheet open={sheetOpen} onClose={closeSheet}>
          <PredictionPanel />
        </PredictionSheet>
      </div>
      <p className="sr-only" aria-live="polite">{announcement}</p>
      <div className="sticky bottom-0 z-10 -mx-4 mt-6 border-t border-stone-200 bg-white/95 px-4 py-3 backdrop-blur">
        <div className="space-y-3">
          {offeredDraft ? (
            <Notice tone="warning" title="Unsaved edits from before">
              <p>Edits to version {offeredDraft.baseVersion} from {new Date(offeredDraft.savedAt).toLocaleString()} were not saved. They are kept in this browser.</p>
              <div className="mt-2 flex gap-2">
                <Button variant="secondary" onClick={() => restoreDraft(offeredDraft)}>Restore my edits{offeredDraft.baseVersion !== version ? " (merged with the newer version)" : ""}</Button>
                <Button variant="ghost" onClick={discardDraft}>Discard them</Button>
              </div>
            </Notice>
          ) : null}
          {conflict && workupId ? (
            <ConflictPanel message={conflict} theirs={session?.their ?? null} result={session?.result ?? null} choices={session?.choices ?? {}} names={names}
              pending={loading} problem={problem} onLoad={loadTheirs} onChoose={choose} onTakeTheirs={takeTheirs} />
          ) : null}
          {failure ? <Notice tone="error" title="Not saved">{failure}</Notice> : null}
          <div className="flex flex-wrap items-center gap-3">
            <Button onClick={save} disabled={saving}>{saving ? "Saving…" : workupId ? "Save changes" : "Save workup"}</Button>
            <Link href={workupId ? `/workups/${workupId}` : "/workups"} className={buttonClass("ghost")}>Cancel</Link>
            <Button variant="ghost" onClick={editor.undo} disabled={editor.history.past.length === 0} aria-keyshortcuts="Control+Z">Undo</Button>
            <Button variant="ghost" onClick={editor.redo} disabled={editor.history.future.length === 0} aria-keyshortcuts="Control+Shift+Z">Redo</Button>
            <div ref={summaryRef} tabIndex={-1} className="text-sm" data-testid="save-state">
              {editor.showAll && issueCount > 0
                ? <span className="text-red-700">{issueCount} field{issueCount === 1 ? " needs" : "s need"} attention (marked in red).</span>
                : dirty ? <span className="text-amber-800">Unsaved changes{version ? ` to version ${version}` : ""}.</span>
                  : <span className="text-stone-500">{workupId ? `No changes since version ${version ?? "?"}.` : "Nothing entered yet."}</span>}
            </div>
            <ShortcutsHelp />
          </div>
        </div>
      </div>
    </EditorContext.Provider>
  );
}
