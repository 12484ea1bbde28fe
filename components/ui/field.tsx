import { type InputHTMLAttributes, type ReactNode } from "react";

export const inputClass =
  "block w-full rounded-md border border-stone-300 bg-white px-3 py-2 text-sm text-stone-900 shadow-xs " +
  "placeholder:text-stone-400 focus:border-teal-600 focus:outline-2 focus:outline-teal-600/30 " +
  "aria-invalid:border-red-500 aria-invalid:focus:outline-red-500/30";

/** A labelled input with its validation messages beside it (linked by aria-describedby). */
export function Field({ label, name, errors, hint, ...input }: InputHTMLAttributes<HTMLInputElement> & { label: string; name: string; errors?: string[] | undefined; hint?: ReactNode }) {
  const id = input.id ?? `field-${name}`;
  const errorId = `${id}-errors`;
  const hintId = `${id}-hint`;
  const describedBy = [hint ? hintId : "", errors?.length ? errorId : ""].filter(Boolean).join(" ") || undefined;
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-medium text-stone-800">
        {label}
      </label>
      <input id={id} name={name} aria-invalid={errors?.length ? true : undefined} aria-describedby={describedBy} className={inputClass} {...input} />
      {hint ? <p id={hintId} className="text-xs text-stone-500">{hint}</p> : null}
      <FieldErrors id={errorId} errors={errors} />
    </div>
  );
}

export function FieldErrors({ id, errors }: { id?: string; errors?: string[] | undefined }) {
  if (!errors?.length) return null;
  return (
    <ul id={id} className="space-y-0.5 text-sm text-red-700">
      {errors.map((e) => (
        <li key={e}>{e}</li>
      ))}
    </ul>
  );
}

/** A text field's value from FormData ("" when absent). */
export function textField(form: FormData, name: string): string {
  const value = form.get(name);
  return typeof value === "string" ? value : "";
}
