import { describe, expect, it } from "vitest";
import { emptyEditorState, operationOf } from "@/lib/workups-client/from-spec";
import { copiedHeader, scaleWorkup } from "@/lib/workups-client/template";
import { type EditorState } from "@/lib/workups-client/editor-types";

function state(): EditorState {
  const s = emptyEditorState("2026-11-02", "u-old");
  const wash = operationOf({ type: "wash", reagent: "hcl_1m", volume: { value: 20, unit: "mL" }, portions: 2 });
  const ph = operationOf({ type: "adjust_ph", reagent: "naoh_1m", targetPh: 12 });
  const dry = operationOf({ type: "dry", agent: "mgso4", mass: { value: 3, unit: "g" }, rinse: { solvent: "etoac", volume: { value: 10, unit: "mL" } } });
  if (!wash || !ph || !dry) throw new Error("fixture");
  return {
    ...s,
    header: { ...s.header, title: "Amide coupling workup", notebookRef: "LW-12-034", notebookUrl: "https://eln.example.org/entries/LW-12-034", scaleMmol: "5", expectedProductMmol: "5", assayedProductMmol: "4.6" },
    operations: [wash, ph, dry],
    settings: { ...s.settings, funnel: { value: "125", unit: "mL" } },
  };
}

describe("copy as new", () => {
  it("clears the notebook reference, its address and the assay, dates it today and gives it to the person copying", () => {
    const h = copiedHeader(state().header, "2026-12-03", "u-new");
    expect(h).toMatchObject({ title: "Amide coupling workup (copy)", performedOn: "2026-12-03", chemistId: "u-new", notebookRef: "", notebookUrl: "", assayedProductMmol: "", scaleMmol: "5" });
  });
});

describe("scale to…", () => {
  it("scales amounts, masses and volumes by new/old scale and keeps portions and the pH target", () => {
    const r = scaleWorkup(state(), 20);
    expect(r?.factor).toBe(4);
    const [wash, ph, dry] = r?.state.operations ?? [];
    expect(wash?.values).toMatchObject({ volume: "80", portions: "2" });
    expect(ph?.values["targetPh"]).toBe("12");
    expect(dry?.values).toMatchObject({ mass: "12", "rinse.volume": "40" });
    expect(r?.state.mixture.solvents[0]?.volume.value).toBe("200");
    expect(r?.state.header).toMatchObject({ scaleMmol: "20", expectedProductMmol: "20", assayedProductMmol: "" });
  });

  it("names the steps whose portion outgrows the funnel", () => {
    // 20 mL × 8 = 160 mL a portion in a 125 mL funnel.
    expect(scaleWorkup(state(), 40)?.overFunnel).toEqual([{ step: 1, portionMl: 160 }]);
  });

  it("refuses without a known current scale or with a new scale of zero", () => {
    const s = state();
    expect(scaleWorkup({ ...s, header: { ...s.header, scaleMmol: "" } }, 10)).toBeNull();
    expect(scaleWorkup(s, 0)).toBeNull();
  });
});
