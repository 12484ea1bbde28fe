// Attachments through the real route handlers and database: upload, list, open, thumbnail and delete as a member;
// then every refusal (another group's workup or file, a viewer, a file of another kind, an oversized file, an
// outcome that does not exist yet), each time checking nothing was written.
import "@/tests/integration/api/next-runtime";
import { beforeAll, describe, expect, it } from "vitest";
import * as workups from "@/app/api/v1/workups/route";
import * as list from "@/app/api/v1/workups/[id]/attachments/route";
import * as one from "@/app/api/v1/attachments/[id]/route";
import * as thumb from "@/app/api/v1/attachments/[id]/thumbnail/route";
import { describeWithAppDatabase } from "@/tests/integration/auth/app-database";
import { exampleSpec, header, makeLab, type Lab } from "@/tests/integration/workups/fixtures";
import { callRoute, json, tokenFor } from "@/tests/integration/api/call";

// The smallest valid PNG: the 8-byte signature (PNG specification, ISO/IEC 15948, §5.2) and IHDR/IDAT/IEND of a 1×1 image.
const PNG_1X1 = Uint8Array.from(Buffer.from("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==", "base64"));
// A PDF begins "%PDF-" (ISO 32000-1, §7.5.2).
const PDF = new TextEncoder().encode("%PDF-1.4\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n");
const CSV = new TextEncoder().encode("wavenumber,absorbance\n1715,0.82\n1600,0.31\n");
// A Windows executable begins "MZ": not a kind of file kept here.
const EXE = Uint8Array.from([0x4d, 0x5a, 0x90, 0x00, 0x03, 0x00, 0x00, 0x00, 0x04, 0x00]);

type Info = { id: string; mediaType: string; sizeBytes: number; fileName: string; hasThumbnail: boolean; target: string };

