// A stored spec that carries keys an older version accepted opens in the editor and saves under today's strict
// schema: the unknown keys are left behind on loading (no field could show or remove them), everything else stays.
import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { workupInputSchema } from "@/lib/chem/schema";
import { type JsonObject } from "@/lib/workups/record";
import { editorStateOf } from "@/lib/workups-client/from-spec";
import { saveInput, specInput } from "@/lib/workups-client/to-spec";
import { createWorkupSchema } from "@/lib/workups/schemas";

const header = { title: "t", performedOn: "2026-11-02", chemistId: null, notebookRef: "", scaleMmol: null, expectedProductMmol: null, assayedProductMmol: null };
const example = () => JSON.parse(fs.readFileSync(path.resolve("examples/acid-base-separation.json"), "utf8")) as JsonObject;

describe("a stored spec with keys the schema no longer knows", () => {
  it("opens in the editor without them and saves", () => {
    const stored = example();
    stored.legacyNote = "typed by hand";
    const ops = stored.operations as JsonObject[];
    (ops[0] as JsonObject).shakeSeconds = 30;
    ((stored.components as JsonObject[])[0] as JsonObject).colour = "white";
    expect(workupInputSchema.safeParse(stored).success).toBe(false);
    const state = editorStateOf(header, stored, []);
    const spec = specInput(state);
    expect(spec.legacyNote).toBeUndefined();
    expect(((spec.operations as JsonObject[])[0] as JsonObject).shakeSeconds).toBeUndefined();
    const saved = createWorkupSchema.safeParse(saveInput(state));
    expect(saved.success).toBe(true);
    expect(workupInputSchema.parse(spec)).toEqual(workupInputSchema.parse(example()));
  });

  it("keeps each step's id, which the strict schema accepts and the engine never sees", () => {
    const spec = specInput(editorStateOf(header, example(), []));
    const ids = (spec.operations as JsonObject[]).map((op) => op.id);
    expect(ids.every((id) => typeof id === "string" && id.length > 0)).toBe(true);
    const parsed = workupInputSchema.parse(spec);
    expect(parsed.operations.some((op) => "id" in op)).toBe(false);
  });
});
