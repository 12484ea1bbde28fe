/**
 * Where a validation message belongs in the form. The schemas report paths like `spec.operations.2.volume.value`
 * (zod in the browser) or the same joined with dots (the server's 422 fieldErrors); the form shows messages by
 * field key: `header.title`, `op:<id>.volume`, `comp:<id>.amount`, `mix:<id>.volume`, `settings.funnel`, and
 * `form` for anything that has no field of its own. Row indices become client ids so a message follows its step.
 */
import { type EditorState } from "./editor-types";

export type FieldMessages = Record<string, string[]>;

/** `quantity.value` and `quantity.unit` are one control; list positions (`streams.0`) belong to the list. */
function fieldPath(rest: string[]): string {
  const parts = rest.filter((p, i) => !(i > 0 && /^\d+$/.test(p)));
  const last = parts.at(-1);
  if (parts.length > 1 && (last === "value" || last === "unit")) parts.pop();
  return parts.join(".");
}

export function fieldKeyOf(path: string, state: EditorState): string {
  const parts = path.split(".").filter((p) => p !== "");
  if (parts[0] === "spec") parts.shift();
  const [head, second, third, ...rest] = parts;
  if (head === "header" && second) return `header.${second}`;
  if (head === "components" && second !== undefined) {
    const c = state.components[Number(second)];
    if (!c) return "components";
    if (third === "pKas" && rest[0] !== undefined) {
      const p = c.pKas[Number(rest[0])];
      return p ? `pka:${p.id}.${fieldPath(rest.slice(1)) || "value"}` : `comp:${c.id}.pKas`;
    }
    return third ? `comp:${c.id}.${fieldPath([third, ...rest])}` : `comp:${c.id}`;
  }
  if (head === "operations" && second !== undefined) {
    const op = state.operations[Number(second)];
    if (!op) return "operations";
    return third ? `op:${op.id}.${fieldPath([third, ...rest])}` : `op:${op.id}`;
  }
  if (head === "mixture") {
    const list = second === "reagents" ? state.mixture.reagents : second === "solvents" ? state.mixture.solvents : null;
    const row = list && third !== undefined ? list[Number(third)] : undefined;
    if (row) return rest.length > 0 ? `mix:${row.id}.${fieldPath(rest)}` : `mix:${row.id}`;
    return "mixture";
  }
  if ((head === "temperature" || head === "funnel" || head === "name") && parts.length <= 2) return `settings.${head}`;
  if (head === "components" || head === "operations") return head;
  return "form";
}

export function placeMessages(issues: { path: string; message: string }[], state: EditorState): FieldMessages {
  const out: FieldMessages = {};
  for (const issue of issues) {
    const key = fieldKeyOf(issue.path, state);
    const list = (out[key] ??= []);
    if (!list.includes(issue.message)) list.push(issue.message);
  }
  return out;
}

/** The server's 422 answer ({ "spec.operations.2.volume.value": ["…"] }) placed the same way. */
export function placeServerErrors(fieldErrors: Record<string, string[]>, state: EditorState): FieldMessages {
  return placeMessages(Object.entries(fieldErrors).flatMap(([path, messages]) => messages.map((message) => ({ path: path === "_form" ? "" : path, message }))), state);
}

/** Messages for one field key and, for a row, those of the row itself. */
export function messagesFor(messages: FieldMessages, key: string): string[] {
  return messages[key] ?? [];
}

/** Every message whose key starts with `prefix` (a step or a component), to mark the whole row. */
export function countUnder(messages: FieldMessages, prefix: string): number {
  return Object.entries(messages).filter(([k]) => k === prefix || k.startsWith(`${prefix}.`)).reduce((n, [, v]) => n + v.length, 0);
}
