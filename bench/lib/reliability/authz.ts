// The authorization matrix: every endpoint (./routes.ts) × every principal, with the expected answer derived from
// the permission the endpoint asks for, the role data (lib/authz/permissions.ts), the group walls (another group's
// record answers exactly as a record that does not exist) and the credential rules (tokens open the API only;
// revoked, expired or signed-out credentials open nothing). Counted as violations: a refused principal that got
// through (2xx or any non-refusal), a cross-group answer that differs from the not-found one, any of group A's ids
// or marker in an answer to someone outside group A, and a refused write after which group A's data differ.
import { createHash, randomBytes } from "node:crypto";
import { roleCan, type RoleName } from "@/lib/authz/permissions";
import { type Endpoint } from "./routes";
import { type GroupRecords, type People, OUTCOME, PNG_1PX, workupBody } from "./fixtures";
import { ask, bearer, jsonHeaders, type Answer } from "./http";

type Expect = "allowed" | "signin" | "forbidden" | "notfound" | "open";

interface Principal {
  name: string;
  role: RoleName | null;
  /** "A" = the group whose records are asked for. */
  group: "A" | "B" | null;
  /** Credentials that should open something at all. */
  valid: boolean;
  via: "token" | "session" | null;
  headers: Record<string, string>;
  /** Only for route handlers (a cookie-carried API call), or only for pages. */
  only?: "route" | "page";
}

export interface Cell {
  endpoint: string;
  principal: string;
  expected: Expect;
  status: number;
  verdict: "ok" | "violation" | "unexpected";
  why?: string;
}

export interface MatrixReport {
  endpoints: number;
  routeFiles: number;
  pageFiles: number;
  principals: string[];
  cells: number;
  violations: number;
  unexpected: number;
  serverErrors: number;
  uncovered: string[];
  byKind: Record<string, number>;
  problems: Cell[];
}

const newId = () => `c${randomBytes(12).toString("hex")}`;

function principals(p: People, base: string): Principal[] {
  const cookieWrite = { origin: base, "sec-fetch-site": "same-origin" };
  return [
    { name: "anonymous", role: null, group: null, valid: false, via: null, headers: {} },
    ...(["viewer", "member", "lead"] as const).flatMap((role): Principal[] => [
      { name: `${role} (token)`, role, group: "A", valid: true, via: "token", headers: bearer(p[role].token), only: "route" },
      { name: `${role} (session)`, role, group: "A", valid: true, via: "session", headers: { cookie: p[role].cookie, ...cookieWrite } },
    ]),
    { name: "other group's lead (token)", role: "lead", group: "B", valid: true, via: "token", headers: bearer(p.otherLead.token), only: "route" },
    { name: "other group's lead (session)", role: "lead", group: "B", valid: true, via: "session", headers: { cookie: p.otherLead.cookie, ...cookieWrite } },
    { name: "revoked token", role: "member", group: "A", valid: false, via: "token", headers: bearer(p.revokedToken) },
    { name: "expired token", role: "member", group: "A", valid: false, via: "token", headers: bearer(p.expiredToken) },
    { name: "valid token on a page", role: "lead", group: "A", valid: false, via: "token", headers: bearer(p.lead.token), only: "page" },
    { name: "signed-out session", role: "member", group: "A", valid: false, via: "session", headers: { cookie: p.endedSessionCookie, ...cookieWrite } },
  ];
}

function expectedAnswer(e: Endpoint, pr: Principal, owned: boolean): Expect {
  const req = e.requirement;
  if (req.kind === "public" || req.kind === "unreadable") return "open";
  if (!pr.valid) {
    if (e.kind === "route") return "signin";
    // Pages open for browser sessions only: a member guard (the page's or a layout's) refuses a token before it is
    // even looked up; a guard that only asks for a signed-in person sends it to sign in.
    if (pr.via === "token") return [req, ...e.layouts].some((r) => r.kind === "permission") ? "forbidden" : "signin";
    return "signin";
  }
  if (req.kind === "user") return "allowed";
  if (!pr.role || !roleCan(pr.role, req.permission)) return "forbidden";
  if (owned && pr.group !== "A") return "notfound";
  return "allowed";
}

/** A body that a permitted role's request should succeed with; endpoints without one are judged "not refused". */
interface Template {
  contentType?: string;
  body?: string | Uint8Array;
  query?: string;
  /** Must the permitted answer be 2xx? */
  strict: boolean;
}

