// Server actions in the authorization matrix, invoked over HTTP exactly as the browser does: a POST to a page that
// holds the action, with the `Next-Action` header naming its id (from the build's server-reference manifest) and the
// arguments encoded as React's encodeReply does (JSON, or multipart when an argument is FormData). So the real guard
// runs: the session cookie, next-auth's session check, the role, the group. Each action × principal is judged from the
// ActionResult in the answer ({ ok, status }): a principal that must be refused and got ok:true, a refused call after
// which group A's data differ, or group A's marker or ids in an answer to someone outside group A, is a violation.
import fs from "node:fs";
import path from "node:path";
import ts from "typescript";
import { calleeName, callsIn, isExported, parse } from "../../../tests/support/source-scan";
import { roleCan, type RoleName } from "@/lib/authz/permissions";
import { type MatrixContext, groupADigest, groupAJobsIdle, leakIn } from "./authz";
import { templateOf, type Requirement } from "./routes";
import { ask, bearer, type Answer } from "./http";

export interface ActionEndpoint {
  id: string;
  file: string;
  name: string;
  /** Page template the action is posted to (one whose bundle holds it). */
  page: string;
  requirement: Requirement;
  /** Type text of each parameter ("FormData", "string", …) and its name. */
  params: { name: string; type: string }[];
}

type Expect = "allowed" | "signin" | "forbidden" | "open";

interface ActionPrincipal {
  name: string;
  role: RoleName | null;
  group: "A" | "B" | null;
  valid: boolean;
  via: "session" | "token" | null;
  headers: Record<string, string>;
}

export interface ActionCell {
  action: string;
  principal: string;
  expected: Expect;
  httpStatus: number;
  /** ActionResult status (200 for ok:true), or null when the answer held none. */
  resultStatus: number | null;
  verdict: "ok" | "violation" | "unexpected";
  why?: string;
}

export interface ActionMatrixReport {
  actions: number;
  files: number;
  principals: string[];
  cells: number;
  violations: number;
  unexpected: number;
  uncovered: string[];
  problems: ActionCell[];
}

/** What the exported function asks the guard for, read from its body. */
function requirementOf(fn: ts.FunctionDeclaration): Requirement {
  for (const call of fn.body ? callsIn(fn.body) : []) {
    const name = calleeName(call) ?? "";
    if (name === "memberAction" || name === "requireMember") {
      const first = call.arguments[0];
      return first && ts.isStringLiteral(first) ? { kind: "permission", permission: first.text as never } : { kind: "unreadable", why: `${name} without a literal permission` };
    }
    if (name === "requireUser") return { kind: "user" };
  }
  return { kind: "public" };
}

export function enumerateActions(root: string): ActionEndpoint[] {
  const manifest = JSON.parse(fs.readFileSync(path.join(root, ".next", "server", "server-reference-manifest.json"), "utf8")) as {
    node: Record<string, { workers: Record<string, unknown>; filename?: string; exportedName?: string }>;
  };
  const out: ActionEndpoint[] = [];
  for (const [id, entry] of Object.entries(manifest.node)) {
    if (!entry.filename || !entry.exportedName) continue;
    const source = parse(root, entry.filename);
    const fn = source.statements.find((s): s is ts.FunctionDeclaration => ts.isFunctionDeclaration(s) && isExported(s) && s.name?.text === entry.exportedName);
    const pages = Object.keys(entry.workers).filter((w) => w.endsWith("/page")).map((w) => templateOf(`${w}.tsx`));
    // A page without parameters when there is one, so its own loader needs no record to render.
    const page = pages.find((p) => !p.includes("[")) ?? pages[0] ?? "/";
    out.push({
      id, file: entry.filename, name: entry.exportedName, page,
      requirement: fn ? requirementOf(fn) : { kind: "unreadable", why: "exported function not found in its file" },
      params: fn ? fn.parameters.map((p) => ({ name: p.name.getText(), type: p.type?.getText() ?? "unknown" })) : [],
    });
  }
  return out.sort((a, b) => `${a.file} ${a.name}`.localeCompare(`${b.file} ${b.name}`));
}

