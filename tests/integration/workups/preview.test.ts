// The editor's preview and the server's "check" prediction lay the group's values over the spec exactly as a save
// does, so what the chemist sees before saving is what the record stores.
import { beforeAll, expect, it } from "vitest";
import { simulateWorkup } from "@/lib/chem/predict";
import { addMeasurement } from "@/lib/partition/service";
import { applyGroupValues } from "@/lib/partition/overlay";
import { checkSpec } from "@/lib/workups-client/validate";
import { groupLibrary } from "@/lib/workups/library";
import { previewGroupValues, previewPrediction } from "@/lib/workups/preview";
import { createWorkup, type SavedWorkup } from "@/lib/workups/service";
import { describeEachDatabase } from "@/tests/integration/helpers/databases";
import { makeAcetanilide } from "@/tests/integration/jobs/fixtures";
import { acetanilideSpec, header, makeLab, withInterval, type Lab } from "./fixtures";

describeEachDatabase("prediction preview with the group's values", (t) => {
  let lab: Lab;
  let compoundId: string;
  let saved: SavedWorkup;
  const spec = acetanilideSpec(2);
  const links = () => [{ key: "acetanilide", compoundId }];

  beforeAll(async () => {
    lab = await makeLab(t.db, "Preview Lab");
    compoundId = (await makeAcetanilide(t.db, lab.groupId)).id;
    // An invented layer assay (50 : 1 between EtOAc and water at pH 7), far from the structure-based value, so the
    // group value visibly moves the prediction.
    await addMeasurement(t.db, lab.member, {
      compoundId, solventKey: "etoac", method: "layer_assay", aqueousPh: 7, basis: "amount", organic: 50, aqueous: 1, organicVolumeMl: 10, aqueousVolumeMl: 10,
    });
    saved = await withInterval(t.db, createWorkup(t.db, lab.member, { header: header({ title: "Acetanilide preview" }), spec, links: links() }));
  });

  it("gives the saved prediction, from the editor's links or from the saved workup's own", async () => {
    const stored = saved.prediction;
    const withLinks = await previewPrediction(t.db, lab.groupId, spec, { workupId: saved.id, links: links() });
    const fromWorkup = await previewPrediction(t.db, lab.groupId, spec, { workupId: saved.id });
    for (const preview of [withLinks, fromWorkup]) {
      expect(preview.productRecovery).toBeCloseTo(stored.productRecovery!, 12);
      expect(preview.recoveryLow).toBeCloseTo(stored.recoveryLow!, 12);
      expect(preview.recoveryHigh).toBeCloseTo(stored.recoveryHigh!, 12);
    }
    const bare = await previewPrediction(t.db, lab.groupId, spec, { workupId: saved.id, links: [] });
    expect(Math.abs(bare.productRecovery! - stored.productRecovery!)).toBeGreaterThan(0.01);
  });

  it("hands the browser the values that make its point prediction match the saved one", async () => {
    const values = await previewGroupValues(t.db, lab.groupId, links());
    expect(values["acetanilide"]?.logK["etoac"]).toMatchObject({ provenance: "group", n: 1 });
    const library = await groupLibrary(t.db, lab.groupId);
    const check = checkSpec(spec, library);
    if (!check.ok) throw new Error(JSON.stringify(check.issues));
    const live = simulateWorkup(applyGroupValues(check.spec, values), library);
    expect(live.recovery["acetanilide"]).toBeCloseTo(saved.prediction.productRecovery!, 9);
  });

  it("gives nothing for another group's compound and names a malformed link", async () => {
    const rival = await makeLab(t.db, "Rival Preview Lab");
    expect(await previewGroupValues(t.db, rival.groupId, links())).toEqual({});
    await expect(previewGroupValues(t.db, lab.groupId, [{ key: "", compoundId }])).rejects.toMatchObject({ fieldErrors: { "0.key": ["key is required"] } });
  });
});
