"use client";
// Labelled form controls of the workup editor. Each takes a field key (see lib/workups-client/field-errors.ts): the
// key gives the element its id, so a validation message can point at it and the editor can move focus to it.
import { type ReactNode } from "react";
import { inputClass } from "@/components/ui/field";
import { type Choice, type ChoiceGroup } from "@/lib/workups-client/library-options";
import { type Quantity } from "@/lib/workups-client/editor-types";

export function fieldId(key: string): string {
  return `f-${key.replace(/[^A-Za-z0-9_-]/g, "_")}`;
}

const smallInput = inputClass.replace("px-3 py-2", "px-2 py-1.5");

export function Messages({ fieldKey, messages }: { fieldKey: string; messages: string[] }) {
  if (messages.length === 0) return null;
  return (
    <ul id={`${fieldId(fieldKey)}-msg`} className="mt-0.5 space-y-0.5 text-xs text-red-700" data-field-messages={fieldKey}>
      {messages.map((m) => <li key={m}>{m}</li>)}
    </ul>
  );
}

interface Common {
  fieldKey: string;
  label: ReactNode;
  messages?: string[];
  hint?: ReactNode;
  className?: string;
  /** Visually hidden label (the row says what the field is). */
  hideLabel?: boolean;
  onBlur?: () => void;
}

function Label({ fieldKey, label, hideLabel }: Pick<Common, "fieldKey" | "label" | "hideLabel">) {
  return <label htmlFor={fieldId(fieldKey)} className={hideLabel ? "sr-only" : "block text-xs font-medium text-stone-700"}>{label}</label>;
}

function describedBy(fieldKey: string, messages: string[] | undefined, hint: ReactNode): string | undefined {
  return [messages?.length ? `${fieldId(fieldKey)}-msg` : "", hint ? `${fieldId(fieldKey)}-hint` : ""].filter(Boolean).join(" ") || undefined;
}

function Hint({ fieldKey, hint }: { fieldKey: string; hint: ReactNode }) {
  return hint ? <p id={`${fieldId(fieldKey)}-hint`} className="mt-0.5 text-xs text-stone-500">{hint}</p> : null;
}

export function TextControl({ fieldKey, label, value, onChange, messages, hint, className = "", hideLabel, onBlur, numeric, placeholder, type = "text", mono, readOnly }: Common & {
  value: string; onChange: (v: string) => void; numeric?: boolean; placeholder?: string; type?: "text" | "date"; mono?: boolean; readOnly?: boolean;
}) {
  return (
    <div className={className}>
      <Label fieldKey={fieldKey} label={label} hideLabel={hideLabel} />
      <input
        id={fieldId(fieldKey)} type={type} value={value} placeholder={placeholder} inputMode={numeric ? "decimal" : undefined} readOnly={readOnly}
        onChange={(e) => onChange(e.target.value)} onBlur={onBlur} autoComplete="off" spellCheck={numeric || mono ? false : undefined}
        aria-invalid={messages?.length ? true : undefined} aria-describedby={describedBy(fieldKey, messages, hint)}
        className={`${smallInput} mt-0.5 ${numeric ? "tabular-nums" : ""} ${mono ? "font-mono" : ""}`}
      />
      <Hint fieldKey={fieldKey} hint={hint} />
      <Messages fieldKey={fieldKey} messages={messages ?? []} />
    </div>
  );
}

export function SelectControl({ fieldKey, label, value, onChange, messages, hint, className = "", hideLabel, onBlur, groups, choices, blank }: Common & {
  value: string; onChange: (v: string) => void; groups?: ChoiceGroup[]; choices?: Choice[]; blank?: string;
}) {
  return (
    <div className={className}>
      <Label fieldKey={fieldKey} label={label} hideLabel={hideLabel} />
      <select
        id={fieldId(fieldKey)} value={value} onChange={(e) => onChange(e.target.value)} onBlur={onBlur}
        aria-invalid={messages?.length ? true : undefined} aria-describedby={describedBy(fieldKey, messages, hint)}
        className={`${smallInput} mt-0.5`}
      >
        {blank !== undefined ? <option value="">{blank}</option> : null}
        {choices?.map((c) => <option key={c.value} value={c.value}>{c.label}</option>)}
        {groups?.map((g) => (
          <optgroup key={g.label} label={g.label}>
            {g.choices.map((c) => <option key={c.value} value={c.value}>{c.label}</option>)}
          </optgroup>
        ))}
      </select>
      <Hint fieldKey={fieldKey} hint={hint} />
      <Messages fieldKey={fieldKey} messages={messages ?? []} />
    </div>
  );
}

/** A number with its unit: the unit list is the closed set the schema accepts for this quantity. */
export function QuantityControl({ fieldKey, label, quantity, units, onChange, messages, hint, className = "", hideLabel, onBlur, placeholder }: Common & {
  quantity: Quantity; units: readonly string[]; onChange: (q: Quantity) => void; placeholder?: string;
}) {
  const id = fieldId(fieldKey);
  return (
    <div className={className}>
      <Label fieldKey={fieldKey} label={label} hideLabel={hideLabel} />
      <div className="mt-0.5 flex">
        <input
          id={id} value={quantity.value} inputMode="decimal" autoComplete="off" spellCheck={false} placeholder={placeholder}
          onChange={(e) => onChange({ ...quantity, value: e.target.value })} onBlur={onBlur}
          aria-invalid={messages?.length ? true : undefined} aria-describedby={describedBy(fieldKey, messages, hint)}
          className={`${smallInput} rounded-r-none tabular-nums`}
        />
        <select
          aria-label={`Unit of ${typeof label === "string" ? label.toLowerCase() : "the value"}`} value={quantity.unit}
          onChange={(e) => onChange({ ...quantity, unit: e.target.value })} onBlur={onBlur}
          className="rounded-r-md border border-l-0 border-stone-300 bg-stone-50 px-1.5 text-sm text-stone-700 focus:outline-2 focus:outline-teal-600/30"
        >
          {units.map((u) => <option key={u} value={u}>{u === "umol" ? "µmol" : u === "uL" ? "µL" : u}</option>)}
        </select>
      </div>
      <Hint fieldKey={fieldKey} hint={hint} />
      <Messages fieldKey={fieldKey} messages={messages ?? []} />
    </div>
  );
}

export function CheckControl({ fieldKey, label, checked, onChange, messages, className = "", onBlur }: Common & { checked: boolean; onChange: (v: boolean) => void }) {
  return (
    <div className={className}>
      <label className="mt-5 flex items-center gap-2 text-sm text-stone-800">
        <input id={fieldId(fieldKey)} type="checkbox" checked={checked} onChange={(e) => onChange(e.target.checked)} onBlur={onBlur}
          aria-describedby={messages?.length ? `${fieldId(fieldKey)}-msg` : undefined} className="h-4 w-4 accent-teal-700" />
        {label}
      </label>
      <Messages fieldKey={fieldKey} messages={messages ?? []} />
    </div>
  );
}

/** A small icon-free toolbar button with a full accessible name. */
export function ToolButton({ label, onClick, children, disabled, tone = "plain", id }: { label: string; onClick: () => void; children: ReactNode; disabled?: boolean; tone?: "plain" | "danger"; id?: string }) {
  return (
    <button id={id} type="button" aria-label={label} title={label} onClick={onClick} disabled={disabled}
      className={`rounded px-2 py-1 text-xs font-medium focus-visible:outline-2 focus-visible:outline-teal-600 disabled:opacity-40 ${tone === "danger" ? "text-red-700 hover:bg-red-50" : "text-stone-600 hover:bg-stone-100"}`}>
      {children}
    </button>
  );
}
