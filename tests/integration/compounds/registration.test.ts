// Registration on a real database (PGlite, and PostgreSQL when configured): SMILES and SD input, duplicates, and
// all-or-nothing writes when a record is bad.
import { beforeAll, describe, expect, it } from "vitest";
import { describeStructure, loadRDKit, type RDKitModule } from "@/lib/chem/structure";
import { ConflictError } from "@/lib/errors";
import { registerCompoundsSchema, type RegisterCompoundsInput, readStoredPKas } from "@/lib/compounds/schemas";
import { registerCompounds, RegistrationRejected, type CompoundActor } from "@/lib/compounds/service";
import { describeEachDatabase } from "@/tests/integration/helpers/databases";
import { makeActor, molBlock, sdFile } from "./fixtures";

let rdkit: RDKitModule;
beforeAll(async () => {
  rdkit = await loadRDKit();
});

const input = (i: RegisterCompoundsInput) => registerCompoundsSchema.parse(i);
const canonical = (smiles: string) => describeStructure(rdkit, smiles).canonicalSmiles;

async function rejection(promise: Promise<unknown>): Promise<RegistrationRejected> {
  const error = await promise.then(() => undefined, (e: unknown) => e);
  if (!(error instanceof RegistrationRejected)) throw new Error(`expected RegistrationRejected, got ${String(error)}`);
  return error;
}

