"use client";
// What every part of the editor needs: the state, one way to change it (recorded for undo), the visible messages
// for a field, and the group's library. Provided once by WorkupEditor.
import { createContext, useContext } from "react";
import { type Library, type LibraryOverrides } from "@/lib/chem/library";
import { type EditorState } from "@/lib/workups-client/editor-types";
import { type LivePrediction } from "@/lib/workups-client/use-live-prediction";

export interface EditorApi {
  state: EditorState;
  /** Applies an edit; `fieldKey` names the field (quick edits of one field are one undo step), null for structural edits. */
  apply: (edit: (s: EditorState) => EditorState, fieldKey: string | null) => void;
  /** Messages to show beside a field now (once it was touched, or after a save attempt). */
  messages: (fieldKey: string) => string[];
  /** Messages under a prefix (a step, a component), shown or not, to mark the row. */
  problemCount: (prefix: string) => number;
  touch: (fieldKey: string) => void;
  library: Library;
  overrides: LibraryOverrides;
  live: LivePrediction;
}

export const EditorContext = createContext<EditorApi | null>(null);

export function useEditor(): EditorApi {
  const api = useContext(EditorContext);
  if (!api) throw new Error("useEditor outside the workup editor");
  return api;
}