describeWithAppDatabase("attachments API", (t) => {
  let lab: Lab;
  let other: Lab;
  const tokens = { member: "", viewer: "", outsider: "" };
  let workupId = "";
  let theirWorkupId = "";
  let theirFileId = "";

  const upload = (token: string, id: string, name: string, bytes: Uint8Array, query: Record<string, string> = {}) =>
    callRoute(list.POST, "POST", `/api/v1/workups/${id}/attachments`, {
      token, params: { id }, query: { name, ...query }, rawBody: bytes, headers: { "content-type": "application/octet-stream" },
    });

  beforeAll(async () => {
    lab = await makeLab(t.db, "Plover Lab");
    other = await makeLab(t.db, "Sandpiper Lab");
    tokens.member = await tokenFor(t.db, lab.groupId, lab.member.userId);
    tokens.viewer = await tokenFor(t.db, lab.groupId, lab.viewer.userId);
    tokens.outsider = await tokenFor(t.db, other.groupId, other.member.userId);
    const mine = await callRoute(workups.POST, "POST", "/api/v1/workups", { token: tokens.member, body: { header: header(), spec: exampleSpec() } });
    workupId = (await json<{ id: string }>(mine)).id;
    const theirs = await callRoute(workups.POST, "POST", "/api/v1/workups", { token: tokens.outsider, body: { header: header(), spec: exampleSpec() } });
    theirWorkupId = (await json<{ id: string }>(theirs)).id;
    theirFileId = (await json<Info>(await upload(tokens.outsider, theirWorkupId, "their-tlc.png", PNG_1X1))).id;
  });

  describe("as a member", () => {
    it("keeps an image, a PDF and a text data file, typed by their content, and lists them without their bytes", async () => {
      const png = await upload(tokens.member, workupId, "TLC 30% EtOAc.png", PNG_1X1);
      expect(png.status).toBe(201);
      expect(await json(png)).toMatchObject({ mediaType: "image/png", sizeBytes: PNG_1X1.byteLength, fileName: "TLC 30% EtOAc.png", target: "workup" });
      // Claimed as a spectrum by its name, it is typed by what it contains.
      expect(await json(await upload(tokens.member, workupId, "ir.jdx", PDF))).toMatchObject({ mediaType: "application/pdf" });
      expect(await json(await upload(tokens.member, workupId, "ir.csv", CSV))).toMatchObject({ mediaType: "text/plain; charset=utf-8" });
      const res = await callRoute(list.GET, "GET", `/api/v1/workups/${workupId}/attachments`, { token: tokens.viewer, params: { id: workupId } });
      const body = await json<{ attachments: Info[] }>(res);
      expect(body.attachments.map((a) => a.fileName)).toEqual(["TLC 30% EtOAc.png", "ir.jdx", "ir.csv"]);
      expect(JSON.stringify(body)).not.toContain("data");
    });

    it("gives the file back byte for byte, sandboxed and not sniffed", async () => {
      const [first] = (await json<{ attachments: Info[] }>(await callRoute(list.GET, "GET", "", { token: tokens.viewer, params: { id: workupId } }))).attachments;
      const res = await callRoute(one.GET, "GET", `/api/v1/attachments/${first?.id}`, { token: tokens.viewer, params: { id: first?.id ?? "" } });
      expect(res.status).toBe(200);
      expect(new Uint8Array(await res.arrayBuffer())).toEqual(PNG_1X1);
      expect(res.headers.get("x-content-type-options")).toBe("nosniff");
      expect(res.headers.get("content-security-policy")).toContain("sandbox");
      expect(res.headers.get("content-disposition")).toContain("filename*=UTF-8''TLC%2030%25%20EtOAc.png");
    });

    it("stores a thumbnail for an image only, and only a PNG or JPEG one", async () => {
      const [png, pdf] = (await json<{ attachments: Info[] }>(await callRoute(list.GET, "GET", "", { token: tokens.viewer, params: { id: workupId } }))).attachments;
      const put = (id: string, bytes: Uint8Array, type: string) =>
        callRoute(thumb.PUT, "PUT", `/api/v1/attachments/${id}/thumbnail`, { token: tokens.member, params: { id }, rawBody: bytes, headers: { "content-type": type } });
      expect((await put(png?.id ?? "", PNG_1X1, "image/png")).status).toBe(204);
      expect((await put(pdf?.id ?? "", PNG_1X1, "image/png")).status).toBe(422);
      expect((await put(png?.id ?? "", PDF, "image/png")).status).toBe(415);
      const got = await callRoute(thumb.GET, "GET", "", { token: tokens.viewer, params: { id: png?.id ?? "" } });
      expect(got.headers.get("content-type")).toBe("image/png");
    });
  });

  describe("refusals write nothing", () => {
    const count = () => t.db.attachment.count();

    it("another group's workup or file is not found, for reading, writing and deleting", async () => {
      const before = await count();
      expect((await upload(tokens.member, theirWorkupId, "x.png", PNG_1X1)).status).toBe(404);
      expect((await callRoute(list.GET, "GET", "", { token: tokens.member, params: { id: theirWorkupId } })).status).toBe(404);
      expect((await callRoute(one.GET, "GET", "", { token: tokens.member, params: { id: theirFileId } })).status).toBe(404);
      expect((await callRoute(one.DELETE, "DELETE", "", { token: tokens.member, params: { id: theirFileId } })).status).toBe(404);
      expect((await callRoute(thumb.GET, "GET", "", { token: tokens.member, params: { id: theirFileId } })).status).toBe(404);
      expect(await count()).toBe(before);
    });

    it("a viewer may look but not attach or delete", async () => {
      const before = await count();
      expect((await upload(tokens.viewer, workupId, "x.png", PNG_1X1)).status).toBe(403);
      expect(await count()).toBe(before);
    });

    it("a file of another kind is 415, an empty one 422, a name with a slash 422, an outcome not yet reported 422", async () => {
      const before = await count();
      expect((await upload(tokens.member, workupId, "setup.exe", EXE)).status).toBe(415);
      expect((await upload(tokens.member, workupId, "empty.txt", new Uint8Array(0))).status).toBe(422);
      const slash = await upload(tokens.member, workupId, "../../etc/passwd", CSV);
      expect(slash.status).toBe(422);
      expect((await json<{ error: { fields: Record<string, string[]> } }>(slash)).error.fields["name"]).toEqual(["name must not contain control characters, slashes or unpaired surrogates"]);
      expect((await upload(tokens.member, workupId, "yield.png", PNG_1X1, { target: "outcome" })).status).toBe(422);
      expect((await upload(tokens.member, "not-an-id", "a.png", PNG_1X1)).status).toBe(422);
      expect(await count()).toBe(before);
    });

    it("a file over 10 MB is 413", async () => {
      const before = await count();
      const big = new Uint8Array(10 * 1024 * 1024 + 1);
      big.set(PNG_1X1);
      expect((await upload(tokens.member, workupId, "huge.png", big)).status).toBe(413);
      expect(await count()).toBe(before);
    });
  });

  it("deleting a file removes it", async () => {
    const created = await json<Info>(await upload(tokens.member, workupId, "to-delete.txt", CSV));
    expect((await callRoute(one.DELETE, "DELETE", "", { token: tokens.member, params: { id: created.id } })).status).toBe(204);
    expect(await t.db.attachment.count({ where: { id: created.id } })).toBe(0);
  });
});
