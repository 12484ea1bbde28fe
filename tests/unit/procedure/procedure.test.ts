import { describe, expect, it } from "vitest";
import { operationSchema } from "@/lib/chem/schema-operations";
import { DRYING_AGENTS } from "@/lib/chem/data/drying-agents";
import { REAGENTS } from "@/lib/chem/data/reagents";
import { SOLVENTS } from "@/lib/chem/data/solvents";
import { lexiconKeys } from "@/lib/procedure/lexicon";
import { clausesToCheck, readProcedure } from "@/lib/procedure/parse";
import { renderProcedure } from "@/lib/procedure/render";
import { CORPUS } from "./corpus";
import { clean, score } from "./score";

describe("procedure text in", () => {
  it("reads the corpus clause by clause: at least 95 % exact, nothing misread, every unsure clause reported", () => {
    const { total, failures } = score(CORPUS);
    expect(CORPUS.length).toBeGreaterThanOrEqual(60);
    expect(failures).toEqual([]);
    expect(total.misread).toBe(0);
    expect(total.exact / (total.clauses - total.reported)).toBeGreaterThanOrEqual(0.95);
  });

  it("links every clause to the text it came from", () => {
    const text = CORPUS[0]?.text ?? "";
    for (const c of readProcedure(text).clauses) expect(text.slice(c.start, c.end)).toBe(c.text);
  });

  it("proposes steps the engine's schema accepts once their missing values are filled", () => {
    for (const entry of CORPUS) {
      const reading = readProcedure(entry.text);
      const incomplete = new Set(reading.clauses.filter((c) => c.outcome === "incomplete").flatMap((c) => c.steps));
      reading.steps.forEach((step, i) => {
        if (incomplete.has(i)) return;
        const parsed = operationSchema.safeParse(step);
        expect(parsed.success, `${JSON.stringify(step)} from "${entry.text.slice(0, 50)}"`).toBe(true);
      });
    }
  });

  it("reports a strength the library has no solution for instead of rounding it", () => {
    const reading = readProcedure("The organic layer was washed with 0.5 M HCl (2 × 20 mL).");
    expect(reading.steps).toEqual([]);
    expect(clausesToCheck(reading).map((c) => c.message)).toEqual(["0.5 M HCl is not a solution in the reagent library"]);
  });

  it("reports a wash with no volume as a step that still needs one", () => {
    const reading = readProcedure("The solution was washed with brine, dried (MgSO4) and concentrated.");
    expect(clausesToCheck(reading)).toMatchObject([{ text: "The solution was washed with brine", outcome: "incomplete" }]);
  });

  it("reads ×, x, X and the (20 mL × 3) order alike", () => {
    const forms = ["(3 × 20 mL)", "(3 x 20 mL)", "(3 X 20 mL)", "(20 mL × 3)", "(20 mL x 3)"];
    for (const f of forms) {
      expect(readProcedure(`The mixture was extracted with EtOAc ${f}.`).steps).toEqual([{ type: "extract", solvent: "etoac", volume: { value: 20, unit: "mL" }, portions: 3 }]);
    }
  });

  it("only produces library keys the engine knows", () => {
    const keys = lexiconKeys();
    for (const k of [...keys.solvents, ...keys.cosolvents]) expect(SOLVENTS[k], k).toBeDefined();
    for (const k of keys.reagents) expect(REAGENTS[k], k).toBeDefined();
    for (const k of keys.agents) expect(DRYING_AGENTS[k], k).toBeDefined();
  });
});

describe("procedure text out", () => {
  it("round trip text → steps → text → steps is stable for every fully read corpus paragraph", () => {
    let checked = 0;
    for (const entry of CORPUS) {
      const first = readProcedure(entry.text);
      if (clausesToCheck(first).length > 0) continue;
      const text = renderProcedure(first.steps);
      const second = readProcedure(text);
      expect(clausesToCheck(second), text).toEqual([]);
      expect(second.steps.map(clean), text).toEqual(first.steps.map(clean));
      expect(renderProcedure(second.steps)).toBe(text);
      checked += 1;
    }
    expect(checked).toBeGreaterThan(50);
  });

  it("writes a journal-style paragraph", () => {
    const steps = readProcedure(CORPUS[0]?.text ?? "").steps;
    expect(renderProcedure(steps)).toBe(
      "The mixture was diluted with EtOAc (50 mL), washed with 1 M HCl (2 × 20 mL), sat. aq. NaHCO₃ (20 mL) and brine (20 mL), dried (MgSO₄), filtered and concentrated under reduced pressure.");
  });
});
