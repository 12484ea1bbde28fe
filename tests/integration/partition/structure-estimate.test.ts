// The partition page's estimate without group data is the engine's own: the Abraham model with its standard error
// where the compound's descriptors are known, the Collander line from log P otherwise.
import { beforeAll, expect, it } from "vitest";
import { ABRAHAM_SOLVENTS } from "@/lib/chem/data/abraham-solvents";
import { compoundPartition } from "@/lib/partition/queries";
import { addMeasurement } from "@/lib/partition/service";
import { describeEachDatabase } from "@/tests/integration/helpers/databases";
import { makeLab, type Lab } from "@/tests/integration/workups/fixtures";
import { makeAcetanilide } from "@/tests/integration/jobs/fixtures";

const measurement = (compoundId: string) => ({
  compoundId, solventKey: "etoac", method: "layer_assay", aqueousPh: 7, basis: "amount", organic: 3, aqueous: 1, organicVolumeMl: 10, aqueousVolumeMl: 10,
});

describeEachDatabase("partition page estimate", (t) => {
  let lab: Lab;
  let benzophenone: string;
  let acetanilide: string;
  beforeAll(async () => {
    lab = await makeLab(t.db, "Nernst Lab");
    // Benzophenone: measured Abraham descriptors (Bradley, Acree & Lang 2014 compilation); log P 3.18 (CRC
    // Handbook, octanol–water partition coefficients).
    benzophenone = (await t.db.compound.create({
      data: { groupId: lab.groupId, name: "Benzophenone", canonicalSmiles: "O=C(c1ccccc1)c1ccccc1", formula: "C13H10O", molarMass: 182.22, logP: 3.18, pKas: [] },
      select: { id: true },
    })).id;
    acetanilide = (await makeAcetanilide(t.db, lab.groupId)).id;
    for (const id of [benzophenone, acetanilide]) await addMeasurement(t.db, lab.member, measurement(id));
  });

  it("shows the Abraham estimate and its standard error for a compound with known descriptors", async () => {
    const etoac = (await compoundPartition(t.db, lab.groupId, benzophenone)).solvents.find((s) => s.solventKey === "etoac");
    expect(etoac?.structureEstimate?.origin).toBe("abraham");
    expect(etoac?.structureEstimate?.se).toBe(ABRAHAM_SOLVENTS.etoac?.se);
    expect(etoac?.structureEstimate?.label).toBe(`Abraham model (literature descriptors), ±${ABRAHAM_SOLVENTS.etoac?.se.toFixed(2)}`);
  });

  it("keeps the Collander line, now with its standard error, for a compound without descriptors", async () => {
    const etoac = (await compoundPartition(t.db, lab.groupId, acetanilide)).solvents.find((s) => s.solventKey === "etoac");
    expect(etoac?.structureEstimate?.origin).toBe("collander");
    expect(etoac?.structureEstimate?.label).toMatch(/^from literature log P via the solvent's Collander line, ±\d\.\d\d$/);
  });
});
