/**
 * The group's solvent and wash library: the shipped tables (lib/chem/data) with the group's own entries over them,
 * by key. A group entry either changes a shipped one (a measured density, a better solubility) or adds a new one.
 * Writes are scoped by group inside their `where` and leave an audit event in the same transaction.
 */
import { type Prisma } from "@/generated/prisma/client";
import { type Db, type DbTransaction } from "@/lib/db/client";
import { NotFoundError, parseInput } from "@/lib/errors";
import { DRYING_AGENTS, type DryingAgentProps } from "@/lib/chem/data/drying-agents";
import { REAGENTS, type ReagentProps } from "@/lib/chem/data/reagents";
import { SOLVENTS, type SolventProps } from "@/lib/chem/data/solvents";
import { reagentPropsSchema, solventPropsSchema } from "./schemas";

export type EntryOrigin = "shipped" | "changed" | "added";

export interface LibraryEntry<T> {
  props: T;
  origin: EntryOrigin;
  /** The shipped entry a group entry replaces (for the "back to shipped" action and the comparison). */
  shipped: T | null;
  updatedAt: string | null;
}

export interface LibraryListing {
  solvents: LibraryEntry<SolventProps>[];
  reagents: LibraryEntry<ReagentProps>[];
  dryingAgents: DryingAgentProps[];
}

export interface LibraryActor {
  groupId: string;
  userId: string;
}

/** JSON with sorted keys: a stored copy of a shipped entry counts as unchanged whatever its key order. */
function canonical(v: unknown): string {
  if (Array.isArray(v)) return `[${v.map(canonical).join(",")}]`;
  if (v !== null && typeof v === "object") return `{${Object.keys(v).sort().map((k) => `${JSON.stringify(k)}:${canonical((v as Record<string, unknown>)[k])}`).join(",")}}`;
  return JSON.stringify(v) ?? "null";
}

function merge<T extends { key: string; name: string }>(shipped: Readonly<Record<string, T>>, rows: { key: string; props: unknown; updatedAt: Date }[]): LibraryEntry<T>[] {
  const own = new Map(rows.map((r) => [r.key, r]));
  const entries: LibraryEntry<T>[] = Object.values(shipped).map((s) => {
    const row = own.get(s.key);
    if (!row) return { props: s, origin: "shipped", shipped: s, updatedAt: null };
    // Groups start with a copy of the shipped tables (seed/load.ts); a copy nobody changed is still "shipped".
    const props = { ...(row.props as T), key: s.key };
    return { props, origin: canonical(props) === canonical(JSON.parse(JSON.stringify(s))) ? "shipped" : "changed", shipped: s, updatedAt: row.updatedAt.toISOString() };
  });
  for (const row of rows) {
    if (!(row.key in shipped)) entries.push({ props: { ...(row.props as T), key: row.key }, origin: "added", shipped: null, updatedAt: row.updatedAt.toISOString() });
  }
  return entries.sort((a, b) => a.props.name.localeCompare(b.props.name, "en"));
}

export async function libraryListing(db: Db, groupId: string): Promise<LibraryListing> {
  const [solvents, reagents] = await Promise.all([
    db.solvent.findMany({ where: { groupId }, select: { key: true, props: true, updatedAt: true } }),
    db.aqueousReagent.findMany({ where: { groupId }, select: { key: true, props: true, updatedAt: true } }),
  ]);
  return { solvents: merge(SOLVENTS, solvents), reagents: merge(REAGENTS, reagents), dryingAgents: Object.values(DRYING_AGENTS) };
}

export async function solventEntry(db: Db, groupId: string, key: string): Promise<LibraryEntry<SolventProps>> {
  const entry = (await libraryListing(db, groupId)).solvents.find((e) => e.props.key === key);
  if (!entry) throw new NotFoundError("solvent");
  return entry;
}

export async function reagentEntry(db: Db, groupId: string, key: string): Promise<LibraryEntry<ReagentProps>> {
  const entry = (await libraryListing(db, groupId)).reagents.find((e) => e.props.key === key);
  if (!entry) throw new NotFoundError("reagent");
  return entry;
}

const json = (v: object) => JSON.parse(JSON.stringify(v)) as Prisma.InputJsonObject;

async function auditLibrary(tx: DbTransaction, actor: LibraryActor, action: string, key: string, details: Prisma.InputJsonObject) {
  await tx.auditEvent.create({ data: { groupId: actor.groupId, actorId: actor.userId, action, entity: "library", entityId: key, details }, select: { id: true } });
}

/** Saves the group's version of a solvent (new key: a new entry). Throws ValidationError (422) with field messages. */
export async function saveSolvent(db: Db, actor: LibraryActor, input: unknown): Promise<SolventProps> {
  const props = parseInput(solventPropsSchema, input);
  await db.$transaction(async (tx) => {
    await tx.solvent.upsert({
      where: { groupId_key: { groupId: actor.groupId, key: props.key } },
      create: { groupId: actor.groupId, key: props.key, name: props.name, props: json(props), builtin: false },
      update: { name: props.name, props: json(props), builtin: false },
      select: { id: true },
    });
    await auditLibrary(tx, actor, "library.solvent.save", props.key, { name: props.name });
  });
  return props;
}

export async function saveReagent(db: Db, actor: LibraryActor, input: unknown): Promise<ReagentProps> {
  const props = parseInput(reagentPropsSchema, input);
  await db.$transaction(async (tx) => {
    await tx.aqueousReagent.upsert({
      where: { groupId_key: { groupId: actor.groupId, key: props.key } },
      create: { groupId: actor.groupId, key: props.key, name: props.name, props: json(props), builtin: false },
      update: { name: props.name, props: json(props), builtin: false },
      select: { id: true },
    });
    await auditLibrary(tx, actor, "library.reagent.save", props.key, { name: props.name });
  });
  return props;
}

/** Removes the group's entry: a changed shipped entry goes back to the shipped values; an added one disappears. */
export async function removeEntry(db: Db, actor: LibraryActor, table: "solvent" | "reagent", key: string): Promise<void> {
  await db.$transaction(async (tx) => {
    const where = { groupId: actor.groupId, key };
    const { count } = table === "solvent" ? await tx.solvent.deleteMany({ where }) : await tx.aqueousReagent.deleteMany({ where });
    if (count === 0) throw new NotFoundError(table === "solvent" ? "group solvent entry" : "group reagent entry");
    await auditLibrary(tx, actor, `library.${table}.remove`, key, {});
  });
}
