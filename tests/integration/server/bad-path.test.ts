// A path whose %-escapes do not decode to UTF-8 is the client's mistake: the production server (scripts/serve.mjs)
// answers 400 with a JSON message before Next.js, which would answer a bare 500, ever sees it.
import http from "node:http";
import { type AddressInfo } from "node:net";
import { afterAll, beforeAll, expect, it } from "vitest";
import { serve } from "@/scripts/serve.mjs";

let server: http.Server;
let port = 0;
const reached: string[] = [];

beforeAll(async () => {
  server = await serve({
    port: 0,
    handler: (req, res) => {
      reached.push(req.url ?? "");
      res.end("ok");
    },
    log: () => undefined,
    onStopped: () => undefined,
  });
  port = (server.address() as AddressInfo).port;
});

afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())));

function get(pathname: string): Promise<{ status: number; body: string }> {
  return new Promise((resolve, reject) => {
    http.get({ host: "127.0.0.1", port, path: pathname, agent: false }, (res) => {
      let body = "";
      res.on("data", (c: Buffer) => (body += c.toString()));
      res.on("end", () => resolve({ status: res.statusCode ?? 0, body }));
    }).on("error", reject);
  });
}

it("answers 400 with a message for an undecodable path and passes everything else on", async () => {
  for (const bad of ["/api/v1/workups/%FF", "/api/v1/workups/%ED%A0%80", "/workups/abc%2"]) {
    const res = await get(bad);
    expect(res.status, bad).toBe(400);
    expect(JSON.parse(res.body)).toEqual({ error: { code: "bad_request", message: "The address is not valid: a %-escape in its path is not UTF-8 text." } });
  }
  expect(reached).toEqual([]);
  expect((await get("/api/v1/workups/c%C3%A9?q=%FF")).status).toBe(200);
  expect(reached).toEqual(["/api/v1/workups/c%C3%A9?q=%FF"]);
});
