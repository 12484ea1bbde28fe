// The per-step pictures: product trail closes the mass balance at every step; layers are stacked as the engine says
// and drawn to one volume scale. Inputs: the repository's example workups run through the engine.
import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { predictWorkup } from "@/lib/chem/predict";
import { type WorkupInputRaw } from "@/lib/chem/schema";
import { drawingCapacityMl, layerBoxes, MIN_LAYER_HEIGHT, phaseShares } from "@/lib/workups-client/funnel-geometry";
import { productTrail } from "@/lib/workups-client/product-trail";

const load = (f: string) => JSON.parse(fs.readFileSync(path.resolve("examples", f), "utf8")) as WorkupInputRaw & { operations: { type: string; streams?: string[] }[] };

describe("product trail", () => {
  it.each(["acid-base-separation.json", "amine-back-extraction.json", "saponification-ph-swing.json"])("%s: kept + saved + lost = 1 at every step", (file) => {
    const raw = load(file);
    const p = predictWorkup(raw);
    const key = p.productKey as string;
    const start = p.components.find((c) => c.key === key)?.startMmol as number;
    const combined = new Map(raw.operations.flatMap((op, i) => (op.type === "combine" ? [[i + 1, op.streams ?? []] as const] : [])));
    const trail = productTrail(p.steps, key, start, combined);
    expect(trail).toHaveLength(p.steps.length);
    for (const t of trail) {
      const total = t.kept + t.saved + Object.values(t.lost).reduce((a, b) => a + b, 0);
      expect(total).toBeCloseTo(1, 6);
    }
    expect(trail.at(-1)?.kept).toBeCloseTo(p.recovery[key] as number, 9);
  });

  it("is empty without a starting amount", () => {
    expect(productTrail([], "x", 0, new Map())).toEqual([]);
  });
});

describe("funnel geometry", () => {
  const p = predictWorkup(load("acid-base-separation.json"));
  const contact = p.steps[0]?.contacts[0];

  it("stacks the organic layer on top when the engine says it floats, heights in proportion to volume", () => {
    const phases = contact?.phases ?? [];
    const boxes = layerBoxes(phases, 100, 0, 200);
    const top = boxes.find((b) => b.position === "top");
    const bottom = boxes.find((b) => b.position === "bottom");
    expect(top?.kind).toBe(phases.find((ph) => ph.position === "top")?.kind);
    expect((top?.y ?? 0) + (top?.height ?? 0)).toBeCloseTo(bottom?.y ?? -1, 9);
    expect((top?.height ?? 0) / (bottom?.height ?? 1)).toBeCloseTo((top?.volumeMl ?? 0) / (bottom?.volumeMl ?? 1), 6);
  });

  it("keeps a tiny layer visible and uses the funnel size when it is the larger", () => {
    const tiny = layerBoxes([{ ...(contact?.phases[0] as NonNullable<typeof contact>["phases"][number]), volumeMl: 0.01 }], 1000, 0, 100);
    expect(tiny[0]?.height).toBe(MIN_LAYER_HEIGHT);
    expect(drawingCapacityMl(p.steps, 5000)).toBe(5000);
    expect(drawingCapacityMl(p.steps)).toBeGreaterThan(70);
  });

  it("splits each component between the phases (shares sum to 1)", () => {
    const shares = phaseShares(contact?.phases ?? [], p.productKey as string);
    expect(shares.reduce((a, s) => a + s.share, 0)).toBeCloseTo(1, 9);
  });
});
