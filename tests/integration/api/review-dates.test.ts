// The review's date filters hold the same range as workup dates: a year 0 (or any day before 1800-01-01) is a 422
// naming the field, not a database error answered 500.
import "./next-runtime";
import { beforeAll, expect, it } from "vitest";
import * as calibration from "@/app/api/v1/review/calibration/route";
import { describeWithAppDatabase } from "@/tests/integration/auth/app-database";
import { makeLab } from "@/tests/integration/workups/fixtures";
import { callRoute, json, tokenFor } from "./call";

type ErrorJson = { error: { code: string; fields?: Record<string, string[]> } };

describeWithAppDatabase("review date filters", (t) => {
  let token = "";

  beforeAll(async () => {
    const lab = await makeLab(t.db, "Knoevenagel Lab");
    token = await tokenFor(t.db, lab.groupId, lab.member.userId);
  });

  it("refuses a day outside 1800-01-01 … 9999-12-31 with 422 and answers a day inside it", async () => {
    const yearZero = await callRoute(calibration.GET, "GET", "/api/v1/review/calibration", { token, query: { from: "0000-01-01" } });
    expect(yearZero.status).toBe(422);
    expect((await json<ErrorJson>(yearZero)).error.fields?.["from"]).toEqual(["from must be between 1800-01-01 and 9999-12-31"]);
    const early = await callRoute(calibration.GET, "GET", "/api/v1/review/calibration", { token, query: { to: "1799-12-31" } });
    expect(early.status).toBe(422);
    const fine = await callRoute(calibration.GET, "GET", "/api/v1/review/calibration", { token, query: { from: "1800-01-01", to: "2026-12-31" } });
    expect(fine.status).toBe(200);
  });
});
