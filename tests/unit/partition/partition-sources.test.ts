/**
 * A prediction's partition sources show the value the engine used: for a component with measured Abraham
 * descriptors (benzophenone: Bradley, Acree & Lang 2014 compilation) the Abraham model with its standard error,
 * not the Collander line from log P (3.18, CRC Handbook octanol–water table).
 */
import { describe, expect, it } from "vitest";
import { SOLVENTS } from "@/lib/chem/data/solvents";
import { solventLogK } from "@/lib/chem/partition";
import { workupInputSchema } from "@/lib/chem/schema";
import { partitionSources } from "@/lib/partition/overlay";

const spec = workupInputSchema.parse({
  components: [{ key: "k", name: "Benzophenone", role: "product", molarMass: 182.22, amount: { value: 5, unit: "mmol" }, smiles: "O=C(c1ccccc1)c1ccccc1",
    logP: { value: 3.18, provenance: "literature" } }],
  mixture: { solvents: [{ solvent: "etoac", volume: { value: 50, unit: "mL" } }] },
  operations: [{ type: "wash", reagent: "water", volume: { value: 20, unit: "mL" } }],
});

describe("partition sources for a component with measured descriptors", () => {
  it("report the Abraham value the engine used, labelled with its standard error", () => {
    const [source] = partitionSources(spec, SOLVENTS);
    const used = solventLogK(spec.components[0]!, SOLVENTS.etoac!, SOLVENTS);
    expect(used?.origin).toBe("abraham");
    expect(source).toMatchObject({ component: "k", solvent: "etoac", origin: "abraham", logK: used?.value, se: used?.se });
    expect(source?.label).toBe(`Abraham model (literature descriptors), ±${used?.se.toFixed(2)}`);
  });
});
