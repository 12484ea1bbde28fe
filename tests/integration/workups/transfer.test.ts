import { beforeAll, expect, it } from "vitest";
import { SOLVENTS } from "@/lib/chem/data/solvents";
import { REAGENTS } from "@/lib/chem/data/reagents";
import { ConflictError, ValidationError } from "@/lib/errors";
import { parseCsv } from "@/lib/workups/csv";
import { exportWorkupsCsv } from "@/lib/workups/csv-export";
import { importWorkupsCsv, type ImportProgress } from "@/lib/workups/csv-import";
import { type GroupExport } from "@/lib/workups/export-format";
import { exportGroup } from "@/lib/workups/group-export";
import { importGroup } from "@/lib/workups/group-import";
import { reportOutcome } from "@/lib/workups/outcome";
import { createAttachment } from "@/lib/attachments/service";
import { createWorkup, updateWorkup } from "@/lib/workups/service";
import { describeEachDatabase } from "@/tests/integration/helpers/databases";
import { exampleSpec, footprint, header, makeLab, type Lab } from "./fixtures";

const QUICK = { draws: 20 };

/** The document with every record id replaced by its order of first appearance, and without the export time. */
function modRefs(doc: GroupExport): unknown {
  const seen = new Map<string, string>();
  const text = JSON.stringify({ ...doc, exportedAt: "" }).replace(/\bc[0-9a-z]{20,32}\b/g, (id) => {
    if (!seen.has(id)) seen.set(id, `#${seen.size}`);
    return seen.get(id)!;
  });
  return JSON.parse(text);
}

async function collect(chunks: AsyncIterable<string>): Promise<string> {
  let text = "";
  for await (const chunk of chunks) text += chunk;
  return text;
}

