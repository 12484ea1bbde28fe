"use client";
// The list of what stopped a form, at its top: one link per field in error, in the form's words. Following a link
// moves focus to the field itself (not just the scroll position), so the keyboard and a screen reader land where the
// fix is typed. The summary takes focus each time a submit is refused, so the refusal is announced and read first.
import { useEffect, useRef } from "react";

export interface ErrorSummaryItem {
  /** The id of the element the link leads to (the input, select or fieldset). */
  targetId: string;
  /** What is wrong, in the form's words ("Purity must be ≤ 100 %"). */
  text: string;
}

const FOCUSABLE = "input:not([type=hidden]), select, textarea, button, [tabindex]";

/** Focuses the element with `id`, or the first field inside it; scrolls it to the middle of the screen. */
export function focusField(id: string): boolean {
  const target = document.getElementById(id);
  if (!target) return false;
  const field = target.matches(FOCUSABLE) ? target : (target.querySelector<HTMLElement>(FOCUSABLE) ?? target);
  if (!field.matches(FOCUSABLE)) field.tabIndex = -1;
  field.scrollIntoView({ block: "center" });
  field.focus({ preventScroll: true });
  return true;
}

export function ErrorSummary({ items, title, attempt, id = "error-summary", onReveal }: {
  items: ErrorSummaryItem[];
  /** "2 fields need attention before this can be saved." */
  title?: string;
  /** Changes with each refused submit (a counter, or the action's answer): the summary takes focus again. */
  attempt: unknown;
  id?: string;
  /** Called before focusing a target that may be hidden (a folded step): make it visible. */
  onReveal?: (targetId: string) => void;
}) {
  const ref = useRef<HTMLDivElement>(null);
  const shown = items.length > 0;
  useEffect(() => {
    if (shown && attempt) ref.current?.focus();
  }, [attempt, shown]);
  if (!shown) return null;
  return (
    <div ref={ref} id={id} tabIndex={-1} role="alert" aria-labelledby={`${id}-title`} data-testid="error-summary"
      className="rounded-md border-2 border-red-700 bg-white px-4 py-3 text-sm text-stone-900 focus:outline-2 focus:outline-offset-2 focus:outline-red-700">
      <h2 id={`${id}-title`} className="font-semibold text-red-800">
        {title ?? `${items.length} field${items.length === 1 ? " needs" : "s need"} attention`}
      </h2>
      <FieldLinks items={items} onReveal={onReveal} />
    </div>
  );
}

/** Links that move focus to fields in error; also used where a list must not interrupt (the live prediction's status). */
export function FieldLinks({ items, onReveal, className = "mt-1.5 list-disc space-y-1 pl-5" }: {
  items: ErrorSummaryItem[]; onReveal?: ((targetId: string) => void) | undefined; className?: string;
}) {
  const follow = (targetId: string) => {
    if (focusField(targetId)) return;
    onReveal?.(targetId);
    // The revealed field is drawn on the next frames.
    requestAnimationFrame(() => requestAnimationFrame(() => void focusField(targetId)));
  };
  return (
    <ul className={className}>
      {items.map((item) => (
        <li key={`${item.targetId}:${item.text}`}>
          <a href={`#${item.targetId}`} className="text-red-800 underline underline-offset-2 hover:text-red-950"
            onClick={(e) => { e.preventDefault(); follow(item.targetId); }}>
            {item.text}
          </a>
        </li>
      ))}
    </ul>
  );
}

/**
 * The summary of a form built from `Field`s (ids `field-<name>`): `fields` names each field by its label, in the
 * order the form shows them; a message for anything else is listed as it is, leading to the first field.
 */
export function FieldErrorSummary({ errors, fields, attempt, title, id }: {
  errors: Record<string, string[]> | undefined;
  fields: Record<string, string>;
  attempt: unknown;
  title?: string;
  id?: string;
}) {
  const names = Object.keys(fields);
  const first = names[0] ?? "";
  const items = [
    ...names.flatMap((name) => (errors?.[name] ?? []).map((m) => ({ targetId: `field-${name}`, text: `${fields[name]}: ${m}` }))),
    ...Object.entries(errors ?? {}).filter(([name]) => !(name in fields)).flatMap(([, list]) => list.map((m) => ({ targetId: `field-${first}`, text: m }))),
  ];
  return <ErrorSummary items={items} attempt={attempt} {...(title ? { title } : {})} {...(id ? { id } : {})} />;
}
