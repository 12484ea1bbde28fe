// The engine budget's estimate: portion-steps × (components + 4) × (draws + 1), and the result table
// (portion-steps × components), counted from a spec's shape alone.
import { describe, expect, it } from "vitest";
import { engineCost, MAX_ENGINE_UNITS, MAX_RESULT_CELLS, overBudgetField, overBudgetMessage } from "@/lib/workers/cost";

const spec = (components: number, operations: { type: string; portions?: number }[]) => ({
  components: Array.from({ length: components }, (_, i) => ({ key: `c${i}` })),
  operations,
});

describe("engineCost", () => {
  it("counts each portion of a wash, extraction or back-extraction, and other steps once", () => {
    const s = spec(4, [{ type: "wash", portions: 2 }, { type: "extract", portions: 3 }, { type: "back_extract" }, { type: "dry", portions: 9 }, { type: "concentrate" }]);
    expect(engineCost(s, 0)).toEqual({ components: 4, portionSteps: 2 + 3 + 1 + 1 + 1, draws: 0, units: 8 * 8 * 1, cells: 32 });
    expect(engineCost(s, 300).units).toBe(8 * 8 * 301);
  });

  it("never throws on a shape the schema would refuse", () => {
    expect(engineCost(null, 10)).toMatchObject({ components: 0, portionSteps: 0, units: 0 });
    expect(engineCost({ components: "x", operations: [null, 3, { type: "wash", portions: -1 }] }, 0).portionSteps).toBe(3);
  });
});

describe("refusal", () => {
  it("is silent within both limits and names the result table first when it is too large", () => {
    expect(overBudgetMessage(engineCost(spec(4, [{ type: "wash", portions: 2 }]), 2000))).toBeNull();
    const huge = engineCost(spec(50, Array.from({ length: 200 }, () => ({ type: "wash", portions: 50 }))), 2000);
    expect(huge.cells).toBeGreaterThan(MAX_RESULT_CELLS);
    expect(overBudgetMessage(huge)).toMatch(/= 500,000 results; the limit is 20,000\./);
  });

  it("blames the draws when the point prediction alone fits", () => {
    const s = spec(20, Array.from({ length: 20 }, () => ({ type: "wash", portions: 2 })));
    expect(engineCost(s, 2000).units).toBeGreaterThan(MAX_ENGINE_UNITS);
    expect(overBudgetField(s, 2000, "spec", "draws")).toBe("draws");
    expect(overBudgetField(s, 2000, "spec", null)).toBe("spec");
    expect(overBudgetMessage(engineCost(s, 2000))).toBe(
      "This prediction is too large to run on the server: 40 steps (counting each portion) × (20 components + 4) × (2,000 draws + 1) = " +
        "1,920,960 work units; the limit is 600,000. Use fewer draws, portions, steps or components.",
    );
  });
});
