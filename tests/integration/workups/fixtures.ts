// Specs, headers and people for the workup tests, written through the data layer (no mocks). Names are invented;
// the molecules and their properties are real and cited in the example files or beside the values below.
import fs from "node:fs";
import path from "node:path";
import { type Db } from "@/lib/db/client";
import { type WorkupInputRaw } from "@/lib/chem/schema";
import { drainQueue } from "@/lib/jobs/worker";
import { type Actor } from "@/lib/workups/context";
import { type SavedWorkup } from "@/lib/workups/service";
import { makeGroup, makeMember } from "@/tests/integration/auth/fixtures";

export type ExampleName = "acid-base-separation" | "amine-back-extraction" | "saponification-ph-swing";

export function exampleSpec(name: ExampleName = "acid-base-separation"): WorkupInputRaw {
  return JSON.parse(fs.readFileSync(path.resolve("examples", `${name}.json`), "utf8")) as WorkupInputRaw;
}

/**
 * Acetanilide taken from water into ethyl acetate: one neutral, moderately polar product whose recovery depends on
 * its log P and on the number of extractions, which is what the cause ranking needs to tell apart.
 * Acetanilide: M = 135.17 g/mol, log P 1.16 (PhysProp experimental log Kow, from memory).
 */
export function acetanilideSpec(portions = 2): WorkupInputRaw {
  return {
    name: "Acetanilide from water into EtOAc",
    components: [{
      key: "acetanilide", name: "Acetanilide", role: "product", smiles: "CC(=O)Nc1ccccc1", molarMass: 135.17,
      amount: { value: 5, unit: "mmol" }, logP: { value: 1.16, provenance: "literature", source: "PhysProp experimental log Kow (from memory)", se: 0.1 },
      pKas: [],
    }],
    mixture: { solvents: [{ solvent: "water", volume: { value: 60, unit: "mL" } }] },
    operations: [
      { type: "extract", solvent: "etoac", volume: { value: 10, unit: "mL" }, portions, keep: "organic", label: "extract into EtOAc" },
      { type: "dry", agent: "na2so4", mass: { value: 3, unit: "g" } },
      { type: "concentrate", method: "rotavap", bath: { value: 40, unit: "°C" } },
    ],
  };
}

export function header(overrides: Record<string, unknown> = {}) {
  return { title: "Benzanilide wash sequence", performedOn: "2026-11-03", notebookRef: "AB-12/041", scaleMmol: 5, expectedProductMmol: 5, ...overrides };
}

export interface Lab {
  groupId: string;
  lead: Actor & { name: string };
  member: Actor & { name: string };
  viewer: Actor & { name: string };
}

export async function makeLab(db: Db, name: string): Promise<Lab> {
  const group = await makeGroup(db, name);
  const person = async (role: "lead" | "member" | "viewer", who: string) => {
    const { user } = await makeMember(db, group.id, role, who);
    return { groupId: group.id, userId: user.id, name: user.name };
  };
  return { groupId: group.id, lead: await person("lead", `${name} Lead`), member: await person("member", `${name} Chemist`), viewer: await person("viewer", `${name} Viewer`) };
}

/** Row counts of everything a workup write touches, to assert that a refused request changed nothing. */
export async function footprint(db: Db) {
  const [workups, versions, predictions, outcomes, components, audits, compounds, jobs] = await Promise.all([
    db.workup.count(), db.workupVersion.count(), db.prediction.count(), db.outcome.count(), db.workupComponent.count(),
    db.auditEvent.count(), db.compound.count(), db.job.count(),
  ]);
  const latest = await db.workup.findMany({ select: { id: true, version: true, updatedAt: true, status: true, flagged: true, intervalState: true }, orderBy: { id: "asc" } });
  return { workups, versions, predictions, outcomes, components, audits, compounds, jobs, latest };
}

/** Runs the saves' queued interval jobs (lib/jobs/interval.ts) to completion, as the app's worker does after a save. */
export function completeIntervals(db: Db): Promise<number> {
  return drainQueue(db, { kinds: ["interval"], schedule: false });
}

/**
 * A save followed by its interval job: the saved workup as its reads show it afterwards (state, and the stored
 * prediction's interval), for tests about what comes after the interval.
 */
export async function withInterval(db: Db, saving: Promise<SavedWorkup>): Promise<SavedWorkup> {
  const saved = await saving;
  await completeIntervals(db);
  const row = await db.workup.findUniqueOrThrow({ where: { id: saved.id }, select: { status: true, flagged: true, deviationPct: true, intervalState: true } });
  const stored = await db.prediction.findFirstOrThrow({
    where: { workupId: saved.id, workupVersion: saved.version }, orderBy: { createdAt: "desc" },
    select: { productRecovery: true, recoveryLow: true, recoveryHigh: true },
  });
  return { ...saved, ...row, prediction: { ...saved.prediction, ...stored } };
}
