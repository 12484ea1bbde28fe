/**
 * Arguments of server actions, parsed like route inputs. A server action is a public POST endpoint whatever its
 * TypeScript signature says: the browser (or anyone) can send `{ not: "x" }` where an id is typed `string`, and an
 * unparsed value would reach a Prisma `where` as an operator. Every positional argument goes through `actionArg`
 * (inside the guard, so a stranger learns nothing), which throws ValidationError (422) with the argument named.
 */
import { z } from "zod";
import { parseInput } from "@/lib/errors";
import { looksLikeInviteToken } from "@/lib/groups/invite-token";

/** Record ids as Prisma's cuid() and lib/workups/ids.ts make them: "c" then lowercase base-36 characters. */
export const RECORD_ID = /^c[0-9a-z]{20,31}$/;

export const recordIdArg = (label: string) =>
  z.string({ error: `${label} must be an id` }).regex(RECORD_ID, { error: `${label} is not a valid id` });

/** Version numbers of a workup's history (a 32-bit column: larger numbers are refused, not passed to the database). */
export const versionArg = (label: string) =>
  z.number({ error: `${label} must be a version number` }).int({ error: `${label} must be a whole number` })
    .min(1, { error: `${label} must be ≥ 1` }).max(2_147_483_647, { error: `${label} is out of range` });

/** Invite tokens as lib/groups/invite-token.ts makes them (URL-safe base64 of 32 bytes). */
export const inviteTokenArg = z.string({ error: "the invite link is incomplete" }).refine(looksLikeInviteToken, { error: "the invite link is not valid" });

/** Any JSON object (the service parses it with its own schema); refuses strings, arrays, numbers and null. */
export const objectArg = (label: string) =>
  z.custom<Record<string, unknown>>((v) => v !== null && typeof v === "object" && !Array.isArray(v), { error: `${label} must be an object` });

/** A list (the service parses its items with its own schema). */
export const listArg = (label: string, max = 200) => z.array(z.unknown(), { error: `${label} must be a list` }).max(max, { error: `${label} must have at most ${max} items` });

/**
 * Parses one argument; a failure names it (`id: id is not a valid id`). Optional arguments pass `.optional()` schemas.
 * Field messages are keyed by the argument's name so a form can place them.
 */
export function actionArg<S extends z.ZodType>(name: string, schema: S, value: unknown): z.output<S> {
  return parseInput(z.object({ [name]: schema }), { [name]: value })[name] as z.output<S>;
}
