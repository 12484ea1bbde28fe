"use client";
// The editor of one library entry (a lead's form): every field with its source and confidence, checked in the
// browser with the same schema the server action uses, messages beside the fields.
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { Messages, SelectControl, TextControl, CheckControl } from "@/components/workup/editor/controls";
import type { ActionResult } from "@/lib/errors";
import { fromForm, REAGENT_FIELDS, SOLVENT_FIELDS, type FormField } from "@/lib/library/form-model";
import { CONFIDENCES, reagentPropsSchema, solventPropsSchema } from "@/lib/library/schemas";
import { removeLibraryEntryAction, saveReagentAction, saveSolventAction } from "@/lib/library/actions";

export type LibraryTable = "solvents" | "reagents";

const CONFIDENCE_WORDS: Record<string, string> = {
  confirmed: "confirmed in the source", confirmed_digitized: "confirmed (digitized table)", derived: "derived from confirmed values",
  secondary: "secondary source", memory: "from memory: check it", assumed: "assumption",
};

function messagesByPath(issues: { path: PropertyKey[]; message: string }[]): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const i of issues) (out[i.path.map(String).join(".") || "form"] ??= []).push(i.message);
  return out;
}

export function EntryForm({ table, initial, isNew, removable }: { table: LibraryTable; initial: Record<string, string>; isNew: boolean; removable: "revert" | "delete" | null }) {
  const router = useRouter();
  const fields = table === "solvents" ? SOLVENT_FIELDS : REAGENT_FIELDS;
  const [form, setForm] = useState(initial);
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [failure, setFailure] = useState<string | null>(null);
  const [pending, startTransition] = useTransition();
  const set = (path: string, v: string) => setForm((f) => ({ ...f, [path]: v }));

  const done = (result: ActionResult<unknown>, to: string) => {
    if (result.ok) {
      router.push(to);
      router.refresh();
    } else {
      setErrors(result.fieldErrors ?? {});
      setFailure(result.message);
    }
  };
  const refuse = (issues: { path: PropertyKey[]; message: string }[]) => {
    setErrors(messagesByPath(issues));
    setFailure("Not saved: some fields need attention.");
  };
  const save = () => {
    setFailure(null);
    const input = fromForm(fields, form);
    if (table === "solvents") {
      const checked = solventPropsSchema.safeParse(input);
      if (!checked.success) return refuse(checked.error.issues);
      setErrors({});
      startTransition(async () => done(await saveSolventAction(checked.data), "/library"));
    } else {
      const checked = reagentPropsSchema.safeParse(input);
      if (!checked.success) return refuse(checked.error.issues);
      setErrors({});
      startTransition(async () => done(await saveReagentAction(checked.data), "/library"));
    }
  };
  const remove = () => {
    if (!window.confirm(removable === "revert" ? "Go back to the shipped values for this entry?" : "Delete this entry? Workups that name it will no longer validate.")) return;
    startTransition(async () => done(await removeLibraryEntryAction({ table: table === "solvents" ? "solvent" : "reagent", key: form.key ?? "" }), "/library"));
  };

  const sections = [...new Set(fields.map((x) => x.section))];
  return (
    <form className="space-y-5" aria-label="Library entry" onSubmit={(e) => { e.preventDefault(); save(); }} noValidate>
      {sections.map((section) => (
        <fieldset key={section} className="rounded-lg border border-stone-200 bg-white p-4">
          <legend className="px-1 text-sm font-semibold text-stone-900">{section}</legend>
          <div className="flex flex-wrap gap-3">
            {fields.filter((x) => x.section === section).map((field) => <FieldInput key={field.path} field={field} form={form} set={set} errors={errors} readOnlyKey={!isNew} />)}
          </div>
        </fieldset>
      ))}
      {failure ? <Notice tone="error">{failure}{errors.form ? ` ${errors.form.join(" ")}` : ""}</Notice> : null}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" disabled={pending}>{pending ? "Saving…" : "Save for the group"}</Button>
        {removable ? <Button variant="danger" onClick={remove} disabled={pending}>{removable === "revert" ? "Back to the shipped values" : "Delete this entry"}</Button> : null}
      </div>
    </form>
  );
}

function FieldInput({ field, form, set, errors, readOnlyKey }: {
  field: FormField; form: Record<string, string>; set: (p: string, v: string) => void; errors: Record<string, string[]>; readOnlyKey: boolean;
}) {
  const key = `lib.${field.path}`;
  const v = form[field.path] ?? "";
  const messages = errors[field.path] ?? [];
  const part = (p: string) => errors[`${field.path}.${p}`] ?? [];
  switch (field.kind) {
    case "bool":
      return <CheckControl fieldKey={key} label={field.label} checked={v === "true"} messages={messages} onChange={(c) => set(field.path, c ? "true" : "false")} />;
    case "select":
      return <SelectControl fieldKey={key} label={field.label} value={v} messages={messages} blank={field.blank ? "—" : undefined}
        choices={(field.options ?? []).map((o) => ({ value: o, label: CONFIDENCE_WORDS[o] ?? o.replace(/_/g, " ") }))} onChange={(x) => set(field.path, x)} />;
    case "sourced":
      return (
        <fieldset className="w-full rounded border border-stone-100 p-2">
          <legend className="px-1 text-xs font-medium text-stone-700">{field.label}{field.blank ? " (leave blank if not known or not applicable)" : ""}</legend>
          <div className="flex flex-wrap gap-2">
            <TextControl fieldKey={`${key}.value`} label="Value" numeric value={form[`${field.path}.value`] ?? ""} className="w-28" messages={part("value")} onChange={(x) => set(`${field.path}.value`, x)} />
            <TextControl fieldKey={`${key}.source`} label="Source" value={form[`${field.path}.source`] ?? ""} className="min-w-56 flex-1" placeholder="handbook table, paper, notebook page"
              messages={part("source")} onChange={(x) => set(`${field.path}.source`, x)} />
            <SelectControl fieldKey={`${key}.confidence`} label="Confidence" value={form[`${field.path}.confidence`] || "memory"} messages={part("confidence")}
              choices={CONFIDENCES.map((c) => ({ value: c, label: CONFIDENCE_WORDS[c] ?? c }))} onChange={(x) => set(`${field.path}.confidence`, x)} />
            <TextControl fieldKey={`${key}.tempC`} label="At (°C)" numeric value={form[`${field.path}.tempC`] ?? ""} className="w-20" messages={part("tempC")} onChange={(x) => set(`${field.path}.tempC`, x)} />
          </div>
          <Messages fieldKey={key} messages={messages} />
        </fieldset>
      );
    default:
      return <TextControl fieldKey={key} label={field.label} value={v} numeric={field.kind === "number"} messages={messages} hint={field.path === "key" && readOnlyKey ? "Fixed: workup records name the entry by it." : field.hint}
        className={field.kind === "number" ? "w-44" : "min-w-64 flex-1"} readOnly={field.path === "key" && readOnlyKey} onChange={(x) => set(field.path, x)} />;
  }
}
