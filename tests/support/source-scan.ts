// Reading the app's own source as syntax trees: shared by the guard meta-test (tests/unit/authz) and the
// reliability benchmark's route list (bench/lib/reliability), so both see the same entry points.
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import ts from "typescript";

/** Files under `dir` (relative to `root`, posix separators, sorted) that `keep` accepts; node_modules skipped. */
export function walk(root: string, dir: string, keep: (file: string) => boolean): string[] {
  return readdirSync(path.join(root, dir)).sort().flatMap((name) => {
    const rel = path.posix.join(dir, name);
    if (statSync(path.join(root, rel)).isDirectory()) return name === "node_modules" ? [] : walk(root, rel, keep);
    return keep(rel) ? [rel] : [];
  });
}

export function parse(root: string, file: string): ts.SourceFile {
  return ts.createSourceFile(file, readFileSync(path.join(root, file), "utf8"), ts.ScriptTarget.Latest, true, file.endsWith("x") ? ts.ScriptKind.TSX : ts.ScriptKind.TS);
}

export const isExported = (node: ts.Node) => ts.canHaveModifiers(node) && (ts.getModifiers(node) ?? []).some((m) => m.kind === ts.SyntaxKind.ExportKeyword);
export const isDefault = (node: ts.Node) => ts.canHaveModifiers(node) && (ts.getModifiers(node) ?? []).some((m) => m.kind === ts.SyntaxKind.DefaultKeyword);

export function calleeName(call: ts.CallExpression): string | null {
  const e = call.expression;
  if (ts.isIdentifier(e)) return e.text;
  if (ts.isPropertyAccessExpression(e)) return e.name.text;
  return null;
}

/** Call expressions inside `node`, in source order. */
export function callsIn(node: ts.Node): ts.CallExpression[] {
  const out: ts.CallExpression[] = [];
  const visit = (n: ts.Node) => {
    if (ts.isCallExpression(n)) out.push(n);
    n.forEachChild(visit);
  };
  node.forEachChild(visit);
  return out.sort((a, b) => a.getStart() - b.getStart());
}
