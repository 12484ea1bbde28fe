// The read paths behind the workup list, workup page and review page send a fixed number of SQL statements however
// many workups the group holds (no query per row), and the workup page does not look its workup up more than once.
// Counted on a real in-memory PGlite: every statement Prisma sends runs.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { memberNames } from "@/app/(app)/workups/_lib/editor-data";
import { compoundChoices, flaggedWorkups } from "@/app/(app)/workups/_lib/list-data";
import { loadReview } from "@/lib/review/queries";
import { listVersions } from "@/lib/workups/history";
import { groupLibrary } from "@/lib/workups/library";
import { reportOutcome } from "@/lib/workups/outcome";
import { getWorkupDetail, listWorkups } from "@/lib/workups/queries";
import { createWorkup, updateWorkup } from "@/lib/workups/service";
import { createCountingDb, type CountingDb } from "@/tests/integration/helpers/counting-db";
import { exampleSpec, header, makeLab, type Lab } from "./fixtures";

/** Intervals are not looked at here: a few draws keep the set-up quick. */
const QUICK = { draws: 20 };

describe("statements per page load", () => {
  let c: CountingDb;
  let lab: Lab;
  const ids: string[] = [];

  async function addWorkups(n: number): Promise<void> {
    for (let i = 0; i < n; i++) {
      const saved = await createWorkup(c.db, lab.member, {
        header: header({ title: `Acid-base run ${ids.length + 1}`, performedOn: `2026-05-${String(ids.length + 1).padStart(2, "0")}`, chemistId: lab.member.userId }),
        spec: exampleSpec("acid-base-separation"),
        links: [],
      }, QUICK);
      ids.push(saved.id);
      // A second version and an outcome, so versions, predictions and analyses have more than one row to join.
      const v2 = await updateWorkup(c.db, lab.member, saved.id, {
        baseVersion: saved.version, header: header({ title: `Acid-base run ${ids.length} (rev.)`, performedOn: "2026-05-28", chemistId: lab.member.userId }),
        spec: exampleSpec("acid-base-separation"), links: [],
      }, QUICK);
      await reportOutcome(c.db, lab.member, v2.id, { isolatedMassMg: 300 + 10 * i, purityPct: 97, purityMethod: "qnmr" });
    }
    await c.db.workup.updateMany({ where: { id: { in: ids.slice(0, 2) } }, data: { flagged: true } });
  }

  const viewer = () => ({ groupId: lab.groupId, userId: lab.lead.userId, isLead: true });
  const loaders = {
    list: () => Promise.all([
      listWorkups(c.db, lab.groupId, {}), flaggedWorkups(c.db, lab.groupId), compoundChoices(c.db, lab.groupId), groupLibrary(c.db, lab.groupId),
      memberNames(c.db, lab.groupId),
    ]),
    detail: (id: string) => Promise.all([
      getWorkupDetail(c.db, lab.groupId, id), groupLibrary(c.db, lab.groupId), listVersions(c.db, lab.groupId, id, { found: true }),
    ]),
    review: () => loadReview(c.db, viewer(), {}),
  };

  async function counts(): Promise<Record<keyof typeof loaders, number>> {
    await groupLibrary(c.db, lab.groupId); // the instance's copy of the library is warm on a running server
    return {
      list: (await c.count(loaders.list)).statements.length,
      detail: (await c.count(() => loaders.detail(ids[0]!))).statements.length,
      review: (await c.count(loaders.review)).statements.length,
    };
  }

  beforeAll(async () => {
    c = await createCountingDb();
    lab = await makeLab(c.db, "Counting Lab");
  });
  afterAll(async () => {
    await c?.dispose();
  });

  it("does not grow with the number of workups", async () => {
    await addWorkups(2);
    const few = await counts();
    await addWorkups(6);
    const many = await counts();
    expect(many).toEqual(few);
    expect((await c.count(loaders.list)).result[0].rows).toHaveLength(8);
    expect((await c.count(loaders.review)).result.rows).toHaveLength(8);
  }, 240_000);

  it("looks the workup up once on its page", async () => {
    const { statements } = await c.count(() => loaders.detail(ids[1]!));
    const lookups = statements.filter((s) => /^SELECT .* FROM "public"\."Workup" WHERE/.test(s));
    expect(lookups).toHaveLength(1);
    // The detail with its components, outcome, prediction and people; the library's stamp; versions with their
    // predictions and editors.
    expect(statements.length).toBeLessThanOrEqual(10);
  });

  it("reads the flagged strip in one statement, with each workup's causes or else its danger flags", async () => {
    await c.db.workup.updateMany({ where: { groupId: lab.groupId }, data: { flagged: false } });
    await c.db.workup.updateMany({ where: { id: { in: ids.slice(0, 3) } }, data: { flagged: true } });
    const { result, statements } = await c.count(() => flaggedWorkups(c.db, lab.groupId));
    expect(statements).toHaveLength(1);
    expect(result.total).toBe(3);
    const stored = await c.db.workup.findMany({
      where: { groupId: lab.groupId, flagged: true }, orderBy: [{ performedOn: "desc" }, { id: "desc" }],
      select: { id: true, outcome: { select: { analysis: true } }, predictions: { orderBy: [{ workupVersion: "desc" }, { createdAt: "desc" }], take: 1, select: { result: true } } },
    });
    expect(result.items.map((i) => i.id)).toEqual(stored.map((w) => w.id));
    for (const [i, w] of stored.entries()) {
      const causes = ((w.outcome?.analysis as { causes?: { title: string }[] } | null)?.causes ?? []).slice(0, 3).map((x) => x.title);
      const danger = ((w.predictions[0]?.result as { prediction?: { flags?: { title: string; severity: string }[] } } | null)?.prediction?.flags ?? [])
        .filter((f) => f.severity === "danger").slice(0, 2).map((f) => f.title);
      expect(result.items[i]?.reasons.map((r) => r.title)).toEqual(causes.length > 0 ? causes : danger);
    }
    await c.db.workup.updateMany({ where: { groupId: lab.groupId }, data: { flagged: false } });
    expect(await flaggedWorkups(c.db, lab.groupId)).toEqual({ items: [], total: 0 });
  });

  it("reads the review's workups with their analyses in one statement, without whole specs", async () => {
    await groupLibrary(c.db, lab.groupId);
    const { result, statements } = await c.count(loaders.review);
    expect(statements.filter((s) => /"Workup"|"Outcome"/.test(s) && !/unnest/.test(s))).toHaveLength(1);
    expect(statements.some((s) => /"Workup"\."spec"/.test(s))).toBe(false);
    // The library's stamp, the rows, the members' names, the solvents in use.
    expect(statements.length).toBeLessThanOrEqual(4);
    // The acid-base example washes, dries and concentrates an ethyl acetate solution (examples/acid-base-separation.json).
    expect(result.rows[0]?.operationTypes.length).toBeGreaterThan(0);
    expect(result.rows[0]?.solventSystem).not.toBeNull();
  });

  it("reads the members' names for the chemist filter in one statement, sorted by name", async () => {
    const { result, statements } = await c.count(() => memberNames(c.db, lab.groupId));
    expect(statements).toHaveLength(1);
    const expected = (await c.db.membership.findMany({ where: { groupId: lab.groupId }, select: { user: { select: { id: true, name: true } } } }))
      .map((m) => m.user).sort((a, b) => a.name.localeCompare(b.name, "en"));
    expect(result).toEqual(expected);
  });

  it("reads an unchanged library with its stamp alone", async () => {
    const { statements } = await c.count(() => groupLibrary(c.db, lab.groupId));
    expect(statements).toEqual([expect.stringContaining(`"libraryVersion"`)]);
  });
});
