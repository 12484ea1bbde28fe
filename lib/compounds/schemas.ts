// One zod schema per compound input, shared by the register and search forms, the server actions and the REST
// routes (app/api/v1/compounds), so the two sides never disagree. Free of server imports: forms use it too.
import { z } from "zod";

/** Largest pasted SMILES list or uploaded MOL/SDF text, characters (about 10 MB of ASCII, the limit the README states). */
export const MAX_REGISTER_TEXT = 10_000_000;
/** Most structures one registration may hold; a larger library is split into several files. */
export const MAX_REGISTER_RECORDS = 5_000;

export const REGISTER_FORMATS = ["smiles", "sdf", "mol"] as const;
export type RegisterFormat = (typeof REGISTER_FORMATS)[number];

/** Comma-separated tags from a form field, or an array from JSON; trimmed, lower-cased, de-duplicated. */
const tagList = z
  .union([z.string(), z.array(z.string())])
  .optional()
  .transform((raw) => {
    const parts = (Array.isArray(raw) ? raw : (raw ?? "").split(",")).map((t) => t.trim().toLowerCase()).filter(Boolean);
    return [...new Set(parts)];
  })
  .pipe(z.array(z.string().max(40, { error: "a tag may be at most 40 characters" })).max(20, { error: "at most 20 tags" }));

export const registerCompoundsSchema = z.object({
  format: z.enum(REGISTER_FORMATS, { error: () => "format must be smiles, sdf or mol" }),
  text: z
    .string({ error: "paste SMILES or choose a MOL/SDF file" })
    .max(MAX_REGISTER_TEXT, { error: `the text may be at most ${MAX_REGISTER_TEXT.toLocaleString("en")} characters` })
    .refine((t) => t.trim() !== "", { error: "paste SMILES or choose a MOL/SDF file" }),
  /** Applied to every compound of the batch. */
  tags: tagList,
  /**
   * "reject" (default): any structure already in the group, or repeated in the batch, stops the whole batch.
   * "skip": those are listed but left out, and the rest is registered.
   */
  onDuplicate: z.enum(["reject", "skip"]).default("reject"),
});
export type RegisterCompoundsInput = z.input<typeof registerCompoundsSchema>;
export type RegisterCompounds = z.output<typeof registerCompoundsSchema>;

const PROVENANCE_EDITABLE = ["measured", "literature"] as const;
const source = z.string().trim().min(3, { error: "name the source (a notebook page, a paper, a handbook table)" }).max(500);

/**
 * A measured or literature log P replacing the estimate. `expected` is the value the editor saw (null: none), so an
 * edit made over someone else's newer value is refused instead of silently overwriting it.
 */
export const logPEditSchema = z.object({
  compoundId: z.string().min(1),
  value: z.coerce.number({ error: "log P must be a number" }).refine((v) => Number.isFinite(v) && v >= -15 && v <= 15, { error: "log P must be between −15 and 15" }),
  provenance: z.enum(PROVENANCE_EDITABLE, { error: () => "say whether the value was measured or taken from the literature" }),
  source,
  expected: z.number().nullable(),
});
export type LogPEdit = z.output<typeof logPEditSchema>;

/** A measured or literature pKa for one site (by its position in the compound's list), or a new site (index = length). */
export const pKaEditSchema = z.object({
  compoundId: z.string().min(1),
  index: z.coerce.number().int().min(0).max(11),
  value: z.coerce.number({ error: "pKa must be a number" }).refine((v) => Number.isFinite(v) && v >= -12 && v <= 30, { error: "pKa must be between −12 and 30" }),
  kind: z.enum(["acid", "base"], { error: () => "say whether the site is an acid or a base" }),
  provenance: z.enum(PROVENANCE_EDITABLE, { error: () => "say whether the value was measured or taken from the literature" }),
  source,
  se: z.coerce.number().positive({ error: "uncertainty must be > 0" }).max(5, { error: "uncertainty must be ≤ 5" }).optional(),
  /** The value the editor saw at this index (null: a new site). */
  expected: z.number().nullable(),
});
export type PKaEdit = z.output<typeof pKaEditSchema>;

/** What a compound row's `pKas` column holds. Estimated entries come from site detection at registration. */
export const storedPKaSchema = z.object({
  value: z.number(),
  kind: z.enum(["acid", "base"]),
  site: z.string().default(""),
  provenance: z.enum(["measured", "literature", "estimated", "group"]),
  source: z.string().default(""),
  se: z.number().optional(),
  /** 0-based atoms of the site in the stored structure (molfile, else canonical SMILES), ionizable atom first. */
  atoms: z.array(z.number().int().min(0)).optional(),
  /** The estimate a measured or literature value replaced, kept so the page can show both. */
  estimate: z.object({ value: z.number(), source: z.string(), se: z.number().optional() }).optional(),
});
export type StoredPKa = z.output<typeof storedPKaSchema>;

/** Reads a `pKas` column; entries that do not fit (written by older code) are dropped rather than shown wrong. */
export function readStoredPKas(json: unknown): StoredPKa[] {
  if (!Array.isArray(json)) return [];
  return json.flatMap((entry) => {
    const parsed = storedPKaSchema.safeParse(entry);
    return parsed.success ? [parsed.data] : [];
  });
}

export const SEARCH_MODES = ["similarity", "substructure", "text"] as const;
export type SearchMode = (typeof SEARCH_MODES)[number];

export const searchSchema = z.discriminatedUnion("mode", [
  z.object({
    mode: z.literal("similarity"),
    /** A SMILES or MOL block. */
    query: z.string().trim().min(1, { error: "enter a SMILES to compare with" }).max(100_000),
    /** Tanimoto on the Morgan radius-2 fingerprint; hits below are left out. */
    threshold: z.coerce.number().min(0, { error: "threshold must be between 0 and 1" }).max(1, { error: "threshold must be between 0 and 1" }).default(0.3),
    topK: z.coerce.number().int().min(1, { error: "show at least 1 hit" }).max(200, { error: "show at most 200 hits" }).default(20),
  }),
  z.object({
    mode: z.literal("substructure"),
    query: z.string().trim().min(1, { error: "enter a SMILES or SMARTS fragment" }).max(10_000),
    queryType: z.enum(["smiles", "smarts"]).default("smiles"),
    limit: z.coerce.number().int().min(1).max(1000).default(100),
  }),
  z.object({
    mode: z.literal("text"),
    query: z.string().trim().min(1, { error: "enter a name, synonym or tag" }).max(200),
    limit: z.coerce.number().int().min(1).max(1000).default(100),
  }),
]);
export type SearchInput = z.input<typeof searchSchema>;
export type SearchQuery = z.output<typeof searchSchema>;

export const listCompoundsSchema = z.object({
  /** Keyset cursor "name\u0000id" of the last row of the previous page. */
  after: z.string().max(500).optional(),
  tag: z.string().trim().toLowerCase().max(40).optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});
export type ListCompounds = z.output<typeof listCompoundsSchema>;
