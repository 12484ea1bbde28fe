// The editor state must carry a spec through unchanged: loading a saved spec into the form and sending it back gives
// the same parsed workup. Inputs are the repository's example workups (examples/*.json).
import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { workupInputSchema } from "@/lib/chem/schema";
import { type JsonObject } from "@/lib/workups/record";
import { editorStateOf, emptyEditorState } from "@/lib/workups-client/from-spec";
import { parseNumber, saveInput, specInput } from "@/lib/workups-client/to-spec";
import { checkSave, checkSpec } from "@/lib/workups-client/validate";

const dir = path.resolve("examples");
const examples = fs.readdirSync(dir).filter((f) => f.endsWith(".json"));
const header = { title: "t", performedOn: "2026-11-02", chemistId: null, notebookRef: "", scaleMmol: null, expectedProductMmol: null, assayedProductMmol: null };

describe("editor state round trip", () => {
  it.each(examples)("%s parses the same after a trip through the form", (file) => {
    const spec = JSON.parse(fs.readFileSync(path.join(dir, file), "utf8")) as JsonObject;
    const state = editorStateOf(header, spec, []);
    expect(state.operations).toHaveLength((spec.operations as unknown[]).length);
    const original = workupInputSchema.parse(spec);
    const back = workupInputSchema.parse(specInput(state));
    expect(back).toEqual(original);
  });

  it("keeps compound links by component key", () => {
    const spec = JSON.parse(fs.readFileSync(path.join(dir, examples[0] as string), "utf8")) as JsonObject;
    const key = ((spec.components as JsonObject[])[0] as JsonObject).key as string;
    const state = editorStateOf(header, spec, [{ key, compoundId: "cmp1" }]);
    expect(saveInput(state).links).toEqual([{ key, compoundId: "cmp1" }]);
  });
});

describe("numbers as typed", () => {
  it.each([["1.5", 1.5], ["1,5", 1.5], [" 20 ", 20], ["", undefined], ["-", Number.NaN], ["1e3", 1000]])("%j → %j", (text, expected) => {
    expect(parseNumber(text)).toEqual(expected);
  });
});

describe("a blank form", () => {
  it("is refused with messages that name the missing parts", () => {
    const state = emptyEditorState("2026-11-02", "");
    const issues = checkSave(saveInput(state), {});
    const messages = issues.map((i) => `${i.path}: ${i.message}`);
    expect(messages).toContain("header.title: Give the workup a title");
    expect(messages).toContain("spec.components: at least one component is required");
    expect(messages).toContain("spec.operations: at least one operation is required");
  });

  it("reports a solvent missing from the library under its field", () => {
    const spec = JSON.parse(fs.readFileSync(path.join(dir, "acid-base-separation.json"), "utf8")) as JsonObject;
    (((spec.mixture as JsonObject).solvents as JsonObject[])[0] as JsonObject).solvent = "ethyl_acetate";
    const check = checkSpec(spec, {});
    expect(check.ok).toBe(false);
    if (!check.ok) expect(check.issues).toContainEqual({ path: "spec.mixture.solvents.0.solvent", message: "unknown solvent 'ethyl_acetate'" });
  });
});
