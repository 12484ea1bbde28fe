/**
 * The browser's check of the form, with the server's rules: the shared save schema, then the spec's references to
 * the group's library (unknown solvent, a solid used as a wash…), exactly what lib/workups/prediction.ts parseSpec
 * does before a save is accepted.
 */
import { checkLibraryReferences } from "@/lib/chem/predict";
import { resolveLibrary, type LibraryOverrides } from "@/lib/chem/library";
import { workupInputSchema, type WorkupInput } from "@/lib/chem/schema";
import { createWorkupSchema, type CreateWorkupInput } from "@/lib/workups/schemas";

export interface Issue {
  path: string;
  message: string;
}

const issuesOf = (error: { issues: { path: PropertyKey[]; message: string }[] }, prefix: string) =>
  error.issues.map((i) => ({ path: [prefix, ...i.path.map(String)].filter(Boolean).join("."), message: i.message }));

export type SpecCheck = { ok: true; spec: WorkupInput } | { ok: false; issues: Issue[] };

/** The spec alone: what the live prediction needs. Paths start with `spec.`. */
export function checkSpec(rawSpec: unknown, library: LibraryOverrides): SpecCheck {
  const parsed = workupInputSchema.safeParse(rawSpec);
  if (!parsed.success) return { ok: false, issues: issuesOf(parsed.error, "spec") };
  const refs = checkLibraryReferences(parsed.data, resolveLibrary(library));
  if (refs.length > 0) return { ok: false, issues: refs.map((i) => ({ path: `spec.${i.path}`, message: i.message })) };
  return { ok: true, spec: parsed.data };
}

/** Everything a save sends: header, spec and links. An empty list means the server will accept the form's shape. */
export function checkSave(input: CreateWorkupInput, library: LibraryOverrides): Issue[] {
  const parsed = createWorkupSchema.safeParse(input);
  const issues = parsed.success ? [] : issuesOf(parsed.error, "");
  if (!issues.some((i) => i.path.startsWith("spec"))) {
    const spec = checkSpec(input.spec, library);
    if (!spec.ok) issues.push(...spec.issues);
  }
  return issues;
}
