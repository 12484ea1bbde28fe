// The editor's messages as links for an error summary: in form order, in the form's words, each leading to its field
// (or, for a whole step or section, to the step or section).
import { type ErrorSummaryItem } from "@/components/ui/error-summary";
import { type EditorState } from "@/lib/workups-client/editor-types";
import { type FieldMessages } from "@/lib/workups-client/field-errors";
import { compareFormOrder, fieldLabel, formOrder, summaryLine, wordedMessages } from "@/lib/workups-client/field-labels";
import { fieldId } from "./controls";
import { stepElementId } from "./operation-card";

export function targetOf(key: string): string {
  if (/^op:[^.]+$/.test(key)) return stepElementId(key.slice(3));
  if (key === "components" || key === "mixture") return `${key}-h`;
  if (key === "form") return "record-h";
  return fieldId(key);
}

export function summaryItems(messages: FieldMessages, state: EditorState): ErrorSummaryItem[] {
  return Object.keys(messages)
    .sort((a, b) => compareFormOrder(formOrder(a, state), formOrder(b, state)))
    .flatMap((key) => wordedMessages(key, messages[key] ?? [], state).map((m) => ({ targetId: targetOf(key), text: summaryLine(m, fieldLabel(key, state)) })));
}

/** Unfolds the step a summary link leads into, so its field can take focus. */
export function revealIn(state: EditorState): (targetId: string) => void {
  return (targetId) => {
    const step = state.operations.find((o) => targetId.startsWith(`${fieldId(`op:${o.id}`)}.`) || targetId.startsWith(`${fieldId(`op:${o.id}`)}_`) || targetId === stepElementId(o.id));
    if (step) document.getElementById(stepElementId(step.id))?.querySelector<HTMLButtonElement>("button[aria-label^='Unfold']")?.click();
  };
}
