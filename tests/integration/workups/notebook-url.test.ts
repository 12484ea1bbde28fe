// The notebook entry's address: stored with the header, refused when it is not an http(s) address (nothing written),
// kept in every version snapshot and carried by the group's JSON export and import.
import { beforeAll, expect, it } from "vitest";
import { ValidationError } from "@/lib/errors";
import { parseCsv } from "@/lib/workups/csv";
import { exportWorkupsCsv } from "@/lib/workups/csv-export";
import { importWorkupsCsv } from "@/lib/workups/csv-import";
import { type GroupExport } from "@/lib/workups/export-format";
import { exportGroup } from "@/lib/workups/group-export";
import { importGroup } from "@/lib/workups/group-import";
import { getWorkupDetail } from "@/lib/workups/queries";
import { createWorkup, updateWorkup } from "@/lib/workups/service";
import { describeEachDatabase } from "@/tests/integration/helpers/databases";
import { exampleSpec, footprint, header, makeLab, type Lab } from "./fixtures";

const QUICK = { draws: 20 };
const ENTRY = "https://eln.example.org/entries/AB-12-041";

describeEachDatabase("the notebook entry's address", (t) => {
  let lab: Lab;
  let id = "";

  beforeAll(async () => {
    lab = await makeLab(t.db, "Claisen Lab");
    id = (await createWorkup(t.db, lab.member, { header: header({ notebookUrl: `  ${ENTRY}  ` }), spec: exampleSpec() }, QUICK)).id;
  });

  it("is stored trimmed on the row and in the version, and read back with the record", async () => {
    const row = await t.db.workup.findUniqueOrThrow({ where: { id }, include: { versions: true } });
    expect(row.notebookUrl).toBe(ENTRY);
    expect(row.versions[0]!.snapshot).toMatchObject({ header: { notebookUrl: ENTRY } });
    expect((await getWorkupDetail(t.db, lab.groupId, id)).header.notebookUrl).toBe(ENTRY);
  });

  it("defaults to blank when a client does not send one", async () => {
    const other = await createWorkup(t.db, lab.member, { header: header({ title: "No notebook link" }), spec: exampleSpec() }, QUICK);
    expect((await getWorkupDetail(t.db, lab.groupId, other.id)).header.notebookUrl).toBe("");
  });

  it.each([
    ["javascript:alert(document.cookie)", "Notebook entry address must be a web address starting with http:// or https://"],
    ["https://ana:pw@eln.example.org/e/1", "Notebook entry address must not contain a user name or password"],
    [`https://eln.example.org/${"x".repeat(2000)}`, "Notebook entry address must be ≤ 2000 characters"],
  ])("refuses %s on save with a message under header.notebookUrl, writing nothing", async (bad, message) => {
    const before = await footprint(t.db);
    const error = await updateWorkup(t.db, lab.member, id, { header: header({ notebookUrl: bad }), spec: exampleSpec(), baseVersion: 1 }, QUICK)
      .catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ValidationError);
    expect((error as ValidationError).fieldErrors).toEqual({ "header.notebookUrl": [message] });
    expect(await footprint(t.db)).toEqual(before);
  });

  it("travels in the group's JSON export and import; an older export without it imports as blank; a bad one is refused", async () => {
    const exported = JSON.parse(JSON.stringify(await exportGroup(t.db, lab.groupId))) as GroupExport;
    expect(exported.workups.find((w) => w.ref === id)?.notebookUrl).toBe(ENTRY);

    const target = await makeLab(t.db, "Dieckmann Lab");
    await importGroup(t.db, target.lead, exported);
    expect(await t.db.workup.findFirst({ where: { groupId: target.groupId, title: header().title }, select: { notebookUrl: true } })).toEqual({ notebookUrl: ENTRY });

    const older = structuredClone(exported) as unknown as { workups: Record<string, unknown>[] };
    for (const w of older.workups) delete w["notebookUrl"];
    const fresh = await makeLab(t.db, "Stobbe Lab");
    await importGroup(t.db, fresh.lead, older);
    expect(await t.db.workup.findMany({ where: { groupId: fresh.groupId }, select: { notebookUrl: true } })).toEqual([{ notebookUrl: "" }, { notebookUrl: "" }]);

    const hostile = structuredClone(exported);
    hostile.workups[0]!.notebookUrl = "javascript:alert(1)";
    const empty = await makeLab(t.db, "Darzens Lab");
    const before = await t.db.workup.count();
    const error = await importGroup(t.db, empty.lead, hostile).catch((e: unknown) => e);
    expect((error as ValidationError).fieldErrors["workups.0.notebookUrl"]).toEqual(["Notebook entry address must be a web address starting with http:// or https://"]);
    expect(await t.db.workup.count()).toBe(before);
  });

  it("is a column of the CSV export, and comes back in through the CSV import; a bad one is refused by column", async () => {
    let csv = "";
    for await (const chunk of exportWorkupsCsv(t.db, lab.groupId, { q: header().title })) csv += chunk;
    const table = parseCsv(csv);
    expect(table.columns).toContain("notebook_url");
    expect(table.rows.map((r) => [r.cells["id"], r.cells["notebook_url"]])).toEqual([[id, ENTRY]]);

    const target = await makeLab(t.db, "Perkin Lab");
    const imported = await importWorkupsCsv(t.db, target.lead, csv, QUICK);
    expect(imported.ok).toBe(true);
    if (!imported.ok) return;
    expect(await t.db.workup.findUniqueOrThrow({ where: { id: imported.created[0]!.id }, select: { notebookUrl: true } })).toEqual({ notebookUrl: ENTRY });

    const before = await footprint(t.db);
    const hostile = await importWorkupsCsv(t.db, target.lead, csv.replace(ENTRY, "javascript:alert(1)"), QUICK);
    expect(hostile.ok).toBe(false);
    if (hostile.ok) return;
    expect(hostile.errors.map((e) => [e.row, e.column, e.message])).toEqual([[1, "notebook_url", "Notebook entry address must be a web address starting with http:// or https://"]]);
    expect(await footprint(t.db)).toEqual(before);
  });
});
