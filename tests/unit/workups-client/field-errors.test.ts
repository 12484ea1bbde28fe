// Validation messages land beside the field they are about, following the row's client id (not its index).
import { describe, expect, it } from "vitest";
import { DEFAULT_LIBRARY } from "@/lib/chem/library";
import { addOperation, moveOperation, setOperationValue } from "@/lib/workups-client/editor-actions";
import { countUnder, fieldKeyOf, placeMessages, placeServerErrors } from "@/lib/workups-client/field-errors";
import { emptyEditorState } from "@/lib/workups-client/from-spec";
import { saveInput } from "@/lib/workups-client/to-spec";
import { checkSave } from "@/lib/workups-client/validate";

function twoSteps() {
  let s = emptyEditorState("2026-11-02", "");
  const a = addOperation(s, "wash", DEFAULT_LIBRARY);
  const b = addOperation(a.state, "extract", DEFAULT_LIBRARY);
  s = b.state;
  return { state: s, washId: a.id, extractId: b.id };
}

describe("fieldKeyOf", () => {
  const { state, washId, extractId } = twoSteps();
  it.each([
    ["header.title", "header.title"],
    ["spec.operations.0.volume.value", `op:${washId}.volume`],
    ["spec.operations.1.volume.unit", `op:${extractId}.volume`],
    ["operations.1.rinse.volume.value", `op:${extractId}.rinse.volume`],
    ["spec.operations.0.streams.2", `op:${washId}.streams`],
    ["spec.operations.0", `op:${washId}`],
    ["spec.operations.7.volume.value", "operations"],
    ["spec.mixture.solvents.0.volume.value", `mix:${state.mixture.solvents[0]?.id}.volume`],
    ["spec.mixture.solvents", "mixture"],
    ["spec.funnel.value", "settings.funnel"],
    ["links.0.key", "form"],
    ["", "form"],
  ])("%s → %s", (path, key) => {
    expect(fieldKeyOf(path, state)).toBe(key);
  });
});

describe("messages follow the step when it moves", () => {
  it("places a blank wash volume on the wash after the wash moved below the extraction", () => {
    const { state, washId } = twoSteps();
    const blank = setOperationValue(moveOperation(state, washId, 1), washId, "volume", "");
    const issues = checkSave(saveInput(blank), {});
    const placed = placeMessages(issues, blank);
    expect(placed[`op:${washId}.volume`]).toEqual(["volume per portion must be a number"]);
    expect(countUnder(placed, `op:${washId}`)).toBe(1);
  });

  it("places the server's 422 field errors the same way", () => {
    const { state, extractId } = twoSteps();
    const placed = placeServerErrors({ "spec.operations.1.portions": ["portions must be ≤ 50"], _form: ["Some fields need attention."] }, state);
    expect(placed[`op:${extractId}.portions`]).toEqual(["portions must be ≤ 50"]);
    expect(placed.form).toEqual(["Some fields need attention."]);
  });
});