const isRedirectToSignIn = (a: Answer) => a.status >= 300 && a.status < 400 && (a.headers.get("location") ?? "").includes("/sign-in");
const refused = (a: Answer) => a.status === 401 || a.status === 403 || a.status === 404 || isRedirectToSignIn(a);

function judge(e: Endpoint, expected: Expect, a: Answer, strict: boolean): { verdict: Cell["verdict"]; why?: string } {
  if (a.failure || a.status >= 500) return { verdict: "unexpected", why: `server error ${a.status} ${a.failure ?? ""}` };
  switch (expected) {
    case "open":
      return { verdict: "ok" };
    case "allowed": {
      if (refused(a)) return { verdict: "unexpected", why: `refused with ${a.status}` };
      if (strict && !(a.status >= 200 && a.status < 400)) return { verdict: "unexpected", why: `answered ${a.status}: ${a.body.slice(0, 160)}` };
      return { verdict: "ok" };
    }
    case "signin":
    case "forbidden":
    case "notfound": {
      if (!refused(a)) return { verdict: "violation", why: `expected ${expected}, got ${a.status}: ${a.body.slice(0, 160)}` };
      const want = expected === "forbidden" ? a.status === 403 : expected === "notfound" ? a.status === 404 : e.kind === "route" ? a.status === 401 : isRedirectToSignIn(a);
      return want ? { verdict: "ok" } : { verdict: "unexpected", why: `refused, but with ${a.status} instead of ${expected}` };
    }
  }
}

export interface MatrixContext {
  base: string;
  root: string;
  people: People;
  recordsA: GroupRecords;
  recordsB: GroupRecords;
}

function digestOf(parts: Answer[]): string {
  const h = createHash("sha256");
  for (const a of parts) h.update(`${a.status}\n${a.body}\n`);
  return h.digest("hex");
}

/** Long enough for a permitted import while heavy requests run beside the matrix (a request given up on would still write). */
const MATRIX_TIMEOUT_MS = 300_000;

/** Waits (up to a minute) until group A has no background job queued or running. */
export async function groupAJobsIdle(c: MatrixContext): Promise<void> {
  for (let i = 0; i < 120; i++) {
    const res = await ask(c.base, "/api/v1/jobs", { headers: bearer(c.people.lead.token) });
    if (res.status === 200 && (JSON.parse(res.body) as { active: unknown[] }).active.length === 0) return;
    await new Promise((r) => setTimeout(r, 500));
  }
}

/** Group A's data as its lead sees them, for "a refused write changed nothing". */
export async function groupADigest(c: MatrixContext): Promise<string> {
  const t = c.people.lead.token;
  const get = (path: string) => ask(c.base, path, { headers: bearer(t) });
  return digestOf(await Promise.all([
    get("/api/v1/workups?limit=200"),
    get("/api/v1/compounds?limit=200"),
    get(`/api/v1/workups/${c.recordsA.workupId}`),
    get(`/api/v1/workups/${c.recordsA.workupId}/attachments`),
    get(`/api/v1/compounds/${c.recordsA.compoundId}`),
  ]));
}

/** Path parameters that name a record of a group (the rest are shared: shipped library keys, invite tokens). */
const OWNED_PARAMS = ["workups/id", "compounds/id", "attachments/id", "partition/compoundId"];

/** Status and (for the API) body with the requested ids blanked, to compare a walled answer with a missing one. */
function shape(e: Endpoint, a: Answer, values: Record<string, string>): string {
  if (e.kind === "page") return String(a.status);
  let body = a.body;
  for (const k of OWNED_PARAMS) if (values[k]) body = body.split(values[k]).join("<id>");
  return `${a.status} ${body}`;
}

/** Fills the template's parameters; `owned` says whether the path names a record of group A. */
function fill(template: string, values: Record<string, string>): { path: string; owned: boolean; missing: string[] } {
  let owned = false;
  const missing: string[] = [];
  const segments = template.split("/");
  const out = segments.map((seg, i) => {
    const m = /^\[(\.\.\.)?(\w+)\]$/.exec(seg);
    if (!m) return seg;
    const key = `${segments[i - 1] ?? ""}/${m[2] ?? ""}`;
    const value = values[key] ?? values[`*/${m[2] ?? ""}`];
    if (value === undefined) {
      missing.push(seg);
      return seg;
    }
    if (OWNED_PARAMS.includes(key)) owned = true;
    return value;
  });
  return { path: out.join("/"), owned, missing };
}