function principals(c: MatrixContext): ActionPrincipal[] {
  const p = c.people;
  const browser = (cookie: string) => ({ cookie });
  return [
    { name: "anonymous", role: null, group: null, valid: false, via: null, headers: {} },
    { name: "viewer (session)", role: "viewer", group: "A", valid: true, via: "session", headers: browser(p.viewer.cookie) },
    { name: "member (session)", role: "member", group: "A", valid: true, via: "session", headers: browser(p.member.cookie) },
    { name: "lead (session)", role: "lead", group: "A", valid: true, via: "session", headers: browser(p.lead.cookie) },
    { name: "other group's lead (session)", role: "lead", group: "B", valid: true, via: "session", headers: browser(p.otherLead.cookie) },
    { name: "signed-out session", role: "member", group: "A", valid: false, via: "session", headers: browser(p.endedSessionCookie) },
    // Actions open for browser sessions only: an API token, valid or revoked, opens none.
    { name: "valid token", role: "lead", group: "A", valid: false, via: "token", headers: bearer(p.lead.token) },
    { name: "revoked token", role: "member", group: "A", valid: false, via: "token", headers: bearer(p.revokedToken) },
  ];
}

function expectedOf(a: ActionEndpoint, pr: ActionPrincipal): Expect {
  if (a.requirement.kind === "public" || a.requirement.kind === "unreadable") return "open";
  // A token at a member guard is refused as the wrong kind of credential (403) before it is looked up; at a guard
  // that only asks who is signed in, it is nobody (401). Pages answer tokens the same way (authz.ts).
  if (!pr.valid) return pr.via === "token" && a.requirement.kind === "permission" ? "forbidden" : "signin";
  if (a.requirement.kind === "user") return "allowed";
  return pr.role && roleCan(pr.role, a.requirement.permission) ? "allowed" : "forbidden";
}

/**
 * Arguments by parameter type: an object naming group A's records (to a principal who must not touch them), an empty
 * one otherwise (a permitted member of group A is answered 422 and nothing changes); FormData as a form would send.
 */
function argumentsFor(a: ActionEndpoint, c: MatrixContext, aimAtA: boolean): unknown[] {
  const ids = aimAtA
    ? { compoundId: c.recordsA.compoundId, workupId: c.recordsA.workupId, attachmentId: c.recordsA.attachmentId, id: c.recordsA.workupId, membershipId: c.people.member.userId, tokenId: c.recordsA.workupId }
    : {};
  return a.params.map((p) => {
    if (p.name.startsWith("_")) return undefined;
    if (p.type === "FormData") return new Map(Object.entries(ids)); // encoded as FormData below
    if (p.type === "string") return aimAtA ? c.recordsA.workupId : "x";
    return ids;
  });
}

/** React's encodeReply for plain values and FormData (multipart: field "0" the model, "_<n>_<key>" the form fields). */
function encodeArgs(args: unknown[]): { body: string | FormData; contentType?: string } {
  const forms: Map<string, string>[] = [];
  const model = JSON.stringify(args.map((v) => {
    if (v === undefined) return "$undefined";
    if (v instanceof Map) {
      forms.push(v as Map<string, string>);
      return `$K${forms.length.toString(16)}`;
    }
    return v;
  }));
  if (forms.length === 0) return { body: model, contentType: "text/plain;charset=UTF-8" };
  const form = new FormData();
  forms.forEach((fields, i) => fields.forEach((value, key) => form.append(`_${i + 1}_${key}`, value)));
  form.set("0", model);
  return { body: form };
}

/** The ActionResult in a React flight answer: `{"ok":false,"status":403,…}` or `{"ok":true,…}`. */
function resultStatusOf(body: string): number | null {
  const refused = /"ok":false,"status":(\d{3})/.exec(body);
  if (refused) return Number(refused[1]);
  return /"ok":true\b/.test(body) ? 200 : null;
}

/** The page's path with group A's record of the kind its folder names (/compounds/[id] → group A's compound). */
function fillPage(template: string, c: MatrixContext): string {
  const segments = template.split("/");
  return segments.map((seg, i) => {
    if (!/^\[\w+\]$/.test(seg)) return seg;
    const folder = segments[i - 1] ?? "";
    if (folder === "compounds" || folder === "partition") return c.recordsA.compoundId;
    if (folder === "workups") return c.recordsA.workupId;
    if (folder === "invite") return "x".repeat(43);
    return "x";
  }).join("/");
}

