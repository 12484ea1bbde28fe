// Malformed requests over HTTP against the write and search routes, generated from a valid request of each route by
// breaking one thing at a time: a NUL byte or a lone surrogate in a text, numbers that are huge, negative, NaN or
// infinite, the wrong type, unknown keys, broken JSON/CSV/SMILES/SMARTS/MOL, oversized bodies, the wrong content
// type, another group's ids, bad cursors and dates, broken percent-encoding. Each answer is checked for a 5xx, a
// broken connection, and a stack trace or internal message in its body.
import { randomBytes } from "node:crypto";
import { createRng } from "@/lib/chem/random";
import { type GroupRecords, type People, OUTCOME, PNG_1PX, workupBody } from "./fixtures";
import { ask, bearer, pool, type Answer } from "./http";

export interface FuzzCase {
  target: string;
  mutation: string;
  method: string;
  path: string;
  contentType?: string;
  body?: string | Uint8Array;
  /** A request that changes data if it is accepted. */
  write: boolean;
}

export interface FuzzResult {
  requests: number;
  byTarget: Record<string, number>;
  byStatus: Record<string, number>;
  serverErrors: number;
  brokenConnections: number;
  leaks: number;
  acceptedWrites: number;
  problems: { target: string; mutation: string; status: number; why: string; body: string }[];
  accepted: { target: string; mutation: string; status: number }[];
  /** The slowest answer, to see that no single request held the server for long. */
  slowestMs: number;
  slowest: string;
  /** Status of each case, in the order given (-1 reset, -2 timeout). */
  statuses: number[];
  /** Record ids named by acknowledged writes (in their path or their answer): what a 2xx may have written. */
  acknowledgedIds: string[];
}

const RECORD_ID = /^c[0-9a-z]{20,30}$/;

/** Every record id in a path and an answer body (JSON strings that look like ids). */
function idsIn(path: string, body: string): string[] {
  const found = path.split(/[/?&=]/).filter((s) => RECORD_ID.test(s));
  const visit = (v: unknown): void => {
    if (typeof v === "string") {
      if (RECORD_ID.test(v)) found.push(v);
    } else if (Array.isArray(v)) v.forEach(visit);
    else if (v && typeof v === "object") Object.values(v).forEach(visit);
  };
  try {
    visit(JSON.parse(body));
  } catch {
    // not JSON (e.g. 204): the path names the record
  }
  return found;
}

