/**
 * Edits of the editor state, as pure functions (state in, new state out), so undo, tests and the keyboard
 * shortcuts all go through the same code.
 */
import { type OperationType } from "@/lib/chem/schema";
import { type Library } from "@/lib/chem/library";
import { newClientId } from "./ids";
import { changeOperationType, duplicateOperation, newOperation } from "./operation-forms";
import { type ComponentState, type EditorState, type HeaderState, type MixtureReagentState, type MixtureSolventState, type OperationState, type SettingsState } from "./editor-types";

export function setHeader(state: EditorState, field: keyof HeaderState, value: string): EditorState {
  return { ...state, header: { ...state.header, [field]: value } };
}

export function setSettings(state: EditorState, patch: Partial<SettingsState>): EditorState {
  return { ...state, settings: { ...state.settings, ...patch } };
}

/** A spec key from a name: lower-case letters, digits and dashes, unique among `taken`. */
export function keyFromName(name: string, taken: ReadonlySet<string>): string {
  const base = name.toLowerCase().normalize("NFKD").replace(/[^a-z0-9]+/g, "-").replace(/^-+|-+$/g, "").slice(0, 40) || "component";
  if (!taken.has(base)) return base;
  for (let i = 2; ; i++) if (!taken.has(`${base}-${i}`)) return `${base}-${i}`;
}

const keysExcept = (state: EditorState, id: string) => new Set(state.components.filter((c) => c.id !== id).map((c) => c.key));

export function addComponent(state: EditorState, component: Omit<ComponentState, "id" | "key"> & { key?: string }): EditorState {
  const key = component.key && !keysExcept(state, "").has(component.key) ? component.key : keyFromName(component.name, keysExcept(state, ""));
  return { ...state, components: [...state.components, { ...component, id: newClientId("c"), key }] };
}

/** Renaming a component whose key still follows its name re-keys it, and steps that name it follow. */
export function updateComponent(state: EditorState, id: string, patch: Partial<Omit<ComponentState, "id">>): EditorState {
  const old = state.components.find((c) => c.id === id);
  if (!old) return state;
  let next: ComponentState = { ...old, ...patch };
  if (patch.name !== undefined && old.autoKey && patch.key === undefined) next = { ...next, key: keyFromName(patch.name, keysExcept(state, id)) };
  const components = state.components.map((c) => (c.id === id ? next : c));
  const operations = next.key === old.key ? state.operations : renameInSteps(state.operations, old.key, next.key);
  return { ...state, components, operations };
}

function renameInSteps(operations: OperationState[], from: string, to: string): OperationState[] {
  return operations.map((op) => {
    const solids = op.lists.solidComponents;
    return solids?.includes(from) ? { ...op, lists: { ...op.lists, solidComponents: solids.map((k) => (k === from ? to : k)) } } : op;
  });
}

export function removeComponent(state: EditorState, id: string): EditorState {
  const gone = state.components.find((c) => c.id === id);
  if (!gone) return state;
  const operations = state.operations.map((op) =>
    op.lists.solidComponents?.includes(gone.key) ? { ...op, lists: { ...op.lists, solidComponents: op.lists.solidComponents.filter((k) => k !== gone.key) } } : op);
  return { ...state, components: state.components.filter((c) => c.id !== id), operations };
}

export function addMixtureSolvent(state: EditorState, solvent = "water"): EditorState {
  const row: MixtureSolventState = { id: newClientId("m"), solvent, volume: { value: "", unit: "mL" } };
  return { ...state, mixture: { ...state.mixture, solvents: [...state.mixture.solvents, row] } };
}

export function addMixtureReagent(state: EditorState, reagent = "water"): EditorState {
  const row: MixtureReagentState = { id: newClientId("m"), reagent, volume: { value: "", unit: "mL" } };
  return { ...state, mixture: { ...state.mixture, reagents: [...state.mixture.reagents, row] } };
}

