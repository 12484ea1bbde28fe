"use client";
// The record's header: what a notebook page heads a workup with, plus the amounts the recovery is judged against.
import { setHeader } from "@/lib/workups-client/editor-actions";
import { type HeaderState } from "@/lib/workups-client/editor-types";
import { HEADER_LABELS } from "@/lib/workups-client/field-labels";
import { SelectControl, TextControl } from "./controls";
import { useEditor } from "./editor-context";
import { ScaleControl } from "./scale-control";

export interface MemberChoice {
  id: string;
  name: string;
}

export function HeaderFields({ members }: { members: MemberChoice[] }) {
  const { state, apply, messages, touch } = useEditor();
  const h = state.header;
  const bind = (field: keyof HeaderState) => {
    const key = `header.${field}`;
    return {
      fieldKey: key, value: h[field], messages: messages(key), onBlur: () => touch(key),
      onChange: (v: string) => apply((s) => setHeader(s, field, v), key),
    };
  };
  return (
    <div className="grid gap-3 sm:grid-cols-6">
      <TextControl {...bind("title")} label={HEADER_LABELS.title} className="sm:col-span-4" placeholder="e.g. Bicarbonate wash of the crude ester" />
      <TextControl {...bind("performedOn")} label={HEADER_LABELS.performedOn} type="date" className="sm:col-span-2" />
      <SelectControl {...bind("chemistId")} label={HEADER_LABELS.chemistId} className="sm:col-span-2" blank="Not recorded" choices={members.map((m) => ({ value: m.id, label: m.name }))} />
      <TextControl {...bind("notebookRef")} label={HEADER_LABELS.notebookRef} className="sm:col-span-2" placeholder="book-page" mono />
      <TextControl {...bind("scaleMmol")} label={HEADER_LABELS.scaleMmol} numeric className="sm:col-span-2" hint="Limiting reagent." />
      <TextControl {...bind("notebookUrl")} label={HEADER_LABELS.notebookUrl} className="sm:col-span-6" placeholder="https://…" mono
        hint="Link to the entry in your electronic notebook, if it has one." />
      <TextControl {...bind("expectedProductMmol")} label={HEADER_LABELS.expectedProductMmol} numeric className="sm:col-span-3" hint="Theoretical amount; recovery is judged against it when nothing was assayed." />
      <TextControl {...bind("assayedProductMmol")} label={HEADER_LABELS.assayedProductMmol} numeric className="sm:col-span-3"
        hint="From a quantitative sample (qNMR, calibrated HPLC) before the quench; separates reaction yield from workup losses." />
      <ScaleControl />
    </div>
  );
}
