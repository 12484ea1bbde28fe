// The per-person review rule, enforced by the guard: figures narrowed to one chemist are for that chemist and the
// group's leads only (common practice for group reviews). Before, the review page applied it by itself and
// /workups?chemistId=, GET /api/v1/workups?chemistId= and the workups CSV let any member or viewer single out a colleague.
// Also: a failed background job's raw exception text reached every member and viewer.
import "./next-runtime";
import { beforeAll, expect, it } from "vitest";
import * as workups from "@/app/api/v1/workups/route";
import * as csv from "@/app/api/v1/workups.csv/route";
import * as jobs from "@/app/api/v1/jobs/route";
import { PERSON_FILTER_REFUSED } from "@/lib/authz/people";
import { resolveMember } from "@/lib/authz/guard";
import { ForbiddenError } from "@/lib/errors";
import { describeWithAppDatabase } from "@/tests/integration/auth/app-database";
import { sessionOf } from "@/tests/integration/auth/fixtures";
import { makeLab, type Lab } from "@/tests/integration/workups/fixtures";
import { callRoute, tokenFor } from "./call";

type ErrorJson = { error: { message: string } };

describeWithAppDatabase("per-person figures and job messages", (t) => {
  let lab: Lab;
  const tokens = { lead: "", member: "", viewer: "" };
  beforeAll(async () => {
    lab = await makeLab(t.db, "Privacy Lab");
    tokens.lead = await tokenFor(t.db, lab.groupId, lab.lead.userId);
    tokens.member = await tokenFor(t.db, lab.groupId, lab.member.userId);
    tokens.viewer = await tokenFor(t.db, lab.groupId, lab.viewer.userId);
  });

  it("refuses a chemist filter on someone else to members and viewers, on the list and the CSV (403)", async () => {
    for (const token of [tokens.member, tokens.viewer]) {
      for (const [handler, path] of [[workups.GET, "/api/v1/workups"], [csv.GET, "/api/v1/workups.csv"]] as const) {
        const res = await callRoute(handler, "GET", path, { token, query: { chemistId: lab.lead.userId } });
        expect(res.status, path).toBe(403);
        expect(((await res.json()) as ErrorJson).error.message).toBe(PERSON_FILTER_REFUSED);
      }
    }
  });

  it("lets a chemist filter on themselves, and a lead on anyone", async () => {
    expect((await callRoute(workups.GET, "GET", "/api/v1/workups", { token: tokens.member, query: { chemistId: lab.member.userId } })).status).toBe(200);
    expect((await callRoute(csv.GET, "GET", "/api/v1/workups.csv", { token: tokens.lead, query: { chemistId: lab.member.userId } })).status).toBe(200);
    expect((await callRoute(workups.GET, "GET", "/api/v1/workups", { token: tokens.viewer })).status).toBe(200);
  });

  it("is decided in the guard itself, so every page and action asking with `person` gets the same answer", async () => {
    const member = sessionOf(lab.member.userId, lab.groupId);
    await expect(resolveMember(member, "data:read", { person: lab.viewer.userId })).rejects.toBeInstanceOf(ForbiddenError);
    await expect(resolveMember(member, "data:read", { person: lab.member.userId })).resolves.toMatchObject({ role: "member" });
    await expect(resolveMember(sessionOf(lab.lead.userId, lab.groupId), "data:read", { person: lab.viewer.userId })).resolves.toMatchObject({ role: "lead" });
  });

  it("shows a failed job's reference, never its raw exception text", async () => {
    const raw = 'PrismaClientKnownRequestError: relation "Workup" at /srv/layerwise/lib/jobs/repredict.ts:88:13 password=hunter2';
    const job = await t.db.job.create({ data: { groupId: lab.groupId, kind: "revalidate", status: "failed", error: raw, payload: { reasons: ["test"] } } });
    const res = await callRoute(jobs.GET, "GET", "/api/v1/jobs", { token: tokens.viewer });
    const body = (await res.json()) as { lastFinished: { id: string; error: string } | null };
    expect(body.lastFinished?.id).toBe(job.id);
    expect(body.lastFinished?.error).toContain(`reference ${job.id.slice(-8)}`);
    for (const secret of ["Prisma", "/srv/", "repredict", "hunter2"]) expect(JSON.stringify(body)).not.toContain(secret);
  });
});
