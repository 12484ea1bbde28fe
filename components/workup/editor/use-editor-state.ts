"use client";
// The editor's state with undo, the set of touched fields, and the messages to show: the browser's own check of the
// form (same schemas as the server) plus whatever the server answered to the last save.
import { useCallback, useMemo, useState } from "react";
import { type LibraryOverrides } from "@/lib/chem/library";
import { type EditorState } from "@/lib/workups-client/editor-types";
import { placeMessages, placeServerErrors, type FieldMessages } from "@/lib/workups-client/field-errors";
import { saveInput } from "@/lib/workups-client/to-spec";
import { record, redo, reset, startHistory, undo } from "@/lib/workups-client/undo-history";
import { checkSave } from "@/lib/workups-client/validate";

/** `revealAll`: show every message from the start (a saved record opened for editing: its problems are news). */
export function useEditorState(initial: EditorState, library: LibraryOverrides, revealAll = false) {
  const [history, setHistory] = useState(() => startHistory(initial));
  const [touched, setTouched] = useState<ReadonlySet<string>>(new Set());
  const [showAll, setShowAll] = useState(revealAll);
  const [server, setServer] = useState<FieldMessages>({});
  const state = history.present;
  const input = useMemo(() => saveInput(state), [state]);
  const checked = useMemo(() => placeMessages(checkSave(input, library), state), [input, library, state]);

  const touch = useCallback((key: string) => setTouched((t) => (t.has(key) ? t : new Set(t).add(key))), []);
  const apply = useCallback((edit: (s: EditorState) => EditorState, key: string | null) => {
    setHistory((h) => record(h, edit(h.present), key, Date.now()));
    if (key !== null) {
      touch(key);
      setServer((s) => (key in s ? Object.fromEntries(Object.entries(s).filter(([k]) => k !== key)) : s));
    }
  }, [touch]);

  const visible = useCallback((key: string): string[] => {
    const own = showAll || touched.has(key) ? (checked[key] ?? []) : [];
    return [...new Set([...own, ...(server[key] ?? [])])];
  }, [checked, server, showAll, touched]);

  const problemCount = useCallback((prefix: string) => {
    const keys = new Set([...Object.keys(checked), ...Object.keys(server)]);
    return [...keys].filter((k) => k === prefix || k.startsWith(`${prefix}.`)).reduce((n, k) => n + visible(k).length, 0);
  }, [checked, server, visible]);

  /** Every field key that shows a message now. */
  const visibleKeys = useCallback(
    () => [...new Set([...Object.keys(checked), ...Object.keys(server)])].filter((k) => visible(k).length > 0),
    [checked, server, visible],
  );

  return {
    state, input, checked, showAll, history,
    apply, touch, visible, visibleKeys, problemCount,
    undo: () => setHistory(undo),
    redo: () => setHistory(redo),
    replace: (next: EditorState) => { setHistory(reset(next)); setServer({}); },
    revealAll: () => setShowAll(true),
    setServerErrors: (fieldErrors: Record<string, string[]>) => setServer(placeServerErrors(fieldErrors, state)),
  };
}
