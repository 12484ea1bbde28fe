import { beforeAll, expect, it } from "vitest";
import { ValidationError } from "@/lib/errors";
import { diffVersions, listVersions } from "@/lib/workups/history";
import { listWorkups, type WorkupListRow } from "@/lib/workups/queries";
import { createWorkup, updateWorkup } from "@/lib/workups/service";
import { describeEachDatabase } from "@/tests/integration/helpers/databases";
import { exampleSpec, header, makeLab, type ExampleName, type Lab } from "./fixtures";

/** The list tests do not look at intervals: a few draws keep the set-up quick. */
const QUICK = { draws: 20 };

describeEachDatabase("listing and filtering workups", (t) => {
  let lab: Lab;
  let other: Lab;
  let anilineId = "";
  const ids: Record<string, string> = {};

  beforeAll(async () => {
    lab = await makeLab(t.db, "Grignard Lab");
    other = await makeLab(t.db, "Heck Lab");
    anilineId = (await t.db.compound.create({
      data: { groupId: lab.groupId, name: "Aniline", synonyms: ["benzenamine"], canonicalSmiles: "Nc1ccccc1", formula: "C6H7N", molarMass: 93.13 },
    })).id;
    const rows: [string, string, ExampleName, string | null, boolean][] = [
      ["A", "2026-06-02", "acid-base-separation", lab.member.userId, true],
      ["B", "2026-06-10", "amine-back-extraction", lab.lead.userId, false],
      ["C", "2026-07-01", "saponification-ph-swing", lab.member.userId, false],
      ["D", "2026-07-01", "acid-base-separation", null, false],
      ["E", "2026-08-15", "amine-back-extraction", lab.member.userId, false],
      ["F", "2026-09-30", "acid-base-separation", lab.lead.userId, true],
    ];
    for (const [name, performedOn, example, chemistId, linkAniline] of rows) {
      const saved = await createWorkup(t.db, lab.member, {
        header: header({ title: `Run ${name} of the ${example.replace(/-/g, " ")}`, performedOn, chemistId, notebookRef: `GL-${name}` }),
        spec: exampleSpec(example),
        links: linkAniline ? [{ key: "aniline", compoundId: anilineId }] : [],
      }, QUICK);
      ids[name] = saved.id;
    }
    await t.db.workup.update({ where: { id: ids["E"] }, data: { flagged: true, status: "below" } });
    await createWorkup(t.db, other.member, { header: header({ title: "Run Z of the acid base separation" }), spec: exampleSpec() }, QUICK);
  });

  const names = (rows: WorkupListRow[]) => rows.map((r) => Object.entries(ids).find(([, id]) => id === r.id)?.[0] ?? `other:${r.title}`);
  const list = async (filter: Record<string, unknown> = {}) => names((await listWorkups(t.db, lab.groupId, filter)).rows);

  it("lists the group's workups newest first, never another group's", async () => {
    const all = await list();
    expect(all).toHaveLength(6);
    expect(all.slice(0, 4)).toEqual(["F", "E", ...(ids["C"]! < ids["D"]! ? ["C", "D"] : ["D", "C"])]);
    expect(all.at(-1)).toBe("A");
  });

  it("pages with a cursor through every row once, in the same order, including rows sharing a date", async () => {
    const seen: string[] = [];
    let cursor: string | undefined;
    let pages = 0;
    do {
      const page = await listWorkups(t.db, lab.groupId, { limit: 2, ...(cursor ? { cursor } : {}) });
      seen.push(...names(page.rows));
      cursor = page.next ?? undefined;
      pages++;
    } while (cursor && pages < 10);
    expect(pages).toBe(3);
    expect(seen).toEqual(await list());
  });

  it("filters by words in the title, notebook reference, component names and linked compound synonyms", async () => {
    expect(await list({ q: "saponification" })).toEqual(["C"]);
    expect(await list({ q: "gl-b" })).toEqual(["B"]);
    expect((await list({ q: "LIDOCAINE" })).sort()).toEqual(["B", "E"]);
    expect((await list({ q: "benzenamine" })).sort()).toEqual(["A", "F"]);
    expect(await list({ q: "run lidocaine gl-e" })).toEqual(["E"]);
    expect(await list({ q: "nothing like this" })).toEqual([]);
  });

  it("filters by compound, solvent, chemist, date range, flag and status, alone and together", async () => {
    expect((await list({ compoundId: anilineId })).sort()).toEqual(["A", "F"]);
    expect((await list({ solvent: "toluene" })).sort()).toEqual(["B", "E"]);
    expect((await list({ solvent: "EtOAc" })).sort()).toEqual(["A", "C", "D", "F"]);
    expect((await list({ chemistId: lab.lead.userId })).sort()).toEqual(["B", "F"]);
    expect((await list({ from: "2026-06-10", to: "2026-07-01" })).sort()).toEqual(["B", "C", "D"]);
    expect(await list({ flagged: "true" })).toEqual(["E"]);
    expect(await list({ status: "below" })).toEqual(["E"]);
    expect(await list({ chemistId: lab.member.userId, solvent: "etoac", from: "2026-06-01", to: "2026-07-31" })).toEqual(["C", "A"]);
  });

  it("finds a compound used in thousands of component rows the same way (EXISTS rather than an id list)", async () => {
    const busy = await t.db.compound.create({ data: { groupId: lab.groupId, name: "Sodium sulfate", canonicalSmiles: "[Na+].[Na+].[O-]S([O-])(=O)=O", formula: "Na2O4S", molarMass: 142.04 } });
    await t.db.workupComponent.createMany({
      data: Array.from({ length: 2001 }, (_, i) => ({
        groupId: lab.groupId, workupId: i % 2 === 0 ? ids["B"]! : ids["C"]!, compoundId: busy.id, key: `salt-${i}`, name: "Sodium sulfate", role: "other" as const, amountMmol: 1,
      })),
    });
    expect(await list({ compoundId: busy.id })).toEqual(["C", "B"]);
    await t.db.workupComponent.deleteMany({ where: { compoundId: busy.id } });
  });

  it("refuses a tampered cursor, a reversed date range and a silly page size with 422", async () => {
    for (const [filter, field] of [
      [{ cursor: "bm90LWEtY3Vyc29y" }, "cursor"],
      [{ from: "2026-08-01", to: "2026-07-01" }, "to"],
      [{ limit: "5000" }, "limit"],
      [{ flagged: "maybe" }, "flagged"],
    ] as const) {
      const error = await listWorkups(t.db, lab.groupId, filter).catch((e: unknown) => e);
      expect(error, field).toBeInstanceOf(ValidationError);
      expect(Object.keys((error as ValidationError).fieldErrors), field).toContain(field);
    }
  });

  it("shows the history with who saved each version, and what changed between two of them", async () => {
    const spec = exampleSpec();
    spec.operations.splice(2, 0, { type: "wash", reagent: "water", volume: { value: 20, unit: "mL" }, portions: 1, label: "water" });
    await updateWorkup(t.db, lab.lead, ids["A"]!, {
      header: header({ title: "Run A, with a water wash", performedOn: "2026-06-02", chemistId: lab.member.userId, notebookRef: "GL-A" }),
      spec, links: [{ key: "aniline", compoundId: anilineId }], baseVersion: 1,
    }, QUICK);
    const history = await listVersions(t.db, lab.groupId, ids["A"]!);
    expect(history.map((v) => [v.version, v.editedBy?.name])).toEqual([[2, lab.lead.name], [1, lab.member.name]]);
    const diff = await diffVersions(t.db, lab.groupId, ids["A"]!, 1, 2);
    expect(diff.header).toEqual([{ field: "title", from: "Run A of the acid base separation", to: "Run A, with a water wash" }]);
    expect(diff.operations.added).toEqual([{ step: 3, type: "wash", label: "water" }]);
    expect(diff.components).toEqual({ added: [], removed: [], changed: [] });
    await expect(listVersions(t.db, other.groupId, ids["A"]!)).rejects.toThrow("No such workup.");
  });
});