describeEachDatabase("import and export", (t) => {
  let source: Lab;
  let anilineId = "";

  beforeAll(async () => {
    source = await makeLab(t.db, "Mannich Lab");
    const etoac = SOLVENTS["etoac"]!;
    await t.db.solvent.create({ data: { groupId: source.groupId, key: "etoac", name: etoac.name, props: JSON.parse(JSON.stringify(etoac)) as object, builtin: false } });
    await t.db.aqueousReagent.create({ data: { groupId: source.groupId, key: "brine", name: "Brine", props: JSON.parse(JSON.stringify(REAGENTS["brine"])) as object } });
    const aniline = await t.db.compound.create({
      data: {
        groupId: source.groupId, name: "Aniline", synonyms: ["benzenamine"], tags: ["amine"], canonicalSmiles: "Nc1ccccc1", formula: "C6H7N",
        molarMass: 93.13, crippenLogP: 1.27, logP: 0.9, logPSource: "CRC Handbook (from memory)", createdById: source.member.userId,
        pKas: [{ value: 4.6, kind: "base", site: "N", provenance: "literature", source: "IUPAC digitized pKa dataset (from memory)" }],
        fingerprint: new Uint8Array(Array.from({ length: 256 }, (_, i) => (i * 37) % 256)),
      },
    });
    anilineId = aniline.id;
    const first = await createWorkup(t.db, source.member, {
      header: header({ chemistId: source.member.userId }), spec: exampleSpec(), links: [{ key: "aniline", compoundId: anilineId }],
    }, QUICK);
    await updateWorkup(t.db, source.lead, first.id, {
      header: header({ title: "Benzanilide, three washes", chemistId: source.member.userId }), spec: exampleSpec(),
      links: [{ key: "aniline", compoundId: anilineId }], baseVersion: 1,
    }, QUICK);
    await reportOutcome(t.db, source.member, first.id, { isolatedMassMg: 870, purityPct: 96, purityMethod: "qnmr", notes: "white needles" });
    // A TLC note kept as a text file with the outcome (type decided from the bytes: plain UTF-8 text).
    await createAttachment(t.db, { groupId: source.groupId, userId: source.member.userId }, first.id, { name: "tlc-rf.txt", target: "outcome" },
      new TextEncoder().encode("Rf 0.42 (30% EtOAc/hexanes)\n"));
    const second = await createWorkup(t.db, source.lead, { header: header({ title: "Lidocaine pH swing", performedOn: "2026-10-20" }), spec: exampleSpec("amine-back-extraction") }, QUICK);
    await t.db.partitionObservation.create({
      data: {
        groupId: source.groupId, compoundId: anilineId, solventKey: "etoac", aqueousPh: 7, logK: 1.05, logKSe: 0.1, kind: "inferred",
        method: "workup fit", workupId: second.id, details: { note: "test observation" }, createdById: source.lead.userId,
      },
    });
  });

  it("exports a group and imports it into an empty group exactly (ids aside)", async () => {
    const exported = await exportGroup(t.db, source.groupId);
    expect(exported.workups).toHaveLength(2);
    expect(exported.workups[0]!.versions).toHaveLength(2);
    expect(exported.workups[0]!.predictions).toHaveLength(2);
    expect(exported.workups[0]!.outcome).toMatchObject({ notes: "white needles", purityMethod: "qnmr" });
    const target = await makeLab(t.db, "Nazarov Lab");
    for (const person of [source.member, source.lead]) {
      await t.db.membership.create({ data: { groupId: target.groupId, userId: person.userId, role: "member" } });
    }
    const counts = await importGroup(t.db, target.lead, JSON.parse(JSON.stringify(exported)) as unknown);
    expect(counts).toMatchObject({ compounds: 1, workups: 2, versions: 3, predictions: 3, outcomes: 1, attachments: 1, observations: 1, solvents: 1, reagents: 1, unmatchedPeople: [] });
    const again = await exportGroup(t.db, target.groupId);
    expect(again.group.name).toBe("Nazarov Lab");
    expect(modRefs({ ...again, group: exported.group })).toEqual(modRefs(exported));
    const ids = new Set([...exported.workups.map((w) => w.ref), ...exported.compounds.map((c) => c.ref)]);
    expect(again.workups.some((w) => ids.has(w.ref)) || again.compounds.some((c) => ids.has(c.ref))).toBe(false);
  });

  it("refuses an import into a group that has records, and an inconsistent document, writing nothing", async () => {
    const exported = JSON.parse(JSON.stringify(await exportGroup(t.db, source.groupId))) as GroupExport;
    const before = await footprint(t.db);
    await expect(importGroup(t.db, source.lead, exported)).rejects.toBeInstanceOf(ConflictError);
    const empty = await makeLab(t.db, "Ozonolysis Lab");
    const broken = structuredClone(exported);
    broken.workups[0]!.components[0]!.compound = "c-missing-compound";
    const error = await importGroup(t.db, empty.lead, broken).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ValidationError);
    expect((error as ValidationError).fieldErrors["workups.0.components.0.compound"]).toEqual(["no compound with ref 'c-missing-compound'"]);
    const wrongFormat = await importGroup(t.db, empty.lead, { ...exported, format: "something-else" }).catch((e: unknown) => e);
    expect((wrongFormat as ValidationError).fieldErrors["format"]).toEqual(['format must be "layerwise.group-export"']);
    const attachmentsBefore = await t.db.attachment.count();
    const tampered = structuredClone(exported);
    tampered.workups[0]!.attachments[0]!.data = Buffer.from("Rf 0.99\n").toString("base64");
    const badFile = await importGroup(t.db, empty.lead, tampered).catch((e: unknown) => e);
    expect((badFile as ValidationError).fieldErrors["attachments"]).toEqual(["tlc-rf.txt: its content does not match its checksum or is not a kind of file kept here"]);
    expect(await t.db.attachment.count()).toBe(attachmentsBefore);
    const { workups, versions, predictions, outcomes, compounds } = await footprint(t.db);
    expect({ workups, versions, predictions, outcomes, compounds }).toEqual({
      workups: before.workups, versions: before.versions, predictions: before.predictions, outcomes: before.outcomes, compounds: before.compounds,
    });
  });

  it("exports a filtered list as CSV and imports it into another group, outcome included", async () => {
    const csv = await collect(exportWorkupsCsv(t.db, source.groupId, { q: "benzanilide" }));
    const table = parseCsv(csv);
    expect(table.rows).toHaveLength(1);
    expect(table.rows[0]!.cells).toMatchObject({ title: "Benzanilide, three washes", purity_method: "qnmr", purity_pct: "96", version: "2" });
    const target = await makeLab(t.db, "Pinacol Lab");
    await t.db.membership.create({ data: { groupId: target.groupId, userId: source.member.userId, role: "member" } });
    const progress: ImportProgress[] = [];
    const result = await importWorkupsCsv(t.db, target.member, csv, { draws: 20, onProgress: (p) => void progress.push(p) });
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const [row] = result.created;
    const imported = await t.db.workup.findUniqueOrThrow({ where: { id: row!.id }, include: { outcome: true } });
    expect(imported).toMatchObject({ groupId: target.groupId, title: "Benzanilide, three washes", chemistId: source.member.userId, version: 1 });
    expect(imported.spec).toEqual(exampleSpec());
    expect(imported.outcome).toMatchObject({ isolatedMassMg: 870, purityPct: 96, purityMethod: "qnmr" });
    expect(progress).toEqual([{ phase: "checking", done: 1, total: 1 }, { phase: "writing", done: 1, total: 1 }]);
  });

  it("reports every row's errors by row, line and column, and writes nothing", async () => {
    const spec = JSON.stringify(exampleSpec()).replace(/"/g, '""');
    const csv = [
      "title,performed_on,chemist_email,template,spec_json,isolated_mass_mg,purity_pct,purity_method",
      `Good row,2026-11-01,,,"${spec}",850,97,qnmr`,
      `Bad date,11/02/2026,,,"${spec}",,,`,
      `"Unknown chemist, bad JSON",2026-11-03,nobody@example.org,,"{""components"": [",,,`,
      "From a template,2026-11-04,,Lidocaine pH swing,,900,,hplc",
      "No spec at all,2026-11-05,,,,,,",
    ].join("\r\n");
    const before = await footprint(t.db);
    const result = await importWorkupsCsv(t.db, source.member, csv, QUICK);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.rows).toBe(5);
    expect(result.errors.map((e) => [e.row, e.line, e.column])).toEqual([
      [2, 3, "performed_on"],
      [3, 4, "chemist_email"],
      [3, 4, "spec_json"],
      [4, 5, "purity_pct"],
      [5, 6, "spec_json"],
    ]);
    expect(result.errors[0]!.message).toBe("Date run must be a date written YYYY-MM-DD");
    expect(result.errors[1]!.message).toBe("no member of this group has the email nobody@example.org");
    expect(result.errors[2]!.message).toMatch(/^not valid JSON \(/);
    expect(result.errors[3]!.message).toBe("Purity is required when it was measured by HPLC");
    expect(result.errors[4]!.message).toBe("give either spec_json or template (one of the two)");
    expect(await footprint(t.db)).toEqual(before);
  });

  it("imports rows from a template workup, with its compound links", async () => {
    const csv = "Title,Performed_On,Template,Notebook_Ref\nRepeat of the benzanilide,2026-11-20,\"Benzanilide, three washes\",MN-7/3\n";
    const result = await importWorkupsCsv(t.db, source.member, csv, QUICK);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const w = await t.db.workup.findUniqueOrThrow({ where: { id: result.created[0]!.id }, include: { components: true } });
    expect(w).toMatchObject({ notebookRef: "MN-7/3", performedOn: new Date("2026-11-20T00:00:00Z") });
    expect(w.components.find((c) => c.key === "aniline")?.compoundId).toBe(anilineId);
  });
});
