/**
 * A closed-form stand-in for the engine, for testing the fit and uncertainty algorithms apart from the engine:
 * one organic layer (the mixture's first solvent) washed by each `wash` operation at a fixed pH; each
 * component's kept fraction per portion is 1/(1 + V_w/(D·V_org)) with D from log K (or log P) and, for an
 * acid, D = K/(1 + 10^(pH − pKa)) (Henderson–Hasselbalch; Scherrer & Howard, J. Med. Chem. 1977, 20, 53). Volumes are taken as given.
 */
import type { WorkupInput } from "@/lib/chem/schema";
import type { WorkupPrediction } from "@/lib/chem/types";

export function toySimulator(washPh: number) {
  return (input: WorkupInput): WorkupPrediction => {
    const solvent = input.mixture.solvents[0]?.solvent ?? "etoac";
    const vOrg = input.mixture.solvents[0]?.volumeMl ?? 50;
    const remaining: Record<string, number> = {};
    const steps: WorkupPrediction["steps"] = [];
    for (const c of input.components) remaining[c.key] = c.amountMmol;
    input.operations.forEach((op, i) => {
      if (op.type !== "wash") return;
      const distributionRatio: Record<string, number> = {};
      for (const c of input.components) {
        const logK = c.logK[solvent]?.value ?? c.logP?.value ?? 0;
        const acid = c.pKas.find((p) => p.kind === "acid");
        const d = 10 ** logK / (acid ? 1 + 10 ** (washPh - acid.value) : 1);
        distributionRatio[c.key] = d;
        remaining[c.key] = (remaining[c.key] ?? 0) * (1 + op.volumeMl / (d * vOrg)) ** -op.portions;
      }
      steps.push({
        index: i + 1, type: "wash", label: op.reagent, details: {}, sideStreams: [],
        kept: { kind: "organic", volumeMl: vOrg, solventsMl: { [solvent]: vOrg }, components: { ...remaining } },
        contacts: [{
          portion: 1, densityDifference: -0.1, co2Mmol: 0, co2GasMl: 0, heatKJ: 0, temperatureRiseK: 0, capacityExceeded: false, reagentPh: washPh,
          phases: [
            { kind: "organic", volumeMl: vOrg, densityGPerMl: 0.9, position: "top", pH: null, ionicStrength: null, solventsMl: { [solvent]: vOrg },
              components: {}, distributionRatio },
            { kind: "aqueous", volumeMl: op.volumeMl, densityGPerMl: 1, position: "bottom", pH: washPh, ionicStrength: 0, solventsMl: { water: op.volumeMl },
              components: Object.fromEntries(input.components.map((c) => [c.key, { neutral: 0.1, charged: 0 }])) },
          ],
        }],
      });
    });
    const recovery = Object.fromEntries(input.components.map((c) => [c.key, (remaining[c.key] ?? 0) / c.amountMmol]));
    return {
      engineVersion: "toy", steps, recovery, purityPct: Object.fromEntries(input.components.map((c) => [c.key, 100 / input.components.length])),
      isolated: { kind: "organic", volumeMl: vOrg, solventsMl: {}, components: remaining },
      components: [], crudeMassMg: input.components.reduce((s, c) => s + (remaining[c.key] ?? 0) * c.molarMass, 0),
      residualSolventsMg: {}, productKey: null, sideStreams: [], flags: [], cautions: [],
    };
  };
}