function paramValues(r: GroupRecords): Record<string, string> {
  return {
    "workups/id": r.workupId,
    "compounds/id": r.compoundId,
    "attachments/id": r.attachmentId,
    "partition/compoundId": r.compoundId,
    "library/table": "solvents",
    "*/key": "etoac", // a shipped library entry: every group has it
    "invite/token": randomBytes(32).toString("base64url"),
    "auth/nextauth": "session",
  };
}

/** Per-endpoint preparation: fresh targets for deletes, the current version for updates, bodies for writes. */
async function prepare(c: MatrixContext, e: Endpoint): Promise<{ values: Record<string, string>; template: Template }> {
  const values = paramValues(c.recordsA);
  const lead = c.people.lead.token;
  const key = `${e.method} ${e.template}`;
  const json = (body: unknown): Template => ({ contentType: "application/json", body: JSON.stringify(body), strict: true });
  switch (key) {
    // Bodies carry no marker or id of group A: a permitted write by another group's lead lands in its own group.
    case "POST /api/v1/workups":
      return { values, template: json(workupBody(c.root, "Matrix write")) };
    case "PUT /api/v1/workups/[id]": {
      const current = await ask(c.base, `/api/v1/workups/${c.recordsA.workupId}`, { headers: bearer(lead) });
      const version = (JSON.parse(current.body) as { version: number }).version;
      return { values, template: json({ ...workupBody(c.root, "Matrix edit"), baseVersion: version }) };
    }
    case "DELETE /api/v1/workups/[id]": {
      const made = await ask(c.base, "/api/v1/workups", { method: "POST", headers: jsonHeaders(lead), body: JSON.stringify(workupBody(c.root, "Matrix to delete")) });
      return { values: { ...values, "workups/id": (JSON.parse(made.body) as { id: string }).id }, template: { strict: true } };
    }
    case "POST /api/v1/workups/[id]/outcome":
      return { values, template: json(OUTCOME) };
    case "POST /api/v1/workups/[id]/attachments":
      return { values, template: { contentType: "application/octet-stream", body: PNG_1PX, query: "?name=matrix.png", strict: true } };
    case "DELETE /api/v1/attachments/[id]": {
      const made = await ask(c.base, `/api/v1/workups/${c.recordsA.workupId}/attachments?name=gone.png`, { method: "POST", headers: { ...bearer(lead), "content-type": "application/octet-stream" }, body: PNG_1PX });
      return { values: { ...values, "attachments/id": (JSON.parse(made.body) as { id: string }).id }, template: { strict: true } };
    }
    case "PUT /api/v1/attachments/[id]/thumbnail":
      return { values, template: { contentType: "image/png", body: PNG_1PX, strict: true } };
    case "POST /api/v1/compounds":
      return { values, template: json({ format: "smiles", text: "CCOc1ccc(NC(C)=O)cc1 phenacetin", onDuplicate: "skip" }) };
    case "POST /api/v1/predict":
      return { values, template: json({ spec: workupBody(c.root, "x").spec, draws: 0 }) };
    case "POST /api/v1/workups/import": {
      const csv = await ask(c.base, "/api/v1/workups.csv", { headers: bearer(lead) });
      const neutral = [c.people.marker, c.recordsA.workupId, c.recordsA.compoundId].reduce((text, s) => text.split(s).join(""), csv.body);
      return { values, template: { contentType: "text/csv", body: neutral, strict: true } };
    }
    case "POST /api/v1/workups/[id]/outcome/found-cause":
      return { values, template: json({ cause: "emulsion_loss", note: "reliability matrix" }) };
    case "GET /api/v1/workups/[id]/diff":
      return { values, template: { query: "?from=1&to=1", strict: true } };
    case "GET /api/depict/structure":
      return { values, template: { query: "?smiles=c1ccc(O)cc1", strict: true } };
    default:
      return { values, template: e.method === "GET" ? { strict: true } : { contentType: "application/json", body: "{}", strict: false } };
  }
}

export function leakIn(body: string, c: MatrixContext, requestedPath: string): string | null {
  const secrets = [c.people.marker, c.recordsA.workupId, c.recordsA.compoundId, c.recordsA.attachmentId, c.people.lead.userId, c.people.member.userId, c.people.viewer.userId];
  for (const s of secrets) {
    if (requestedPath.includes(s)) continue; // an id the request itself named may be echoed (the not-found compare covers it)
    if (body.includes(s)) return s === c.people.marker ? "group A's marker" : `group A's id ${s}`;
  }
  return null;
}

