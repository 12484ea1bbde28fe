/**
 * Loads the demo scenario into a database: groups, people (all with the demo password), each group's copy of the
 * solvent and wash library, the compounds (properties computed from the structure by RDKit, literature values
 * beside them), the workups with their outcomes, and the group's partition measurements. Workups, outcomes and
 * measurements go through the same services as the app, so the demo exercises the real path.
 */
import { hashPassword } from "@/lib/auth/password";
import { DEFAULT_LIBRARY } from "@/lib/chem/library";
import { describeStructure, loadRDKit } from "@/lib/chem/structure";
import type { Db } from "@/lib/db/client";
import { seedCompounds } from "./compounds";
import { type CompoundFacts, type GeneratedWorkup } from "./generate";
import { DEMO_PASSWORD, demoGroup, otherGroup, type SeedPerson } from "./scenario";
import { drainQueue } from "@/lib/jobs/worker";
import { seedPartition } from "./partition";
import { seedWorkups } from "./workups";

export interface SeedSummary {
  groups: number;
  people: number;
  compounds: number;
  workups: number;
  /** The demo group's workups as the scenario writes them (notebook reference, poor or not and why). */
  written: { notebookRef: string; poor: GeneratedWorkup["poor"]; reported: boolean }[];
}

/** True when the database holds no group yet (the first start of an empty database). */
export async function isEmpty(db: Db): Promise<boolean> {
  return (await db.group.count()) === 0;
}

async function createGroup(db: Db, group: { name: string; slug: string; people: readonly SeedPerson[] }, passwordHash: string) {
  const created = await db.group.create({ data: { name: group.name, slug: group.slug } });
  const users = new Map<string, string>();
  for (const person of group.people) {
    const user = await db.user.upsert({
      where: { email: person.email },
      update: {},
      create: { email: person.email, name: person.name, passwordHash },
      select: { id: true },
    });
    await db.membership.create({ data: { groupId: created.id, userId: user.id, role: person.role } });
    users.set(person.email, user.id);
  }
  await db.solvent.createMany({
    data: Object.values(DEFAULT_LIBRARY.solvents).map((s) => ({ groupId: created.id, key: s.key, name: s.name, props: toJson(s) })),
  });
  await db.aqueousReagent.createMany({
    data: Object.values(DEFAULT_LIBRARY.reagents).map((r) => ({ groupId: created.id, key: r.key, name: r.name, props: toJson(r) })),
  });
  return { groupId: created.id, users };
}

function toJson(value: object): object {
  return JSON.parse(JSON.stringify(value)) as object;
}

async function registerCompounds(db: Db, groupId: string, createdById: string): Promise<Map<string, CompoundFacts>> {
  const rdkit = await loadRDKit();
  const facts = new Map<string, CompoundFacts>();
  for (const seed of seedCompounds) {
    const d = describeStructure(rdkit, seed.smiles);
    const row = await db.compound.create({
      data: {
        groupId,
        name: seed.name,
        synonyms: seed.synonyms ?? [],
        tags: seed.tags,
        canonicalSmiles: d.canonicalSmiles,
        formula: d.formula,
        molarMass: d.molarMass,
        crippenLogP: d.crippenLogP,
        tpsa: d.tpsa,
        logP: seed.logP?.value ?? null,
        // "provenance: source", the registry's convention (lib/compounds/provenance.ts).
        logPSource: seed.logP ? `literature: ${seed.logP.source}` : null,
        pKas: seed.pKas.map((p) => ({ value: p.value, kind: p.kind, provenance: "literature", source: p.source })),
        fingerprint: Buffer.from(d.morganFingerprint),
        createdById,
      },
      select: { id: true },
    });
    facts.set(seed.key, { id: row.id, seed, molarMass: d.molarMass, crippenLogP: d.crippenLogP });
  }
  return facts;
}

export async function seedDemo(db: Db): Promise<SeedSummary> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const main = await createGroup(db, demoGroup, passwordHash);
  const lead = main.users.get(demoGroup.people[0].email)!;
  const compounds = await registerCompounds(db, main.groupId, lead);
  // The group's own measurements come first (the group made them over the months), so each workup is saved and its
  // outcome judged against a prediction that already uses them; then the inference from the reported outcomes runs.
  await seedPartition(db, main.groupId, lead, compounds);
  const workups = await seedWorkups(db, main.groupId, main.users, compounds);
  await drainQueue(db, { schedule: true });

  const other = await createGroup(db, otherGroup, passwordHash);
  const otherLead = other.users.get(otherGroup.people[0].email)!;
  await registerCompounds(db, other.groupId, otherLead);

  return {
    groups: 2, people: main.users.size + other.users.size, compounds: compounds.size * 2, workups: workups.length,
    written: workups.map((w) => ({ notebookRef: w.notebookRef, poor: w.poor, reported: w.outcome !== null })),
  };
}
