// Every way into the app goes through the guard (lib/authz). This test reads the source, so a new page, route
// handler or server action that forgets the guard, or a server action that hands an argument to the data layer
// without parsing it, fails here before it ships. Exceptions are listed by path with the reason they are safe.
import { calleeName, callsIn, isDefault, isExported, parse as parseFrom, walk as walkFrom } from "../../support/source-scan";
import path from "node:path";
import ts from "typescript";
import { describe, expect, it } from "vitest";

const ROOT = path.resolve(import.meta.dirname, "../../..");
const HTTP_METHODS = new Set(["GET", "POST", "PUT", "PATCH", "DELETE", "HEAD", "OPTIONS"]);
const PAGE_GUARDS = new Set(["requirePageMember", "requirePageUser", "requireMember", "requireUser"]);
const ACTION_GUARDS = new Set(["memberAction", "requireMember", "requireUser"]);
const ARGUMENT_PARSERS = new Set(["actionArg", "parseInput"]);

/** Entry points that are public on purpose. */
const PUBLIC_ROUTES: Record<string, string> = {
  "app/api/auth/[...nextauth]/route.ts": "next-auth's own sign-in endpoints (they establish who is signed in)",
  "app/api/v1/openapi.json/route.ts": "the published API description: static, no data",
};
const PUBLIC_PAGES: Record<string, string> = {
  "app/page.tsx": "redirects to /workups, which is guarded",
  "app/sign-in/page.tsx": "the sign-in form",
  "app/invite/[token]/page.tsx": "the invite link is the authority; it shows only the invite the token names",
  "app/layout.tsx": "the root layout: no data",
};
const PUBLIC_ACTIONS: Record<string, string> = {
  "joinWithNewAccountAction": "creating an account from an invite: nobody is signed in, the invite token is the authority",
};

const walk = (dir: string, keep: (file: string) => boolean) => walkFrom(ROOT, dir, keep);
const parse = (file: string) => parseFrom(ROOT, file);
const calls = callsIn;

function usesIdentifier(node: ts.Node, name: string): boolean {
  let found = false;
  const visit = (n: ts.Node) => {
    if (found) return;
    if (ts.isIdentifier(n) && n.text === name) found = true;
    else n.forEachChild(visit);
  };
  visit(node);
  return found;
}

const useServer = (source: ts.SourceFile) => {
  const first = source.statements[0];
  return first !== undefined && ts.isExpressionStatement(first) && ts.isStringLiteral(first.expression) && first.expression.text === "use server";
};

const pages = walk("app", (f) => /\/(page|layout)\.tsx$/.test(f) || f === "app/layout.tsx");
const routes = walk("app", (f) => /\/route\.ts$/.test(f));
const actionFiles = [...walk("app", (f) => /\.tsx?$/.test(f)), ...walk("lib", (f) => /\.tsx?$/.test(f)), ...walk("components", (f) => /\.tsx?$/.test(f))]
  .filter((f) => useServer(parse(f)));

/** Problems of one page or layout: its default export must call a guard before it touches the database. */
export function pageProblems(file: string): string[] {
  if (file in PUBLIC_PAGES) return [];
  const source = parse(file);
  const main = source.statements.find((s): s is ts.FunctionDeclaration => ts.isFunctionDeclaration(s) && isExported(s) && isDefault(s));
  if (!main?.body) return [`${file}: no default-exported function`];
  const found = calls(main.body);
  const guard = found.findIndex((c) => PAGE_GUARDS.has(calleeName(c) ?? ""));
  if (guard < 0) return [`${file}: does not call the guard (${[...PAGE_GUARDS].join(", ")})`];
  const early = found.slice(0, guard).filter((c) => ["getDb", "findMany", "findFirst", "findUnique", "count"].includes(calleeName(c) ?? ""));
  return early.length > 0 ? [`${file}: reads the database before the guard`] : [];
}

