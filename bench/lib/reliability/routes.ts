// Every way into the app, read from the file system (app/**/route.ts and page.tsx) the way the guard meta-test reads
// it, with the permission each one asks the guard for taken from its source. A new route or page joins the matrix
// by existing; one whose guard call the bench cannot read is reported, not skipped.
import ts from "typescript";
import { callsIn, calleeName, isDefault, isExported, parse, walk } from "../../../tests/support/source-scan";
import { PERMISSIONS, type Permission } from "@/lib/authz/permissions";

const HTTP_METHODS = new Set(["GET", "POST", "PUT", "PATCH", "DELETE"]);
const PAGE_MEMBER_GUARDS = new Set(["requirePageMember", "requireMember"]);
const PAGE_USER_GUARDS = new Set(["requirePageUser", "requireUser"]);

/** What the guard asks for: a permission in the caller's group, any signed-in user, or nothing (public). */
export type Requirement = { kind: "permission"; permission: Permission } | { kind: "user" } | { kind: "public" } | { kind: "unreadable"; why: string };

export interface Endpoint {
  file: string;
  kind: "route" | "page";
  method: string;
  /** URL template, e.g. /api/v1/workups/[id] */
  template: string;
  requirement: Requirement;
  /** A query parameter that narrows the answer to one person (memberRoute's personParam). */
  personParam: string | null;
  /** Pages: what the layouts around the page ask for (they run with the page). */
  layouts: Requirement[];
}

function permissionArg(call: ts.CallExpression): Requirement {
  const first = call.arguments[0];
  if (first && ts.isStringLiteral(first) && (PERMISSIONS as readonly string[]).includes(first.text)) return { kind: "permission", permission: first.text as Permission };
  return { kind: "unreadable", why: `${calleeName(call)}(${first?.getText() ?? ""}) does not name a known permission` };
}

/**
 * The query parameter that narrows an answer to one person: memberRoute's `personParam: "x"`, or a page guard's
 * `person: values.x` (the parameter is named by the property read).
 */
function personParamOf(call: ts.CallExpression, at: number): string | null {
  const options = call.arguments[at];
  if (!options || !ts.isObjectLiteralExpression(options)) return null;
  for (const p of options.properties) {
    if (!ts.isPropertyAssignment(p)) continue;
    if (p.name.getText() === "personParam" && ts.isStringLiteral(p.initializer)) return p.initializer.text;
    if (p.name.getText() === "person" && ts.isPropertyAccessExpression(p.initializer)) return p.initializer.name.text;
  }
  return null;
}

export function templateOf(file: string): string {
  const parts = file.replace(/^app\//, "").split("/").slice(0, -1).filter((s) => !/^\(.*\)$/.test(s));
  return `/${parts.join("/")}`;
}

function routeEndpoints(root: string, file: string): Endpoint[] {
  const template = templateOf(file);
  const out: Endpoint[] = [];
  for (const statement of parse(root, file).statements) {
    if (ts.isVariableStatement(statement) && isExported(statement)) {
      for (const d of statement.declarationList.declarations) {
        const method = d.name.getText();
        if (!HTTP_METHODS.has(method)) continue;
        const init = d.initializer;
        const guarded = init && ts.isCallExpression(init) && calleeName(init) === "memberRoute";
        out.push({
          file, kind: "route", method, template,
          requirement: guarded ? permissionArg(init) : { kind: "public" },
          personParam: guarded ? personParamOf(init, 2) : null, layouts: [],
        });
      }
    } else if (ts.isFunctionDeclaration(statement) && isExported(statement) && HTTP_METHODS.has(statement.name?.text ?? "")) {
      out.push({ file, kind: "route", method: statement.name?.text ?? "GET", template, requirement: { kind: "public" }, personParam: null, layouts: [] });
    } else if (ts.isExportDeclaration(statement) && statement.exportClause && ts.isNamedExports(statement.exportClause)) {
      for (const e of statement.exportClause.elements) {
        if (HTTP_METHODS.has(e.name.text)) out.push({ file, kind: "route", method: e.name.text, template, requirement: { kind: "public" }, personParam: null, layouts: [] });
      }
    }
  }
  return out;
}

function pageGuard(root: string, file: string): { requirement: Requirement; personParam: string | null } {
  const source = parse(root, file);
  const main = source.statements.find((s): s is ts.FunctionDeclaration => ts.isFunctionDeclaration(s) && isExported(s) && isDefault(s));
  let requirement: Requirement = { kind: "public" };
  let personParam: string | null = null;
  for (const call of main?.body ? callsIn(main.body) : []) {
    const name = calleeName(call) ?? "";
    if (PAGE_MEMBER_GUARDS.has(name)) {
      requirement = permissionArg(call);
      personParam = personParamOf(call, 1);
      break;
    }
    if (PAGE_USER_GUARDS.has(name)) {
      requirement = { kind: "user" };
      break;
    }
  }
  return { requirement, personParam };
}

function pageEndpoint(root: string, file: string, layoutFiles: string[]): Endpoint {
  const { requirement, personParam } = pageGuard(root, file);
  const dirs = file.split("/").slice(0, -1);
  const layouts = layoutFiles
    .filter((l) => { const d = l.split("/").slice(0, -1); return d.every((seg, i) => dirs[i] === seg); })
    .map((l) => pageGuard(root, l).requirement)
    .filter((r) => r.kind !== "public");
  return { file, kind: "page", method: "GET", template: templateOf(file), requirement, personParam, layouts };
}

export function enumerateEndpoints(root: string): Endpoint[] {
  const routes = walk(root, "app", (f) => /\/route\.ts$/.test(f)).flatMap((f) => routeEndpoints(root, f));
  const layouts = walk(root, "app", (f) => /(^|\/)layout\.tsx$/.test(f));
  const pages = walk(root, "app", (f) => /(^|\/)page\.tsx$/.test(f)).map((f) => pageEndpoint(root, f, layouts));
  return [...routes, ...pages];
}