export async function runMatrix(c: MatrixContext, endpoints: Endpoint[]): Promise<MatrixReport> {
  const all = principals(c.people, c.base);
  const cells: Cell[] = [];
  const uncovered: string[] = [];
  for (const e of endpoints) {
    if (e.requirement.kind === "unreadable") uncovered.push(`${e.method} ${e.template}: ${e.requirement.why}`);
    const variants: { suffix: string; person: string | null }[] = [{ suffix: "", person: null }];
    // A person filter naming someone else (group A's lead) is the guard's per-person rule: only a lead may.
    if (e.personParam) variants.push({ suffix: `?${e.personParam}=${c.people.lead.userId}`, person: c.people.lead.userId });
    for (const variant of variants) {
      for (const pr of all) {
        if (pr.only && pr.only !== e.kind) continue;
        const { values, template } = await prepare(c, e);
        const filled = fill(e.template, values);
        if (filled.missing.length > 0) {
          const msg = `${e.method} ${e.template}: no value for ${filled.missing.join(", ")}`;
          if (!uncovered.includes(msg)) uncovered.push(msg);
          continue;
        }
        let expected = expectedAnswer(e, pr, filled.owned);
        if (variant.person && expected === "allowed" && pr.group === "A" && pr.role !== "lead") expected = "forbidden";
        const query = variant.suffix || template.query || "";
        const headers: Record<string, string> = { ...pr.headers };
        if (template.contentType && e.method !== "GET") headers["content-type"] = template.contentType;
        if (e.kind === "page") headers["accept"] = "text/html";
        const write = e.method !== "GET";
        const refusedWrite = write && expected !== "allowed" && expected !== "open";
        // Group A's background jobs (intervals computed after a save, inference after an outcome) write after the
        // write that queued them was answered: the digest of a refused write is taken with none running.
        if (refusedWrite) await groupAJobsIdle(c);
        const before = refusedWrite ? await groupADigest(c) : "";
        const answer = await ask(c.base, filled.path + query, { method: e.method, headers, body: write ? template.body : undefined, timeoutMs: MATRIX_TIMEOUT_MS });
        let { verdict, why } = judge(e, expected, answer, template.strict && !variant.person);
        if (refusedWrite) await groupAJobsIdle(c);
        if (verdict !== "violation" && refusedWrite && (await groupADigest(c)) !== before) {
          verdict = "violation";
          why = "a refused write changed group A's data";
        }
        if (verdict !== "violation" && expected === "notfound") {
          // The wall must not show existence: the same request for ids that exist nowhere answers the same.
          const ghostValues = Object.fromEntries(Object.entries(values).map(([k, v]) => [k, OWNED_PARAMS.includes(k) ? newId() : v]));
          const ghostPath = fill(e.template, ghostValues).path;
          const ghost = await ask(c.base, ghostPath + query, { method: e.method, headers, body: write ? template.body : undefined, timeoutMs: MATRIX_TIMEOUT_MS });
          if (shape(e, answer, values) !== shape(e, ghost, ghostValues)) {
            verdict = "violation";
            why = `another group's record answers differently from a missing one (${answer.status} vs ${ghost.status})`;
          }
        }
        if (verdict !== "violation" && (pr.group !== "A" || !pr.valid)) {
          const leak = leakIn(answer.body, c, filled.path + query);
          if (leak) {
            verdict = "violation";
            why = `${leak} in the answer`;
          }
        }
        cells.push({ endpoint: `${e.method} ${e.template}${variant.suffix ? ` ?${e.personParam}=<someone else>` : ""}`, principal: pr.name, expected, status: answer.status, verdict, ...(why ? { why } : {}) });
      }
    }
  }
  const byKind: Record<string, number> = {};
  for (const cell of cells) byKind[cell.expected] = (byKind[cell.expected] ?? 0) + 1;
  return {
    endpoints: endpoints.length,
    routeFiles: new Set(endpoints.filter((e) => e.kind === "route").map((e) => e.file)).size,
    pageFiles: endpoints.filter((e) => e.kind === "page").length,
    principals: all.map((p) => p.name),
    cells: cells.length,
    violations: cells.filter((x) => x.verdict === "violation").length,
    unexpected: cells.filter((x) => x.verdict === "unexpected").length,
    serverErrors: cells.filter((x) => x.status >= 500 || x.status < 0).length,
    uncovered,
    byKind,
    problems: cells.filter((x) => x.verdict !== "ok"),
  };
}