async function send(c: MatrixContext, a: ActionEndpoint, pr: ActionPrincipal, args: unknown[]): Promise<Answer> {
  const { body, contentType } = encodeArgs(args);
  const headers: Record<string, string> = {
    ...pr.headers, "next-action": a.id, accept: "text/x-component", origin: c.base, "sec-fetch-site": "same-origin",
    ...(contentType ? { "content-type": contentType } : {}),
  };
  if (body instanceof FormData) {
    const encoded = new Response(body);
    headers["content-type"] = encoded.headers.get("content-type") ?? "multipart/form-data";
    return ask(c.base, fillPage(a.page, c), { method: "POST", headers, body: new Uint8Array(await encoded.arrayBuffer()) });
  }
  return ask(c.base, fillPage(a.page, c), { method: "POST", headers, body });
}

export async function runActionMatrix(c: MatrixContext, actions: ActionEndpoint[]): Promise<ActionMatrixReport> {
  const all = principals(c);
  const cells: ActionCell[] = [];
  const uncovered = actions.filter((a) => a.requirement.kind === "unreadable").map((a) => `${a.file} ${a.name}`);
  for (const a of actions) {
    for (const pr of all) {
      const expected = expectedOf(a, pr);
      // Group A's records are named to everyone who must not touch them: refused principals and the other group.
      const aimAtA = expected !== "allowed" || pr.group !== "A";
      const args = argumentsFor(a, c, aimAtA);
      const refusal = expected === "signin" || expected === "forbidden";
      const digest = refusal || pr.group === "B";
      if (digest) await groupAJobsIdle(c);
      const before = digest ? await groupADigest(c) : "";
      const answer = await send(c, a, pr, args);
      if (digest) await groupAJobsIdle(c);
      const resultStatus = resultStatusOf(answer.body);
      let verdict: ActionCell["verdict"] = "ok";
      let why: string | undefined;
      if (answer.failure || answer.status >= 500 || resultStatus === 500) {
        verdict = "unexpected";
        why = `server error ${answer.status} ${answer.failure ?? ""} ${answer.body.slice(0, 160)}`;
      } else if (resultStatus === null) {
        verdict = "unexpected";
        why = `no action result in the answer (${answer.status}): ${answer.body.slice(0, 160)}`;
      } else if (refusal && resultStatus === 200) {
        verdict = "violation";
        why = `expected ${expected}, got ok:true`;
      } else if (refusal && resultStatus !== (expected === "signin" ? 401 : 403)) {
        verdict = resultStatus === 401 || resultStatus === 403 || resultStatus === 404 ? "unexpected" : "violation";
        why = `expected ${expected}, got status ${resultStatus}`;
      } else if (expected === "allowed" && (resultStatus === 401 || resultStatus === 403)) {
        verdict = "unexpected";
        why = `refused with ${resultStatus}`;
      }
      if (verdict !== "violation" && before && (await groupADigest(c)) !== before) {
        verdict = "violation";
        why = pr.group === "B" ? "another group's lead changed group A's data" : "a refused call changed group A's data";
      }
      if (verdict !== "violation" && (pr.group !== "A" || !pr.valid)) {
        const leak = leakIn(answer.body, c, JSON.stringify(args));
        if (leak) {
          verdict = "violation";
          why = `${leak} in the answer`;
        }
      }
      cells.push({ action: `${a.file} ${a.name}`, principal: pr.name, expected, httpStatus: answer.status, resultStatus, verdict, ...(why ? { why } : {}) });
    }
  }
  return {
    actions: actions.length,
    files: new Set(actions.map((a) => a.file)).size,
    principals: all.map((p) => p.name),
    cells: cells.length,
    violations: cells.filter((x) => x.verdict === "violation").length,
    unexpected: cells.filter((x) => x.verdict === "unexpected").length,
    uncovered,
    problems: cells.filter((x) => x.verdict !== "ok"),
  };
}
