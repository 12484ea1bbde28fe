// Recording the cause a group meeting found for a shortfall, through the real guard with per-user API tokens: who may,
// what is refused (and then nothing is written), and that the group's next judgements count the finding.
import "./next-runtime";
import { beforeAll, expect, it } from "vitest";
import * as found from "@/app/api/v1/workups/[id]/outcome/found-cause/route";
import * as workup from "@/app/api/v1/workups/[id]/route";
import { reportOutcome } from "@/lib/workups/outcome";
import { createWorkup } from "@/lib/workups/service";
import { loadGroupJudgement } from "@/lib/workups/group-model";
import { describeWithAppDatabase } from "@/tests/integration/auth/app-database";
import { acetanilideSpec, header, makeLab, type Lab } from "@/tests/integration/workups/fixtures";
import { callRoute, json, tokenFor } from "./call";

type ErrorJson = { error: { code: string; message: string; fields?: Record<string, string[]> } };

describeWithAppDatabase("cause found at review", (t) => {
  let lab: Lab;
  let other: Lab;
  const tokens = { member: "", viewer: "", outsider: "" };
  let reported = "";
  let unreported = "";

  beforeAll(async () => {
    lab = await makeLab(t.db, "Fehling Lab");
    other = await makeLab(t.db, "Tollens Lab");
    tokens.member = await tokenFor(t.db, lab.groupId, lab.member.userId);
    tokens.viewer = await tokenFor(t.db, lab.groupId, lab.viewer.userId);
    tokens.outsider = await tokenFor(t.db, other.groupId, other.member.userId);
    const w = await createWorkup(t.db, lab.member, { header: header({ title: "Acetanilide, short" }), spec: acetanilideSpec(2) });
    // 135.17 g/mol × 5 mmol × 40 %: well below what two EtOAc extractions give.
    await reportOutcome(t.db, lab.member, w.id, { isolatedMassMg: 0.4 * 5 * 135.17, purityPct: 100, purityMethod: "qnmr" });
    reported = w.id;
    unreported = (await createWorkup(t.db, lab.member, { header: header({ title: "Acetanilide, not yet isolated" }), spec: acetanilideSpec(2) })).id;
  });

  const post = (id: string, token: string, body: unknown) =>
    callRoute(found.POST, "POST", `/api/v1/workups/${id}/outcome/found-cause`, { token, params: { id }, body });
  const stored = () => t.db.outcome.findUniqueOrThrow({ where: { workupId: reported }, select: { foundCause: true, foundCauseNote: true, foundCauseById: true, foundCauseAt: true } });

  it("records a member's finding with who and when, shows it with the workup, and audits it", async () => {
    const res = await post(reported, tokens.member, { cause: "one_fewer_extraction", note: "second extraction skipped: notebook p. 41" });
    expect(res.status).toBe(200);
    expect(await json(res)).toMatchObject({ workupId: reported, cause: "one_fewer_extraction", note: "second extraction skipped: notebook p. 41" });
    const row = await stored();
    expect(row).toMatchObject({ foundCause: "one_fewer_extraction", foundCauseById: lab.member.userId });
    expect(row.foundCauseAt).toBeInstanceOf(Date);
    const detail = await json<{ outcome: { foundCause: { cause: string; note: string; by: { name: string } } } }>(
      await callRoute(workup.GET, "GET", `/api/v1/workups/${reported}`, { token: tokens.viewer, params: { id: reported } }));
    expect(detail.outcome.foundCause).toMatchObject({ cause: "one_fewer_extraction", by: { name: lab.member.name } });
    expect(await t.db.auditEvent.count({ where: { entityId: reported, action: "workup.found_cause" } })).toBe(1);
  });

  it("teaches the group's next judgements: the finding counts in full towards its cause", async () => {
    // The group's only outcome is this one. Without the finding its causes count by plausibility (together one
    // count); with it, the whole count goes to the cause found.
    const noHistory = (await loadGroupJudgement(t.db, other.groupId)).causeFrequencies;
    const after = (await loadGroupJudgement(t.db, lab.groupId)).causeFrequencies;
    // 20 pseudo-counts of common practice (one extraction fewer: 0.1 of them) plus the one finding: (2 + 1) / 21.
    expect(after.one_fewer_extraction).toBeCloseTo(3 / 21, 9);
    expect(noHistory.one_fewer_extraction).toBeCloseTo(2 / 20, 9);
  });

  it("refuses viewers, other groups, unknown causes, 'other' without a note and workups without an outcome, writing nothing", async () => {
    const snapshot = await stored();
    const audits = await t.db.auditEvent.count({ where: { action: "workup.found_cause" } });
    expect((await post(reported, tokens.viewer, { cause: "wrong_ph" })).status).toBe(403);
    expect((await post(reported, tokens.outsider, { cause: "wrong_ph" })).status).toBe(404);
    const unknown = await post(reported, tokens.member, { cause: "gremlins" });
    expect(unknown.status).toBe(422);
    expect((await json<ErrorJson>(unknown)).error.fields?.["cause"]?.[0]).toMatch(/one of/);
    const noNote = await post(reported, tokens.member, { cause: "other" });
    expect(noNote.status).toBe(422);
    expect((await json<ErrorJson>(noNote)).error.fields?.["note"]?.[0]).toMatch(/Say in the note/);
    expect((await post(reported, tokens.member, { cause: "wrong_ph", extra: 1 })).status).toBe(422);
    expect((await post(reported, tokens.member, { cause: "wrong_ph", note: "a\u0000b" })).status).toBe(422);
    expect((await post(unreported, tokens.member, { cause: "wrong_ph" })).status).toBe(404);
    expect(await stored()).toEqual(snapshot);
    expect(await t.db.auditEvent.count({ where: { action: "workup.found_cause" } })).toBe(audits);
  });

  it("clears a finding with cause null", async () => {
    const res = await post(reported, tokens.member, { cause: null });
    expect(res.status).toBe(200);
    expect(await stored()).toEqual({ foundCause: null, foundCauseNote: "", foundCauseById: null, foundCauseAt: null });
  });
});
