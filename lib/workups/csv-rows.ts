// Reading one CSV row (columns: csv-columns.ts) into the shared schemas' inputs: header, spec (as JSON or from a
// template workup), compound links and outcome, with every problem named by its CSV column.
import { workupInputSchema } from "@/lib/chem/schema";
import { withoutUnknownKeys } from "@/lib/chem/schema-strict";
import { type Db } from "@/lib/db/client";
import { ValidationError } from "@/lib/errors";
import { createWorkupSchema, outcomeInputSchema, type CreateWorkup, type OutcomeInput } from "./schemas";

export type Template = { spec: unknown; links: unknown[] } | "ambiguous";

export interface RowContext {
  /** Lower-case email → user id, for the group's members. */
  memberByEmail: ReadonlyMap<string, string>;
  /** Template title or id → its spec and links. */
  templates: ReadonlyMap<string, Template>;
}

export interface ColumnError {
  column: string;
  message: string;
}

export interface ReadRow {
  /** The spec as given (parsed JSON or the template's); undefined when it could not be read. */
  spec: unknown;
  /** Where spec problems are reported: "template" or "spec_json". */
  specColumn: string;
  input: CreateWorkup | null;
  outcome: OutcomeInput | null;
  errors: ColumnError[];
}

const COLUMN_OF_HEADER: Record<string, string> = {
  title: "title", performedOn: "performed_on", chemistId: "chemist_email", notebookRef: "notebook_ref", notebookUrl: "notebook_url",
  scaleMmol: "scale_mmol", expectedProductMmol: "expected_product_mmol", assayedProductMmol: "assayed_product_mmol",
};
const COLUMN_OF_OUTCOME: Record<string, string> = {
  isolatedMassMg: "isolated_mass_mg", purityPct: "purity_pct", purityMethod: "purity_method", notes: "outcome_notes",
};

/** "" → absent; a number → number; anything else stays text so the schema names it ("must be a number"). */
function numeric(cell: string | undefined): number | string | undefined {
  if (cell === undefined || cell === "") return undefined;
  const n = Number(cell);
  return Number.isFinite(n) ? n : cell;
}

/** Turns a ValidationError's field paths into CSV columns (spec paths stay in the message). */
export function columnErrors(error: ValidationError, specColumn: string): ColumnError[] {
  return Object.entries(error.fieldErrors).flatMap(([path, messages]) => {
    const [head, field, ...rest] = path.split(".");
    const column =
      head === "header" ? (COLUMN_OF_HEADER[field ?? ""] ?? path)
        : head === "spec" || head === "links" ? specColumn
          : (COLUMN_OF_OUTCOME[head ?? ""] ?? path);
    const where = head === "spec" && field ? `${[field, ...rest].join(".")}: ` : "";
    return messages.map((m) => ({ column, message: `${where}${m}` }));
  });
}

function readSpec(cells: Record<string, string>, context: RowContext, fail: (column: string, message: string) => void) {
  const templateName = cells["template"] ?? "";
  const specText = cells["spec_json"] ?? "";
  const none = { spec: undefined as unknown, links: [] as unknown[] };
  if ((templateName === "") === (specText === "")) {
    fail("spec_json", "give either spec_json or template (one of the two)");
    return none;
  }
  if (templateName !== "") {
    const found = context.templates.get(templateName);
    if (!found) fail("template", `no workup of this group has the title or id '${templateName}'`);
    else if (found === "ambiguous") fail("template", `several workups are titled '${templateName}'; use the id`);
    return found && found !== "ambiguous" ? found : none;
  }
  try {
    // A byte-order mark pasted in with the JSON (from a file saved by a Windows editor) is not part of it.
    return { spec: JSON.parse(specText.replace(/^\uFEFF/, "")) as unknown, links: [] };
  } catch (e) {
    fail("spec_json", `not valid JSON (${e instanceof Error ? e.message : "parse error"})`);
    return none;
  }
}

export function readRow(cells: Record<string, string>, context: RowContext): ReadRow {
  const errors: ColumnError[] = [];
  const fail = (column: string, message: string) => errors.push({ column, message });
  const email = cells["chemist_email"] ?? "";
  const chemistId = email === "" ? null : (context.memberByEmail.get(email.toLowerCase()) ?? null);
  if (email !== "" && !chemistId) fail("chemist_email", `no member of this group has the email ${email}`);
  const specColumn = (cells["template"] ?? "") !== "" ? "template" : "spec_json";
  const { spec, links } = readSpec(cells, context, fail);
  const header = {
    title: cells["title"] ?? "", performedOn: cells["performed_on"] ?? "", chemistId, notebookRef: cells["notebook_ref"] ?? "",
    notebookUrl: cells["notebook_url"] ?? "",
    scaleMmol: numeric(cells["scale_mmol"]), expectedProductMmol: numeric(cells["expected_product_mmol"]),
    assayedProductMmol: numeric(cells["assayed_product_mmol"]),
  };
  const parsed = createWorkupSchema.safeParse({ header, spec: spec ?? {}, links });
  if (!parsed.success) {
    // Without a readable spec, the schema's complaints about the empty stand-in would only add noise.
    for (const e of columnErrors(ValidationError.fromZod(parsed.error), specColumn)) if (spec !== undefined || e.column !== specColumn) errors.push(e);
  }
  let outcome: OutcomeInput | null = null;
  if ((cells["isolated_mass_mg"] ?? "") !== "") {
    const o = outcomeInputSchema.safeParse({
      isolatedMassMg: numeric(cells["isolated_mass_mg"]), purityPct: numeric(cells["purity_pct"]) ?? null,
      purityMethod: cells["purity_method"] ?? "", notes: cells["outcome_notes"] ?? "",
    });
    if (o.success) outcome = o.data;
    else errors.push(...columnErrors(ValidationError.fromZod(o.error), specColumn));
  }
  return { spec, specColumn, input: parsed.success ? parsed.data : null, outcome, errors };
}

/** Template workups named in the file, by id and by title (a title two workups share is ambiguous). */
export async function templateLookup(db: Db, groupId: string, names: string[]): Promise<Map<string, Template>> {
  const wanted = [...new Set(names)];
  if (wanted.length === 0) return new Map();
  const rows = await db.workup.findMany({
    where: { groupId, OR: [{ id: { in: wanted } }, { title: { in: wanted } }] },
    select: { id: true, title: true, spec: true, components: { select: { key: true, compoundId: true } } },
  });
  const map = new Map<string, Template>();
  for (const w of rows) {
    // A stored spec may carry keys an older version accepted; the template reuses only what the schema knows.
    const template = { spec: withoutUnknownKeys(workupInputSchema, w.spec).value, links: w.components.filter((c) => c.compoundId !== null).map((c) => ({ key: c.key, compoundId: c.compoundId })) };
    map.set(w.id, template);
    if (wanted.includes(w.title)) map.set(w.title, map.has(w.title) ? "ambiguous" : template);
  }
  return map;
}
