// The read paths behind the workup list, workup page and review page send a fixed number of SQL statements however
// many workups the group holds (no query per row), and the workup page does not look its workup up more than once.
// A whole page request (the signed-in frame's guard and group switcher, the page's own guard, the page's loaders) is
// held to its measured statement count, so a rise fails here. Counted on a real in-memory PGlite: every statement
// Prisma sends runs.
import { createRequire } from "node:module";
import path from "node:path";
import * as React from "react";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { memberNames } from "@/app/(app)/workups/_lib/editor-data";
import { compoundChoices, flaggedWorkups } from "@/app/(app)/workups/_lib/list-data";
import { listAttachments } from "@/lib/attachments/service";
import { requestGuard, type RequestGuard } from "@/lib/authz";
import { jobsStatus } from "@/lib/jobs/status";
import { loadReview } from "@/lib/review/queries";
import { listVersions } from "@/lib/workups/history";
import { groupLibrary } from "@/lib/workups/library";
import { reportOutcome } from "@/lib/workups/outcome";
import { getWorkupDetail, listWorkups } from "@/lib/workups/queries";
import { createWorkup, updateWorkup } from "@/lib/workups/service";
import { createCountingDb, type CountingDb } from "@/tests/integration/helpers/counting-db";
import { completeIntervals, exampleSpec, header, makeLab, type Lab } from "./fixtures";

// Pages are React server components: "react" resolves to React's server build there (the react-server condition),
// whose cache() is what makes the guard read once per request. The same build here.
vi.mock("react", () => createRequire(import.meta.url)(path.resolve("node_modules", "react", "react.react-server.js")) as Record<string, unknown>);

interface ServerDispatcher { getCacheForType: <T>(create: () => T) => T; cacheSignal: () => null; getOwner: () => null }

/**
 * Runs `fn` as one server request: React's server renderer gives every request a fresh cache that all cache() calls
 * inside it share, through the dispatcher on its server internals; this installs such a dispatcher for the call.
 */
async function inOneRequest<T>(fn: () => Promise<T>): Promise<T> {
  const internals = (React as unknown as { __SERVER_INTERNALS_DO_NOT_USE_OR_WARN_USERS_THEY_CANNOT_UPGRADE: { A: ServerDispatcher | null } })
    .__SERVER_INTERNALS_DO_NOT_USE_OR_WARN_USERS_THEY_CANNOT_UPGRADE;
  const caches = new Map<unknown, unknown>();
  const dispatcher: ServerDispatcher = {
    getCacheForType: <C>(create: () => C): C => {
      if (!caches.has(create)) caches.set(create, create());
      return caches.get(create) as C;
    },
    cacheSignal: () => null,
    getOwner: () => null,
  };
  const previous = internals.A;
  internals.A = dispatcher;
  try {
    return await fn();
  } finally {
    internals.A = previous;
  }
}

/** What every signed-in page does before its loaders: the frame (app/(app)/layout.tsx), then the page's own guard. */
async function frameAndGuard(guard: RequestGuard) {
  await guard.requireMember("data:read", { sessionOnly: true });
  await guard.signedInGroups();
  return guard.requireMember("data:read", { sessionOnly: true });
}

/**
 * Statements per page request on a warm instance (library cached), the signed-in frame included. Lower them when a
 * change sends fewer; a rise fails here.
 */
const PAGE_STATEMENTS = { list: 9, detail: 15, review: 7 };

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
  /** The app's guard (lib/authz/index.ts) over the lead's session and the counted database. */
  let guard: RequestGuard;
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
  /** Whole page requests as app/(app)/workups/page.tsx, workups/[id]/page.tsx and review/page.tsx make them. */
  const pages = {
    list: () => inOneRequest(async () => {
      await frameAndGuard(guard);
      return loaders.list();
    }),
    detail: (id: string) => inOneRequest(async () => {
      await frameAndGuard(guard);
      return Promise.all([loaders.detail(id), listAttachments(c.db, lab.groupId, id)]);
    }),
    review: () => inOneRequest(async () => {
      await frameAndGuard(guard);
      return Promise.all([loaders.review(), jobsStatus(c.db, lab.groupId)]);
    }),
  };

  async function counts(): Promise<Record<keyof typeof pages, number>> {
    await groupLibrary(c.db, lab.groupId); // the instance's copy of the library is warm on a running server
    return {
      list: (await c.count(pages.list)).statements.length,
      detail: (await c.count(() => pages.detail(ids[0]!))).statements.length,
      review: (await c.count(pages.review)).statements.length,
    };
  }

  beforeAll(async () => {
    c = await createCountingDb();
    lab = await makeLab(c.db, "Counting Lab");
    guard = requestGuard(() => Promise.resolve({ kind: "session", userId: lab.lead.userId, activeGroupId: lab.groupId, sessionVersion: 0 }), () => Promise.resolve(c.db));
  });
  afterAll(async () => {
    await c?.dispose();
  });

  it("does not grow with the number of workups", async () => {
    await addWorkups(2);
    const few = await counts();
    await addWorkups(6);
    await completeIntervals(c.db);
    const many = await counts();
    expect(many).toEqual(few);
    expect((await c.count(loaders.list)).result[0].rows).toHaveLength(8);
    expect((await c.count(loaders.review)).result.rows).toHaveLength(8);
  }, 240_000);

  it("holds each page request to its measured statements: the frame and the page's guard read the account once", async () => {
    // The signed-in frame (membership, group switcher) and the page's guard: one statement for the whole request
    // (user, session version, memberships with their groups), where the frame and guard once sent nine.
    const frame = await c.count(() => inOneRequest(() => frameAndGuard(guard)));
    expect(frame.result).toMatchObject({ role: "lead", group: { id: lab.groupId }, user: { id: lab.lead.userId } });
    expect(frame.statements).toHaveLength(1);
    // Nothing is kept between requests: the next one reads again (a removal from the group shows at once).
    expect((await c.count(() => inOneRequest(() => frameAndGuard(guard)))).statements).toHaveLength(1);
    // Per page: that statement and the page's loaders (measured; see bench/results/load-summary.md).
    expect(await counts()).toEqual(PAGE_STATEMENTS);
  });

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