/** Patterns of a stack trace, a file path, a driver or parser message: none may reach a client. */
const LEAK_PATTERNS: [RegExp, string][] = [
  [/\n\s*at\s+\S.*:\d+:\d+/, "stack frame"],
  [/\bat\s+[\w.<>]+\s+\((?:file:|\/|node:)/, "stack frame"],
  [/node_modules|\/work\/|\/home\/|\.next\/|webpack|turbopack|\.tsx?:\d+/, "file path"],
  [/PrismaClient|Invalid `|prisma\.\w+\.|\bP[12]\d{3}\b/, "Prisma message"],
  [/\b(TypeError|ReferenceError|RangeError|SyntaxError|AggregateError)\b/, "JavaScript error name"],
  // Not counted: the 400 for malformed JSON quotes the parser's description of the client's own body on purpose
  // (lib/api/body.ts readJsonBody; asserted by tests/integration/api/workups.test.ts).
  [/\bSELECT\b[\s\S]*\bFROM\b|relation "|violates [\w ]*constraint|duplicate key value|invalid byte sequence|syntax error at or near/i, "SQL message"],
  [/\bE(CONNRESET|CONNREFUSED|PIPE)\b|ERR_[A-Z_]{4,}/, "system error code"],
];

export function leakIn(body: string): string | null {
  for (const [re, what] of LEAK_PATTERNS) if (re.test(body)) return what;
  return null;
}

const RAW = "\u0001RAW:";
/** Values JSON cannot carry are injected as raw text into the serialised body. */
const raw = (text: string) => `${RAW}${text}\u0001`;
const serialise = (value: unknown) => JSON.stringify(value).replace(/"\\u0001RAW:(.*?)\\u0001"/g, (_, t: string) => t.replace(/\\\\/g, "\\").replace(/\\"/g, '"'));

type Json = null | boolean | number | string | Json[] | { [k: string]: Json };

function leafMutations(value: Json, key: string, other: GroupRecords): [string, Json][] {
  const out: [string, Json][] = [
    ["NUL byte", typeof value === "string" ? `${value}\u0000` : "1\u0000"],
    ["lone high surrogate", typeof value === "string" ? `${value}\ud800` : "\ud800"],
    ["lone low surrogate", "x\udc00y"],
    ["huge number", 1e308],
    ["huge negative number", -1e15],
    ["infinity (1e999)", raw("1e999")],
    ["NaN", raw("NaN")],
    ["number too long", raw(`1${"0".repeat(400)}`)],
    ["fraction", 2.5],
    ["number as text", "12abc"],
    ["boolean", true],
    ["array", [1, "a", null]],
    ["operator object", { not: "x", $ne: null }],
    ["null", null],
    ["empty text", ""],
    ["long text (200k)", "x".repeat(200_000)],
    ["deep nesting", raw(`${"[".repeat(5000)}${"]".repeat(5000)}`)],
  ];
  if (typeof value === "string" && /id$/i.test(key)) out.push(["other group's id", other.workupId], ["other group's compound", other.compoundId]);
  if (typeof value === "string" && /date|performedOn|On$/i.test(key)) out.push(["impossible date", "2026-13-45"], ["year 0", "0000-01-01"], ["year 275760", "+275760-09-13"]);
  return out;
}

/** Every leaf and object path of a JSON value (depth-first), capped so one big spec does not drown the rest. */
function paths(value: Json, at: (string | number)[] = []): { path: (string | number)[]; value: Json }[] {
  const here = [{ path: at, value }];
  if (Array.isArray(value)) return [...here, ...value.flatMap((v, i) => paths(v, [...at, i]))];
  if (value !== null && typeof value === "object") return [...here, ...Object.entries(value).flatMap(([k, v]) => paths(v, [...at, k]))];
  return here;
}

function setAt(root: Json, path: (string | number)[], value: Json): Json {
  if (path.length === 0) return value;
  const copy = structuredClone(root) as Record<string | number, Json>;
  let node = copy;
  for (const p of path.slice(0, -1)) node = node[p] as Record<string | number, Json>;
  node[path[path.length - 1] as string | number] = value;
  return copy;
}

function jsonCases(target: string, method: string, path: string, base: Json, other: GroupRecords, limitBytes: number): FuzzCase[] {
  const cases: FuzzCase[] = [];
  const push = (mutation: string, body: string | Uint8Array, contentType = "application/json") => cases.push({ target, mutation, method, path, body, contentType, write: method !== "GET" });
  for (const { path: p, value } of paths(base)) {
    const key = String(p[p.length - 1] ?? "");
    const where = p.join(".") || "(body)";
    if (value !== null && typeof value === "object") {
      if (!Array.isArray(value)) {
        push(`unknown key at ${where}`, serialise(setAt(base, p, { ...value, unexpectedKey: 1 })));
        if (p.length === 0) push("__proto__ key", serialise(base).replace(/^\{/, '{"__proto__":{"role":"lead"},'));
        push(`constructor key at ${where}`, serialise(setAt(base, p, { ...value, constructor: { prototype: { x: 1 } } })));
      } else {
        push(`oversized array at ${where}`, serialise(setAt(base, p, Array.from({ length: 5000 }, () => value[0] ?? 1))));
      }
      continue;
    }
    for (const [mutation, replacement] of leafMutations(value, key, other)) push(`${mutation} at ${where}`, serialise(setAt(base, p, replacement)));
  }
  const text = serialise(base);
  push("truncated JSON", text.slice(0, Math.floor(text.length / 2)));
  push("empty body", "");
  push("JSON null", "null");
  push("JSON array", "[]");
  push("JSON string", '"workup"');
  push("JSON number", "42");
  push("trailing garbage", `${text}}}`);
  push("single quotes", text.replace(/"/g, "'"));
  push("invalid UTF-8 bytes", new Uint8Array([0x7b, 0x22, 0xff, 0xfe, 0x22, 0x3a, 0x31, 0x7d]));
  push("UTF-8 BOM", `\ufeff${text}`);
  push("duplicate keys", text.replace(/^\{/, '{"header":1,'));
  push("oversized body", `{"pad":"${"x".repeat(limitBytes + 1024)}"}`);
  push("text/plain content type", text, "text/plain");
  push("form content type", "a=1&b=2", "application/x-www-form-urlencoded");
  push("multipart content type", "--x\r\nContent-Disposition: form-data; name=\"a\"\r\n\r\n1\r\n--x--", "multipart/form-data; boundary=x");
  push("XML body", "<?xml version=\"1.0\"?><a/>", "application/xml");
  return cases;
}

const QUERY_VALUES: [string, string][] = [
  ["NUL byte", "x%00"], ["broken percent-encoding", "%ED%A0%80"], ["invalid UTF-8", "%FF%FE"], ["lone percent", "%"],
  ["negative", "-1"], ["huge", "1e308"], ["twenty digits", "99999999999999999999"], ["NaN", "NaN"], ["Infinity", "Infinity"],
  ["zero", "0"], ["fraction", "2.5"], ["letters", "abc"], ["empty", ""], ["impossible date", "2026-13-45"], ["year 0", "0000-01-01"],
  ["far date", "9999-12-31T99:99"], ["long (5k)", "x".repeat(5000)], ["path traversal", "..%2F..%2Fetc%2Fpasswd"],
  ["SQL quote", "'%20OR%201%3D1%20--"], ["JSON object", "%7B%22%24ne%22%3Anull%7D"], ["array syntax", "%5B%5D"],
];

function cursorValues(other: GroupRecords): [string, string][] {
  const b64 = (s: string) => Buffer.from(s, "utf8").toString("base64url");
  return [
    ["random cursor", randomBytes(24).toString("base64url")],
    ["cursor year 0", b64(`0000-01-01T00:00:00.000Z|${other.workupId}`)],
    ["cursor year 275760", b64(`+275760-09-13T00:00:00.000Z|${other.workupId}`)],
    ["cursor other group's row", b64(`2026-11-03T00:00:00.000Z|${other.workupId}`)],
    ["cursor without separator", b64("2026-11-03")],
    ["cursor with NUL", b64("2026-11-03T00:00:00.000Z|c\u0000")],
    ["cursor of JSON", b64('{"id":{"not":"x"}}')],
    ["cursor not base64", "***"],
  ];
}

function queryCases(target: string, path: string, params: Record<string, string>, extra: Record<string, [string, string][]>, write = false): FuzzCase[] {
  const cases: FuzzCase[] = [];
  const qs = (p: Record<string, string>) => Object.entries(p).map(([k, v]) => `${encodeURIComponent(k)}=${v}`).join("&");
  for (const name of Object.keys(params)) {
    for (const [mutation, value] of [...QUERY_VALUES, ...(extra[name] ?? [])]) {
      cases.push({ target, mutation: `${name}: ${mutation}`, method: write ? "POST" : "GET", path: `${path}?${qs({ ...params, [name]: value })}`, write });
    }
    cases.push({ target, mutation: `${name}: repeated`, method: "GET", path: `${path}?${qs(params)}&${encodeURIComponent(name)}=2`, write });
  }
  cases.push({ target, mutation: "unknown parameter", method: "GET", path: `${path}?${qs({ ...params, unexpected: "1" })}`, write });
  return cases;
}

const PATH_IDS: [string, string][] = [
  ["NUL in id", "c%00"], ["broken percent-encoding in id", "%ED%A0%80"], ["invalid UTF-8 in id", "%FF"], ["long id", "c".repeat(3000)],
  ["traversal id", "..%2F..%2Fme"], ["SQL quote id", "'%20OR%20'1'%3D'1"], ["empty-ish id", "%20"],
];

function pathCases(target: string, method: string, template: (id: string) => string, other: GroupRecords, otherId: string, write: boolean, body?: { contentType: string; body: string | Uint8Array }): FuzzCase[] {
  const ids: [string, string][] = [...PATH_IDS, ["other group's id", otherId], ["other group's workup id", other.workupId]];
  return ids.map(([mutation, id]) => ({
    target, mutation, method, path: template(id), write, ...(body ? { contentType: body.contentType, body: body.body } : {}),
  }));
}

const BAD_SMILES = ["C1CC", "((((", "C[Xx]C", "c1ccccc", "C=1=C", "[C@@H](", "C%99", "*", "[Na+].[Cl-].", "C".repeat(20000), "O=C(O)c1ccccc1\u0000", "[$([$([$(C)])])]", "[#6", "C(", "$(C)", "~*~*~*~*", "[2H:1]>>[C:1]", "c1cc(cc1", "N#N#N", "[H][H][H]"];
const BAD_MOL = [
  "\n  bad\n\n  2  1  0  0  0  0  0  0  0  0999 V2000\n    0.0    0.0    0.0 C   0  0\nM  END\n",
  "no counts line\nM  END\n",
  "\n\n\n999999999999  0  0  0  0  0  0  0  0  0999 V2000\nM  END\n",
  "$$$$\n$$$$\n$$$$\n",
  `\n\n\n  1  0  0  0  0  0  0  0  0  0999 V3000\nM  V30 BEGIN CTAB\nM  V30 COUNTS -5 0 0 0 0\nM  END\n`,
];

function csvCases(target: string, path: string, csv: string, other: GroupRecords): FuzzCase[] {
  const cases: FuzzCase[] = [];
  const push = (mutation: string, body: string | Uint8Array, contentType = "text/csv") => cases.push({ target, mutation, method: "POST", path, body, contentType, write: true });
  const lines = csv.split(/\r?\n/).filter((l) => l !== "");
  const header = lines[0] ?? "";
  const columns = header.split(",");
  const row = lines[1] ?? "";
  // Cell by cell (the spec column holds JSON, so a naive split is only a rough cut, which is itself malformed input).
  const cells = row.split(",");
  const values = ["\u0000", "x\ud800", "-1e308", "NaN", "", "2026-13-45", "0000-01-01", "{", "\"unbalanced", "=cmd|' /C calc'!A0", "y".repeat(100_000), other.workupId, "1e999"];
  for (let i = 0; i < Math.min(cells.length, columns.length); i++) {
    for (const v of values) {
      const mutated = [...cells];
      mutated[i] = v.includes(",") || v.includes("\"") ? `"${v.replace(/"/g, '""')}"` : v;
      push(`cell ${columns[i] ?? i}: ${v.slice(0, 12)}`, `${header}\n${mutated.join(",")}\n`);
    }
  }
  push("header only", `${header}\n`);
  push("empty", "");
  push("unknown column", `${header},unexpected\n${row},1\n`);
  push("missing columns", `${columns.slice(0, 2).join(",")}\n${cells.slice(0, 2).join(",")}\n`);
  push("extra cells", `${header}\n${row},1,2,3\n`);
  push("unbalanced quote", `${header}\n"${row}\n`);
  push("NUL in header", `${header}\u0000\n${row}\n`);
  push("5001 rows", `${header}\n${Array.from({ length: 5001 }, () => cells.map(() => "1").join(",")).join("\n")}\n`);
  push("invalid UTF-8", new Uint8Array([...Buffer.from(`${header}\n`), 0xff, 0xfe, 0xed, 0xa0, 0x80, 0x0a]));
  push("semicolon separated", `${header.replace(/,/g, ";")}\n${row.replace(/,/g, ";")}\n`);
  push("CR line ends", `${header}\r${row}\r`);
  push("JSON content type", `${header}\n${row}\n`, "application/json");
  push("oversized (11 MB)", `${header}\n${"z".repeat(11 * 1024 * 1024)}\n`);
  return cases;
}