describeEachDatabase("compound registration", (t) => {
  let actor: CompoundActor;
  const count = () => t.db.compound.count({ where: { groupId: actor.groupId } });
  beforeAll(async () => {
    actor = await makeActor(t.db);
  });

  it("registers pasted SMILES with names, properties, fingerprint and estimated sites", async () => {
    const result = await registerCompounds(t.db, actor, input({ format: "smiles", text: "OC(=O)c1ccccc1 benzoic acid\n\nCCN(CC)CC  triethylamine\n# a comment\nc1ccccc1", tags: "Series A, acid" }));
    expect(result.created.map((c) => c.name)).toEqual(["benzoic acid", "triethylamine", canonical("c1ccccc1")]);
    expect(result.created.map((c) => c.label)).toEqual(["Line 1 (benzoic acid)", "Line 3 (triethylamine)", "Line 5"]);
    const rows = await t.db.compound.findMany({ where: { groupId: actor.groupId }, orderBy: { name: "asc" } });
    const benzoic = rows.find((r) => r.name === "benzoic acid")!;
    expect(benzoic.canonicalSmiles).toBe(canonical("C1=CC=CC=C1C(O)=O"));
    expect(benzoic.formula).toBe("C7H6O2");
    expect(benzoic.molarMass).toBeCloseTo(122.12, 1); // benzoic acid 122.12 g/mol (CRC Handbook, physical constants of organic compounds)
    expect(benzoic.tags).toEqual(["series a", "acid"]);
    expect(benzoic.fingerprint?.length).toBe(256);
    const sites = readStoredPKas(benzoic.pKas);
    expect(sites).toHaveLength(1);
    expect(sites[0]).toMatchObject({ kind: "acid", provenance: "estimated" });
    expect(sites[0]!.value).toBeCloseTo(4.2, 1); // benzoic acid pKa 4.20 (IUPAC digitized pKa dataset, entry B91)
    const amine = readStoredPKas(rows.find((r) => r.name === "triethylamine")!.pKas);
    expect(amine.map((s) => s.kind)).toEqual(["base"]);
    expect(readStoredPKas(rows.find((r) => r.name === canonical("c1ccccc1"))!.pKas)).toEqual([]);
  });

  it("registers an SD file: names from the title line or a NAME field, synonyms, the MOL block kept", async () => {
    const sdf = sdFile([
      [await molBlock("CC(=O)Nc1ccc(O)cc1", "paracetamol"), { SYNONYMS: "acetaminophen; 4-acetamidophenol" }],
      [await molBlock("CN1CCN(C)CC1", ""), { NAME: "1,4-dimethylpiperazine" }],
    ]);
    const result = await registerCompounds(t.db, actor, input({ format: "sdf", text: sdf }));
    expect(result.created.map((c) => c.name)).toEqual(["paracetamol", "1,4-dimethylpiperazine"]);
    const row = await t.db.compound.findFirstOrThrow({ where: { groupId: actor.groupId, name: "paracetamol" } });
    expect(row.synonyms).toEqual(["acetaminophen", "4-acetamidophenol"]);
    expect(row.molfile).toContain("M  END");
    expect(row.canonicalSmiles).toBe(canonical("CC(=O)Nc1ccc(O)cc1"));
    const phenol = readStoredPKas(row.pKas).find((s) => s.kind === "acid");
    // The site's atoms index the stored MOL block: atom 1 of the phenol site must be the O (line 5 + index).
    const atomLine = row.molfile!.split("\n")[4 + phenol!.atoms![0]!]!;
    expect(atomLine.slice(31, 34).trim()).toBe("O");
  });

  it("refuses the whole batch when one SMILES line is malformed, naming its line and name", async () => {
    const before = await count();
    const error = await rejection(registerCompounds(t.db, actor, input({ format: "smiles", text: "CCO ethanol-x\nC1CC(=O broken ring\nCCCO propanol" })));
    expect(error.status).toBe(422);
    expect(error.problems).toHaveLength(1);
    expect(error.problems[0]).toMatchObject({ line: 2 });
    expect(error.problems[0]!.message).toMatch(/^Line 2 \(broken ring\): /);
    expect(error.message).toBe("Nothing was registered: 1 of 3 records needs attention.");
    expect(error.fieldErrors["records"]).toEqual([error.problems[0]!.message]);
    expect(await count()).toBe(before);
  });

  it("refuses the whole SD file when one record is bad, naming the record, its title and line", async () => {
    const good = await molBlock("CCOC(C)=O", "ethyl acetate");
    const truncated = (await molBlock("CCCCCC", "hexane-cut")).replace(/M {2}END\n?/, "");
    const before = await count();
    const error = await rejection(registerCompounds(t.db, actor, input({ format: "sdf", text: sdFile([[good, {}], [truncated, {}]]) })));
    expect(error.problems).toHaveLength(1);
    expect(error.problems[0]).toMatchObject({ record: 2 });
    expect(error.problems[0]!.message).toMatch(/^Record 2 “hexane-cut” \(line \d+\): /);
    expect(await count()).toBe(before);
  });

  it("reports duplicates of registered compounds and within the batch, and writes nothing", async () => {
    await registerCompounds(t.db, actor, input({ format: "smiles", text: "CC(=O)Oc1ccccc1C(=O)O aspirin" }));
    const before = await count();
    const error = await rejection(registerCompounds(t.db, actor, input({ format: "smiles", text: "OC(=O)C1=CC=CC=C1OC(C)=O aspirin-kekule\nCCCCO butanol\nOCCCC butanol-again" })));
    expect(error.problems.map((p) => [p.line, p.code])).toEqual([[1, "duplicate_of_existing"], [3, "duplicate_in_batch"]]);
    expect(error.problems[0]!.message).toContain("already registered as “aspirin”");
    expect(error.problems[0]!.duplicateOf?.id).toBeTruthy();
    expect(error.problems[1]!.message).toContain("the same structure as Line 2 (butanol)");
    expect(await count()).toBe(before);
  });

  it("leaves duplicates out and registers the rest when asked to skip them", async () => {
    const before = await count();
    const result = await registerCompounds(t.db, actor, input({ format: "smiles", text: "CC(=O)Oc1ccccc1C(=O)O\nCCCCCO pentanol\nOCCCCC", onDuplicate: "skip" }));
    expect(result.created.map((c) => c.name)).toEqual(["pentanol"]);
    expect(result.skipped.map((p) => p.code)).toEqual(["duplicate_of_existing", "duplicate_in_batch"]);
    expect(await count()).toBe(before + 1);
  });

  it("keeps one row when two registrations of the same structure race", async () => {
    const text = "CC(C)(C)OC(=O)N tert-butyl carbamate";
    const outcomes = await Promise.allSettled([registerCompounds(t.db, actor, input({ format: "smiles", text })), registerCompounds(t.db, actor, input({ format: "smiles", text }))]);
    expect(outcomes.filter((o) => o.status === "fulfilled")).toHaveLength(1);
    const failure = outcomes.find((o) => o.status === "rejected");
    expect(failure?.reason instanceof ConflictError || failure?.reason instanceof RegistrationRejected).toBe(true);
    expect(await t.db.compound.count({ where: { groupId: actor.groupId, canonicalSmiles: canonical(text.split(" ")[0]!) } })).toBe(1);
  });

  it("treats the same structure in another group as a new compound", async () => {
    const other = await makeActor(t.db, "Quillon group");
    const result = await registerCompounds(t.db, other, input({ format: "smiles", text: "CC(=O)Oc1ccccc1C(=O)O aspirin" }));
    expect(result.created).toHaveLength(1);
  });

  it("answers an empty paste as a problem of the text field", async () => {
    await expect(registerCompounds(t.db, actor, input({ format: "smiles", text: "# only a comment" }))).rejects.toMatchObject({ status: 422, fieldErrors: { text: [expect.stringContaining("No SMILES found")] } });
  });
});

describe("registration input schema", () => {
  it("names the missing text and an unknown format", () => {
    const result = registerCompoundsSchema.safeParse({ format: "pdb", text: " " });
    expect(result.success).toBe(false);
    expect(result.error?.issues.map((i) => i.path.join("."))).toEqual(["format", "text"]);
  });
});