export function updateMixtureRow(state: EditorState, id: string, patch: Partial<MixtureSolventState> | Partial<MixtureReagentState>): EditorState {
  return {
    ...state,
    mixture: {
      solvents: state.mixture.solvents.map((r) => (r.id === id ? { ...r, ...(patch as Partial<MixtureSolventState>) } : r)),
      reagents: state.mixture.reagents.map((r) => (r.id === id ? { ...r, ...(patch as Partial<MixtureReagentState>) } : r)),
    },
  };
}

export function removeMixtureRow(state: EditorState, id: string): EditorState {
  return { ...state, mixture: { solvents: state.mixture.solvents.filter((r) => r.id !== id), reagents: state.mixture.reagents.filter((r) => r.id !== id) } };
}

const indexOf = (state: EditorState, id: string) => state.operations.findIndex((op) => op.id === id);

/** Inserts a new step of `type` after step `afterId` (at the end when null); returns the state and the new id. */
export function addOperation(state: EditorState, type: OperationType, library: Library, afterId: string | null = null): { state: EditorState; id: string } {
  const at = afterId === null ? state.operations.length : indexOf(state, afterId) + 1;
  const op = newOperation(type, { mixture: state.mixture.solvents, before: state.operations.slice(0, at), library });
  const operations = [...state.operations.slice(0, at), op, ...state.operations.slice(at)];
  return { state: { ...state, operations }, id: op.id };
}

/** Inserts a step built beforehand (so the caller knows its id even if the edit runs twice). */
export function insertOperation(state: EditorState, op: OperationState, afterId: string | null = null): EditorState {
  const at = afterId === null ? state.operations.length : indexOf(state, afterId) + 1;
  return { ...state, operations: [...state.operations.slice(0, at), op, ...state.operations.slice(at)] };
}

function replaceOperation(state: EditorState, id: string, f: (op: OperationState) => OperationState): EditorState {
  return { ...state, operations: state.operations.map((op) => (op.id === id ? f(op) : op)) };
}

export function setOperationValue(state: EditorState, id: string, name: string, value: string): EditorState {
  return replaceOperation(state, id, (op) => ({ ...op, values: { ...op.values, [name]: value } }));
}

export function setOperationList(state: EditorState, id: string, name: string, list: string[]): EditorState {
  return replaceOperation(state, id, (op) => ({ ...op, lists: { ...op.lists, [name]: list } }));
}

export function setOperationType(state: EditorState, id: string, type: OperationType, library: Library): EditorState {
  const at = indexOf(state, id);
  return replaceOperation(state, id, (op) => changeOperationType(op, type, { mixture: state.mixture.solvents, before: state.operations.slice(0, at), library }));
}

/** Moves a step up (delta −1) or down (+1); a step at either end stays. */
export function moveOperation(state: EditorState, id: string, delta: -1 | 1): EditorState {
  const from = indexOf(state, id);
  const to = from + delta;
  if (from < 0 || to < 0 || to >= state.operations.length) return state;
  const operations = [...state.operations];
  const [op] = operations.splice(from, 1);
  operations.splice(to, 0, op as OperationState);
  return { ...state, operations };
}

export function duplicateStep(state: EditorState, id: string): { state: EditorState; id: string } {
  const at = indexOf(state, id);
  const op = state.operations[at];
  if (!op) return { state, id };
  const copy = duplicateOperation(op);
  return { state: { ...state, operations: [...state.operations.slice(0, at + 1), copy, ...state.operations.slice(at + 1)] }, id: copy.id };
}

export function removeOperation(state: EditorState, id: string): EditorState {
  return { ...state, operations: state.operations.filter((op) => op.id !== id) };
}

/** Stream names saved by the steps before step `id`, for a combine step's choices. */
export function savedStreamsBefore(state: EditorState, id: string): string[] {
  const at = indexOf(state, id);
  return state.operations.slice(0, at < 0 ? state.operations.length : at).map((op) => (op.values.saveAs ?? "").trim()).filter((s) => s !== "");
}