export interface FuzzContext {
  base: string;
  root: string;
  people: People;
  recordsA: GroupRecords;
  recordsB: GroupRecords;
}

export async function buildCases(c: FuzzContext, wanted: number, seed = 12): Promise<FuzzCase[]> {
  const A = c.recordsA;
  const B = c.recordsB;
  const t = c.people.member.token;
  const detail = await ask(c.base, `/api/v1/workups/${A.workupId}`, { headers: bearer(t) });
  const version = (JSON.parse(detail.body) as { version: number }).version;
  const csv = (await ask(c.base, "/api/v1/workups.csv", { headers: bearer(t) })).body;
  const MB = 1024 * 1024;
  const create = workupBody(c.root, "Fuzzed workup") as Json;
  const outcome = { ...OUTCOME, layerAssays: [{ step: 1, phase: "aqueous", compoundKey: "benzanilide", amountMmol: 0.1, volumeMl: 20, portion: 1 }] } as Json;
  const groups: FuzzCase[][] = [
    jsonCases("POST /api/v1/workups", "POST", "/api/v1/workups", create, B, MB),
    jsonCases("PUT /api/v1/workups/{id}", "PUT", `/api/v1/workups/${A.workupId}`, { ...(create as object), baseVersion: version }, B, MB),
    jsonCases("POST /api/v1/workups/{id}/outcome", "POST", `/api/v1/workups/${A.workupId}/outcome`, outcome, B, MB),
    jsonCases("POST /api/v1/predict", "POST", "/api/v1/predict", { spec: (create as { spec: Json }).spec, draws: 0 }, B, MB),
    jsonCases("POST /api/v1/compounds", "POST", "/api/v1/compounds", { format: "smiles", text: "CCOc1ccc(NC(C)=O)cc1 phenacetin", tags: ["bench"], onDuplicate: "reject" }, B, 10 * MB + 64 * 1024),
    [...BAD_SMILES.map((s) => ({ format: "smiles", text: s })), ...BAD_MOL.flatMap((m) => [{ format: "mol", text: m }, { format: "sdf", text: m }])].map((b, i) => ({
      target: "POST /api/v1/compounds", mutation: `malformed structure #${i}`, method: "POST", path: "/api/v1/compounds", contentType: "application/json", body: JSON.stringify(b), write: true,
    })),
    csvCases("POST /api/v1/workups/import", "/api/v1/workups/import", csv, B),
    queryCases("GET /api/v1/workups", "/api/v1/workups", { q: "benz", solvent: "etoac", from: "2026-01-01", to: "2026-12-31", flagged: "false", status: "below", cursor: "", limit: "20", compoundId: A.compoundId, chemistId: c.people.member.userId },
      { cursor: cursorValues(B), compoundId: [["other group's compound", B.compoundId]], chemistId: [["other group's person", c.people.otherLead.userId]] }),
    queryCases("GET /api/v1/workups.csv", "/api/v1/workups.csv", { q: "benz", from: "2026-01-01", to: "2026-12-31", status: "below", compoundId: A.compoundId, chemistId: c.people.member.userId },
      { compoundId: [["other group's compound", B.compoundId]] }),
    queryCases("GET /api/v1/compounds (text)", "/api/v1/compounds", { mode: "text", query: "phen", limit: "10" }, {}),
    queryCases("GET /api/v1/compounds (similarity)", "/api/v1/compounds", { mode: "similarity", query: "c1ccccc1O", threshold: "0.3", topK: "10" },
      { query: BAD_SMILES.slice(0, 12).map((s, i) => [`bad SMILES #${i}`, encodeURIComponent(s)]) }),
    queryCases("GET /api/v1/compounds (substructure)", "/api/v1/compounds", { mode: "substructure", query: "c1ccccc1", queryType: "smarts", limit: "10" },
      { query: BAD_SMILES.map((s, i) => [`bad SMARTS #${i}`, encodeURIComponent(s)]), mode: [["unknown mode", "regex"]] }),
    queryCases("GET /api/v1/compounds (list)", "/api/v1/compounds", { after: "a", tag: "bench", limit: "10" }, { after: [["cursor with NUL", "phenacetin%00c1"]] }),
    queryCases("GET /api/v1/workups/{id}/diff", `/api/v1/workups/${A.workupId}/diff`, { from: "1", to: "2" }, {}),
    queryCases("GET /api/v1/review/calibration", "/api/v1/review/calibration", { from: "2026-01-01", to: "2026-12-31", chemist: c.people.member.userId, solvent: "etoac" }, {}),
    queryCases("GET /api/depict/structure", "/api/depict/structure", { smiles: "c1ccccc1O", w: "300", h: "200", highlight: "1,2" }, { smiles: BAD_SMILES.map((s, i) => [`bad SMILES #${i}`, encodeURIComponent(s)]) }),
    queryCases("POST /api/v1/workups/{id}/attachments", `/api/v1/workups/${A.workupId}/attachments`, { name: "tlc.png", target: "workup" }, {}, true)
      .map((x) => ({ ...x, method: "POST", contentType: "application/octet-stream", body: PNG_1PX, write: true })),
    [
      ["empty file", new Uint8Array(0)], ["executable", Buffer.from("MZ\x90\x00\x03\x00\x00\x00")], ["HTML", Buffer.from("<html><script>alert(1)</script></html>")],
      ["SVG with script", Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>')], ["truncated PNG", PNG_1PX.subarray(0, 20)],
      ["11 MB", new Uint8Array(11 * MB)],
    ].map(([mutation, bytes]) => ({ target: "POST /api/v1/workups/{id}/attachments", mutation: String(mutation), method: "POST", path: `/api/v1/workups/${A.workupId}/attachments?name=x.png`, contentType: "application/octet-stream", body: bytes as Uint8Array, write: true })),
    [["not an image", Buffer.from("hello")], ["300 kB", new Uint8Array(300 * 1024)], ["empty", new Uint8Array(0)], ["PNG as JSON", PNG_1PX]].map(([mutation, bytes], i) => ({
      target: "PUT /api/v1/attachments/{id}/thumbnail", mutation: String(mutation), method: "PUT", path: `/api/v1/attachments/${A.attachmentId}/thumbnail`, contentType: i === 3 ? "application/json" : "image/png", body: bytes as Uint8Array, write: true,
    })),
    pathCases("GET /api/v1/workups/{id}", "GET", (id) => `/api/v1/workups/${id}`, B, B.workupId, false),
    pathCases("PUT /api/v1/workups/{id}", "PUT", (id) => `/api/v1/workups/${id}`, B, B.workupId, true, { contentType: "application/json", body: JSON.stringify({ ...(create as object), baseVersion: 1 }) }),
    pathCases("DELETE /api/v1/workups/{id}", "DELETE", (id) => `/api/v1/workups/${id}`, B, B.workupId, true),
    pathCases("POST /api/v1/workups/{id}/outcome", "POST", (id) => `/api/v1/workups/${id}/outcome`, B, B.workupId, true, { contentType: "application/json", body: JSON.stringify(OUTCOME) }),
    pathCases("DELETE /api/v1/attachments/{id}", "DELETE", (id) => `/api/v1/attachments/${id}`, B, B.attachmentId, true),
    pathCases("GET /api/v1/compounds/{id}", "GET", (id) => `/api/v1/compounds/${id}`, B, B.compoundId, false),
    pathCases("GET /api/v1/partition/{id}", "GET", (id) => `/api/v1/partition/${id}?format=csv`, B, B.compoundId, false),
    pathCases("GET /api/depict/compounds/{id}", "GET", (id) => `/api/depict/compounds/${id}`, B, B.compoundId, false),
  ];
  // Sample evenly-ish: every group keeps at least its share, the rest filled at random (seeded).
  const all = groups.flat();
  if (all.length <= wanted) return all;
  const stream = createRng(seed);
  const random = () => stream.uniform();
  const perGroup = Math.floor(wanted / groups.length);
  const picked = new Set<FuzzCase>();
  for (const g of groups) {
    const shuffled = [...g].sort(() => random() - 0.5);
    for (const x of shuffled.slice(0, perGroup)) picked.add(x);
  }
  const rest = all.filter((x) => !picked.has(x)).sort(() => random() - 0.5);
  for (const x of rest) {
    if (picked.size >= wanted) break;
    picked.add(x);
  }
  return [...picked];
}

export async function runFuzz(c: FuzzContext, cases: FuzzCase[], width = 4): Promise<FuzzResult> {
  const result: FuzzResult = { requests: 0, byTarget: {}, byStatus: {}, serverErrors: 0, brokenConnections: 0, leaks: 0, acceptedWrites: 0, problems: [], accepted: [], slowestMs: 0, slowest: "", statuses: [], acknowledgedIds: [] };
  const token = c.people.member.token;
  await pool(cases, width, async (x, i) => {
    const headers: Record<string, string> = bearer(token);
    if (x.contentType) headers["content-type"] = x.contentType;
    const a: Answer = await ask(c.base, x.path, { method: x.method, headers, body: x.body, timeoutMs: 120_000 });
    result.requests++;
    result.statuses[i] = a.status;
    result.byTarget[x.target] = (result.byTarget[x.target] ?? 0) + 1;
    const key = a.failure ?? String(a.status);
    result.byStatus[key] = (result.byStatus[key] ?? 0) + 1;
    if (a.ms > result.slowestMs) {
      result.slowestMs = a.ms;
      result.slowest = `${x.target} / ${x.mutation} (${a.status})`;
    }
    const problem = (why: string) => result.problems.push({ target: x.target, mutation: x.mutation, status: a.status, why, body: a.body.slice(0, 300) });
    if (a.failure) {
      result.brokenConnections++;
      problem(`connection ${a.failure}`);
    } else if (a.status >= 500) {
      result.serverErrors++;
      problem(`server error ${a.status}`);
    }
    const leak = leakIn(a.body);
    if (leak) {
      result.leaks++;
      problem(`${leak} in the body`);
    }
    if (x.write && a.status >= 200 && a.status < 300) {
      result.acceptedWrites++;
      result.accepted.push({ target: x.target, mutation: x.mutation, status: a.status });
      result.acknowledgedIds.push(...idsIn(x.path, a.body));
    }
  });
  return result;
}