/** Problems of one route file: every exported HTTP method must be memberRoute(...). */
export function routeProblems(file: string): string[] {
  if (file in PUBLIC_ROUTES) return [];
  const problems: string[] = [];
  for (const statement of parse(file).statements) {
    if (ts.isVariableStatement(statement) && isExported(statement)) {
      for (const d of statement.declarationList.declarations) {
        const name = d.name.getText();
        if (!HTTP_METHODS.has(name)) continue;
        const init = d.initializer;
        if (!init || !ts.isCallExpression(init) || calleeName(init) !== "memberRoute") problems.push(`${file}: ${name} is not memberRoute(...)`);
      }
    } else if (ts.isFunctionDeclaration(statement) && isExported(statement) && HTTP_METHODS.has(statement.name?.text ?? "")) {
      problems.push(`${file}: ${statement.name?.text} is a bare function, not memberRoute(...)`);
    } else if (ts.isExportDeclaration(statement)) {
      const names = statement.exportClause && ts.isNamedExports(statement.exportClause) ? statement.exportClause.elements.map((e) => e.name.text) : ["*"];
      if (names.some((n) => n === "*" || HTTP_METHODS.has(n))) problems.push(`${file}: re-exports a handler the guard cannot be checked on`);
    }
  }
  return problems;
}

/**
 * Problems of one "use server" file: each exported function must go through a guard, and each argument (except a
 * form-state `_prev` and FormData, which are parsed by their own schema) must pass through actionArg/parseInput.
 */
export function actionProblems(file: string, source = parse(file)): string[] {
  const problems: string[] = [];
  for (const statement of source.statements) {
    if (ts.isVariableStatement(statement) && isExported(statement)) {
      problems.push(`${file}: exports a value; a "use server" file may only export guarded async functions`);
      continue;
    }
    if (!ts.isFunctionDeclaration(statement) || !isExported(statement) || !statement.body) continue;
    const name = statement.name?.text ?? "(anonymous)";
    const found = calls(statement.body);
    if (!(name in PUBLIC_ACTIONS) && !found.some((c) => ACTION_GUARDS.has(calleeName(c) ?? ""))) problems.push(`${file}: ${name} does not call the guard`);
    for (const param of statement.parameters) {
      const pname = param.name.getText();
      if (pname.startsWith("_")) continue;
      if (param.type?.getText() === "FormData" && found.some((c) => ARGUMENT_PARSERS.has(calleeName(c) ?? "") && usesIdentifier(c, "formFields"))) continue;
      const parsed = found.some((c) => ARGUMENT_PARSERS.has(calleeName(c) ?? "") && c.arguments.some((a) => usesIdentifier(a, pname)));
      if (!parsed) problems.push(`${file}: ${name} uses its argument '${pname}' without parsing it (actionArg or parseInput)`);
    }
  }
  return problems;
}

describe("every page, route handler and server action goes through the guard", () => {
  it("finds the entry points it checks (the walk itself works)", () => {
    expect(pages.length).toBeGreaterThanOrEqual(20);
    expect(routes.length).toBeGreaterThanOrEqual(18);
    expect(actionFiles).toEqual(expect.arrayContaining(["lib/workups/actions.ts", "lib/groups/actions.ts", "app/(app)/workups/_lib/picker-actions.ts"]));
    // Every lib/**/actions.ts is a server-action file (a helper there without "use server" would be missed).
    expect(walk("lib", (f) => f.endsWith("/actions.ts")).filter((f) => !actionFiles.includes(f))).toEqual([]);
  });

  it("pages and layouts call the guard before reading data", () => {
    expect(pages.flatMap(pageProblems)).toEqual([]);
  });

  it("route handlers are memberRoute(...)", () => {
    expect(routes.flatMap(routeProblems)).toEqual([]);
  });

  it("server actions call the guard and parse every argument", () => {
    expect(actionFiles.flatMap((f) => actionProblems(f))).toEqual([]);
  });

  it("catches what it is meant to catch (an unguarded action, an unparsed id)", () => {
    const bad = ts.createSourceFile("x.ts", `"use server";
      export async function leaky(id: string) { return memberAction("data:read", async (m) => get(m, id)); }
      export async function open(id: string) { return get(parseInput(s, id)); }`, ts.ScriptTarget.Latest, true);
    expect(actionProblems("x.ts", bad)).toEqual([
      "x.ts: leaky uses its argument 'id' without parsing it (actionArg or parseInput)",
      "x.ts: open does not call the guard",
    ]);
  });
});
