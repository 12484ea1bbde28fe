/**
 * The editor's form state. Inputs hold what the chemist typed (strings), so a half-typed number never loses
 * characters; to-spec.ts turns the state into the shared zod schemas' input, which is what decides validity.
 * Every list item carries a client id so focus, keys and validation messages follow it when steps move.
 */
import { type ComponentRole, type OperationType, type Provenance } from "@/lib/chem/schema";
import type { JsonObject } from "@/lib/workups/record";

/** A typed number with its unit, as entered. */
export interface Quantity {
  value: string;
  unit: string;
}

export interface HeaderState {
  title: string;
  /** YYYY-MM-DD. */
  performedOn: string;
  /** "" when not recorded. */
  chemistId: string;
  notebookRef: string;
  /** Address of the electronic notebook entry, as typed. */
  notebookUrl: string;
  /** mmol, as typed. */
  scaleMmol: string;
  expectedProductMmol: string;
  assayedProductMmol: string;
}

export interface LogValueState {
  value: string;
  provenance: Provenance;
  source: string;
  /** Kept as loaded (standard error, number of pooled observations); not edited here. */
  se?: number;
  n?: number;
}

export interface PKaState {
  id: string;
  value: string;
  kind: "acid" | "base";
  provenance: Provenance;
  source: string;
  se?: number;
}

export interface ComponentState {
  id: string;
  key: string;
  name: string;
  role: ComponentRole;
  molarMass: string;
  amount: Quantity;
  smiles: string;
  /** The registered compound this component is (a link saved beside the spec), or null. */
  compoundId: string | null;
  logP: LogValueState | null;
  pKas: PKaState[];
  /** Spec fields the form does not edit (logK, bpC, tags, …), carried through unchanged. */
  extra: JsonObject;
  /** The key follows the name until the record is saved (keys of saved components never change: history diffs by key). */
  autoKey?: boolean;
}

export interface MixtureSolventState {
  id: string;
  solvent: string;
  volume: Quantity;
}

export interface MixtureReagentState {
  id: string;
  reagent: string;
  volume: Quantity;
}

/**
 * One operation. `values` holds scalar fields by name; a quantity `volume` is `values.volume` with its unit in
 * `values["volume:unit"]`; nested fields use dots (`rinse.solvent`, `reactive.amount`). `lists` holds the
 * multi-choice fields (saved streams to combine, components that are solid).
 */
export interface OperationState {
  id: string;
  type: OperationType;
  values: Record<string, string>;
  lists: Record<string, string[]>;
  extra: JsonObject;
}

export interface SettingsState {
  name: string;
  temperature: Quantity;
  funnel: Quantity;
  extra: JsonObject;
}

export interface EditorState {
  header: HeaderState;
  components: ComponentState[];
  mixture: { solvents: MixtureSolventState[]; reagents: MixtureReagentState[] };
  operations: OperationState[];
  settings: SettingsState;
}

export const unitKey = (field: string) => `${field}:unit`;
