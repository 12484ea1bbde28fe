// Validation messages read in the form's words: the field's label (not its key), the unit typed beside it, and in
// the error summary the step or component the field belongs to.
import { describe, expect, it } from "vitest";
import { emptyEditorState, operationOf } from "@/lib/workups-client/from-spec";
import { placeMessages } from "@/lib/workups-client/field-errors";
import { compareFormOrder, fieldLabel, formOrder, inFormWords, summaryLine, wordedMessages } from "@/lib/workups-client/field-labels";
import { type EditorState } from "@/lib/workups-client/editor-types";
import { saveInput } from "@/lib/workups-client/to-spec";
import { checkSave } from "@/lib/workups-client/validate";
import { stepTypeWords } from "@/lib/workups-client/field-words";
import { mergeSnapshots } from "@/lib/workups-client/merge";
import { OPERATION_TYPES } from "@/lib/workups-client/operation-forms";
import { PURITY_METHODS, purityMethodWords } from "@/lib/workups/schemas";

function brokenState(): EditorState {
  const s = emptyEditorState("2026-11-02", "");
  const wash = operationOf({ type: "wash", reagent: "hcl_1m", volume: { value: -20, unit: "mL" }, portions: 0 });
  const ph = operationOf({ type: "adjust_ph", reagent: "", targetPh: 22 }, 1);
  const dry = operationOf({ type: "dry", agent: "mgso4", mass: { value: 3, unit: "g" }, rinse: { solvent: "etoac", volume: { value: 0, unit: "mL" } } }, 2);
  if (!wash || !ph || !dry) throw new Error("fixture");
  const solvents = s.mixture.solvents.map((m) => ({ ...m, volume: { value: "-1", unit: "mL" } }));
  return { ...s, header: { ...s.header, scaleMmol: "abc", notebookUrl: "ftp://files.example.org/1" }, mixture: { ...s.mixture, solvents }, operations: [wash, ph, dry] };
}

/** Every message of the form, as the editor shows it beside each field and in its summary, in form order. */
function summaryOf(state: EditorState): string[] {
  const placed = placeMessages(checkSave(saveInput(state), {}), state);
  return Object.keys(placed)
    .sort((a, b) => compareFormOrder(formOrder(a, state), formOrder(b, state)))
    .flatMap((key) => wordedMessages(key, placed[key] ?? [], state).map((m) => summaryLine(m, fieldLabel(key, state))));
}

describe("messages in the form's words", () => {
  it("name each field by its label, its step and its unit, top to bottom", () => {
    expect(summaryOf(brokenState())).toEqual([
      "Give the workup a title",
      "Notebook entry address must be a web address starting with http:// or https://",
      "Reaction scale must be a number (mmol)",
      "Components: At least one component is required",
      "Starting mixture: Volume of solvent 1 must be > 0 mL",
      "Step 1 (Wash): Volume per portion must be > 0 mL",
      "Step 1 (Wash): Portions must be ≥ 1",
      "Step 2 (Adjust pH): Acid or base is required",
      "Step 2 (Adjust pH): Target pH must be between −2 and 16",
      "Step 3 (Dry): Rinse volume must be > 0 mL",
    ]);
  });

  it("show no schema key, enum value or list index", () => {
    const text = summaryOf(brokenState()).join("\n");
    expect(text).not.toMatch(/\b[a-z]{2,}[A-Z]/); // camelCase keys such as targetPh, volumeMl (pH and pKa are words)
    expect(text).not.toMatch(/\b[a-z]+_[a-z_]+\b/); // snake_case such as adjust_ph, hcl_1m
    expect(text).not.toMatch(/\b\w+\.\d+\.\w+/); // paths such as operations.1.targetPh
  });

  it("keep a message that already starts with the label, and add the unit only to a bare number", () => {
    const name = { place: null, label: "Purity (mass %)", unit: null };
    expect(inFormWords("Purity must be ≤ 100 %", name, "purityPct")).toBe("Purity must be ≤ 100 %");
    expect(inFormWords("volume must be > 0", { place: null, label: "Volume", unit: "L" }, "volume")).toBe("Volume must be > 0 L");
    expect(inFormWords("volume must be ≤ 10 L", { place: null, label: "Volume", unit: "mL" }, "volume")).toBe("Volume must be ≤ 10 L");
    expect(inFormWords("volume per portion must be a number", { place: null, label: "Volume per portion", unit: "mL" }, "volume")).toBe("Volume per portion must be a number (mL)");
    // A message about something else than the field keeps its own subject.
    expect(inFormWords("no component 'x' in the spec", { place: null, label: "Amount", unit: null }, "amount")).toBe("No component 'x' in the spec");
  });

  it("use the unit the chemist chose beside the field", () => {
    const s = brokenState();
    const wash = s.operations[0]!;
    const inLitres = { ...s, operations: [{ ...wash, values: { ...wash.values, "volume:unit": "L" } }, ...s.operations.slice(1)] };
    expect(wordedMessages(`op:${wash.id}.volume`, ["volume per portion must be > 0"], inLitres)).toEqual(["Volume per portion must be > 0 L"]);
  });
});

describe("enum values reach the screen as words", () => {
  const INTERNAL = /_|\b[a-z]{2,}[A-Z]/;

  it("every operation type, purity method and step field the merge panel or history can name", () => {
    for (const t of OPERATION_TYPES) {
      expect(stepTypeWords(t.type)).not.toMatch(INTERNAL);
      expect(stepTypeWords(t.type)).toBe(t.label);
    }
    for (const m of PURITY_METHODS) expect(purityMethodWords(m)).not.toMatch(INTERNAL);
    // A method stored by a later version is still shown without its underscores.
    expect(purityMethodWords("karl_fischer")).toBe("karl fischer");
  });

  it("the merge panel labels steps and their fields with the editor's words", () => {
    const step = (volume: number) => ({ id: "s1", type: "adjust_ph", reagent: "hcl_1m", volume: { value: volume, unit: "mL" }, targetPh: 2 });
    const snap = (volume: number, targetPh: number) => ({
      header: { title: "t", performedOn: "2026-11-02", chemistId: null, notebookRef: "", notebookUrl: "", scaleMmol: null, expectedProductMmol: null, assayedProductMmol: null },
      spec: { components: [], mixture: { solvents: [] }, operations: [{ ...step(volume), targetPh }] },
      links: [],
    });
    const r = mergeSnapshots(snap(10, 2), snap(12, 2), snap(10, 3));
    expect(r.theirChanges.map((c) => c.label)).toEqual(["Step 1 (Adjust pH): Volume"]);
    expect(r.myChanges.map((c) => c.label)).toEqual(["Step 1 (Adjust pH): Target pH"]);
  });
});
