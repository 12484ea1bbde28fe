/**
 * The demo group's own partition measurements, entered through the same service as the partition page (conversion to
 * the neutral log K, audit, re-validation job). The figures are INVENTED for the demo: plausible layer amounts for
 * the scenario's molecules, not literature data. Called before the workups are saved, so their predictions use the
 * group values from the start; seed/load.ts then drains the queue (lib/jobs/worker.ts drainQueue) so the first
 * start also shows what the engine learns from the reported outcomes.
 */
import type { Db } from "@/lib/db/client";
import { addMeasurement } from "@/lib/partition/service";
import type { MeasurementInputRaw } from "@/lib/partition/schemas";
import { type CompoundFacts } from "./generate";

type DemoMeasurement = { compound: string; daysAgo: number } & Omit<MeasurementInputRaw, "compoundId">;

const concentrations = (organic: number, aqueous: number) => ({ basis: "concentration" as const, organic, aqueous });

export const demoMeasurements: DemoMeasurement[] = [
  // Caffeine between DCM and water: three shake-flask runs (HPLC of both phases), as a group would before switching solvent.
  { compound: "caffeine", daysAgo: 120, solventKey: "dcm", method: "shake_flask", aqueousPh: 6.8, temperatureC: 22, ...concentrations(4.2, 1.0), notes: "HPLC, both phases, 1:1 volumes" },
  { compound: "caffeine", daysAgo: 118, solventKey: "dcm", method: "shake_flask", aqueousPh: 6.9, temperatureC: 22, ...concentrations(3.5, 1.0), notes: "HPLC, both phases, 1:2 volumes" },
  { compound: "caffeine", daysAgo: 60, solventKey: "dcm", method: "shake_flask", aqueousPh: 7.0, temperatureC: 21, ...concentrations(5.0, 1.0), notes: "repeat with fresh stock" },
  // Caffeine into EtOAc: both layers of a routine extraction assayed by qNMR.
  { compound: "caffeine", daysAgo: 45, solventKey: "etoac", method: "layer_assay", aqueousPh: 7.2, temperatureC: 21, basis: "amount",
    organic: 12.4, aqueous: 29.0, organicVolumeMl: 30, aqueousVolumeMl: 50, totalAmount: 41.0, notes: "mg by qNMR, 1,3,5-trimethoxybenzene standard" },
  // Lidocaine free base into hexane from a basified layer (pH 11.5, well above the pKaH 7.9).
  { compound: "lidocaine", daysAgo: 30, solventKey: "hexane", method: "layer_assay", aqueousPh: 11.5, temperatureC: 20, basis: "amount",
    organic: 98.0, aqueous: 2.1, organicVolumeMl: 15, aqueousVolumeMl: 30, notes: "mg by HPLC" },
  { compound: "acetanilide", daysAgo: 20, solventKey: "etoac", method: "shake_flask", aqueousPh: 7.0, temperatureC: 22, ...concentrations(14.8, 1.0), notes: "UV at 242 nm, both phases" },
];

export async function seedPartition(db: Db, groupId: string, userId: string, compounds: ReadonlyMap<string, CompoundFacts>): Promise<number> {
  let count = 0;
  for (const { compound, daysAgo, ...measurement } of demoMeasurements) {
    const facts = compounds.get(compound);
    if (!facts) throw new Error(`seed: compound ${compound} is not registered`);
    const added = await addMeasurement(db, { groupId, userId }, { ...measurement, compoundId: facts.id });
    // Spread the measurements over the past months, so the pooled value has a history to show.
    await db.partitionObservation.updateMany({ where: { id: added.id, groupId }, data: { createdAt: new Date(Date.now() - daysAgo * 86_400_000) } });
    count++;
  }
  return count;
}
