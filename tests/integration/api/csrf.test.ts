// Cross-site writes with the session cookie. Before the origin check, POST /api/v1/workups with the cookie,
// Content-Type text/plain and Origin http://evil.example answered 201 (only SameSite=Lax stood in the way).
// The rules under test: OWASP CSRF Prevention Cheat Sheet ("Verifying Origin With Standard Headers", Fetch Metadata)
// and the Fetch standard's CORS-safelisted request content types (text/plain, urlencoded, multipart).
import "./next-runtime";
import { beforeAll, describe, expect, it } from "vitest";
import * as me from "@/app/api/v1/me/route";
import * as workups from "@/app/api/v1/workups/route";
import * as workup from "@/app/api/v1/workups/[id]/route";
import * as csvImport from "@/app/api/v1/workups/import/route";
import { describeWithAppDatabase } from "@/tests/integration/auth/app-database";
import { exampleSpec, footprint, header, makeLab, type Lab } from "@/tests/integration/workups/fixtures";
import { callRoute, tokenFor } from "./call";
import { sessionCookieHeader } from "./session-cookie";

const OWN = "http://localhost";
const body = () => JSON.stringify({ header: header({ title: "Cross-site attempt" }), spec: exampleSpec() });

describeWithAppDatabase("cross-site request forgery on route handlers", (t) => {
  let lab: Lab;
  let cookie = "";
  let token = "";

  beforeAll(async () => {
    lab = await makeLab(t.db, "Origin Lab");
    cookie = await sessionCookieHeader({ uid: lab.member.userId, activeGroupId: lab.groupId, email: "m@example.org", name: "M" });
    token = await tokenFor(t.db, lab.groupId, lab.member.userId);
  });

  const post = (headers: Record<string, string>, rawBody = body()) =>
    callRoute(workups.POST, "POST", "/api/v1/workups", { rawBody, headers: { cookie, host: "localhost", ...headers } });

  describe("the session cookie alone does not make a write", () => {
    it("refuses the reported attack: text/plain from Origin http://evil.example (was 201)", async () => {
      const before = await footprint(t.db);
      const res = await post({ "content-type": "text/plain", origin: "http://evil.example" });
      expect(res.status).toBe(403);
      expect(await footprint(t.db)).toEqual(before);
    });

    it("refuses a JSON body from a foreign origin, a cross-site fetch, and a request with no origin at all", async () => {
      const before = await footprint(t.db);
      expect((await post({ "content-type": "application/json", origin: "http://evil.example" })).status).toBe(403);
      expect((await post({ "content-type": "application/json", "sec-fetch-site": "cross-site", origin: OWN })).status).toBe(403);
      expect((await post({ "content-type": "application/json", "sec-fetch-site": "same-site" })).status).toBe(403);
      expect((await post({ "content-type": "application/json" })).status).toBe(403);
      expect((await post({ "content-type": "application/json", origin: "null" })).status).toBe(403);
      expect(await footprint(t.db)).toEqual(before);
    });

    it("refuses a same-origin body a foreign form could also send (text/plain, urlencoded, multipart) with 415", async () => {
      const before = await footprint(t.db);
      for (const type of ["text/plain", "application/x-www-form-urlencoded", "multipart/form-data; boundary=x"]) {
        const res = await post({ "content-type": type, origin: OWN });
        expect(res.status).toBe(415);
        expect(((await res.json()) as { error: { message: string } }).error.message).toBe("Send the body as application/json.");
      }
      expect(await footprint(t.db)).toEqual(before);
    });

    it("refuses a cookie DELETE from a foreign origin and keeps the workup", async () => {
      const created = await post({ "content-type": "application/json", origin: OWN });
      const { id } = (await created.json()) as { id: string };
      const res = await callRoute(workup.DELETE, "DELETE", `/api/v1/workups/${id}`, { params: { id }, headers: { cookie, host: "localhost", origin: "http://evil.example" } });
      expect(res.status).toBe(403);
      expect(await t.db.workup.count({ where: { id } })).toBe(1);
    });
  });

  describe("our own pages still write", () => {
    it("accepts JSON with a same-origin Origin, or with Sec-Fetch-Site: same-origin", async () => {
      expect((await post({ "content-type": "application/json", origin: OWN })).status).toBe(201);
      expect((await post({ "content-type": "application/json; charset=utf-8", "sec-fetch-site": "same-origin" })).status).toBe(201);
    });

    it("lets a CSV upload through as text/csv, the import route's own type, but not as text/plain", async () => {
      const plain = await callRoute(csvImport.POST, "POST", "/api/v1/workups/import", { rawBody: "title\n", headers: { cookie, host: "localhost", origin: OWN, "content-type": "text/plain" } });
      expect(plain.status).toBe(415);
      const csv = await callRoute(csvImport.POST, "POST", "/api/v1/workups/import", { rawBody: "title\n", headers: { cookie, host: "localhost", origin: OWN, "content-type": "text/csv" } });
      expect([201, 422]).toContain(csv.status); // past the origin check: the importer judges the (empty) file
    });

    it("reads need no origin (GET /me with the cookie alone)", async () => {
      const res = await callRoute(me.GET, "GET", "/api/v1/me", { headers: { cookie } });
      expect(res.status).toBe(200);
      expect(await res.json()).toMatchObject({ via: "session", role: "member" });
    });
  });

  it("bearer-token requests are unaffected: no Origin, any origin, text/plain body", async () => {
    const res = await callRoute(workups.POST, "POST", "/api/v1/workups", { token, rawBody: body(), headers: { "content-type": "text/plain", origin: "http://evil.example" } });
    expect(res.status).toBe(201);
    const bare = await callRoute(workups.POST, "POST", "/api/v1/workups", { token, rawBody: body() });
    expect(bare.status).toBe(201);
  });
});
