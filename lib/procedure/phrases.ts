/**
 * Reading one clause of a written workup: the names it mentions (longest spelling first, whole words only) and its
 * quantities ("(2 × 20 mL)", "(20 mL × 3)", "three times … (20 mL each)", "to pH 2", "(3 g)", "40 °C").
 */
import {
  COSOLVENT_NAMES, DRYING_AGENT_NAMES, normalise, PLAIN_REAGENT_NAMES, SOLVENT_NAMES, SPECIES_NAMES, UNLISTED_SOLVENTS,
  solutionKey, type Strength,
} from "./lexicon";

export type NameKind = "solvent" | "cosolvent" | "agent" | "species" | "plain" | "unlisted";
export interface NameHit { kind: NameKind; key: string; start: number; end: number }

interface Alias { alias: string; kind: NameKind; key: string }

function aliases(): Alias[] {
  const out: Alias[] = [];
  const add = (table: Readonly<Record<string, readonly string[]>>, kind: NameKind) => {
    for (const [key, names] of Object.entries(table)) for (const n of names) out.push({ alias: normalise(n), kind, key });
  };
  add(PLAIN_REAGENT_NAMES, "plain");
  add(SOLVENT_NAMES, "solvent");
  add(COSOLVENT_NAMES, "cosolvent");
  add(DRYING_AGENT_NAMES, "agent");
  add(SPECIES_NAMES, "species");
  for (const n of UNLISTED_SOLVENTS) out.push({ alias: normalise(n), kind: "unlisted", key: n });
  return out.sort((a, b) => b.alias.length - a.alias.length);
}

const ALIASES = aliases();
const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
const PATTERNS = ALIASES.map((a) => ({ ...a, re: new RegExp(`(?<![a-z0-9])${escape(a.alias)}(?![a-z0-9])`, "g") }));

/** Every name in normalised text, longest spelling first, no two overlapping; in text order. */
export function findNames(text: string): NameHit[] {
  const taken: boolean[] = new Array<boolean>(text.length).fill(false);
  const hits: NameHit[] = [];
  for (const p of PATTERNS) {
    p.re.lastIndex = 0;
    for (let m = p.re.exec(text); m; m = p.re.exec(text)) {
      const start = m.index, end = start + m[0].length;
      if (taken.slice(start, end).some(Boolean)) continue;
      for (let i = start; i < end; i++) taken[i] = true;
      hits.push({ kind: p.kind, key: p.key, start, end });
    }
  }
  return hits.sort((a, b) => a.start - b.start);
}

const NUM = String.raw`(\d+(?:\.\d+)?)`;

/** The strength written before a species ("1 M", "2 N", "10%", "sat.", "half-sat.") or in brackets after it. */
export function strengthAround(text: string, hit: NameHit): Strength | null {
  const before = text.slice(Math.max(0, hit.start - 24), hit.start);
  const after = text.slice(hit.end, hit.end + 40);
  let m = new RegExp(`${NUM}\\s*[mn]\\s+(?:aq\\.\\s+)?$`).exec(before);
  if (m) return { kind: "molar", value: Number(m[1]) };
  m = new RegExp(`${NUM}\\s*%\\s*(?:w/[vw]\\s+)?(?:aq\\.\\s+)?$`).exec(before);
  if (m) return { kind: "percent", value: Number(m[1]) };
  if (/half-?\s*sat\.\s+(?:aq\.\s+)?$/.test(before)) return { kind: "half-saturated" };
  if (/sat\.\s+(?:aq\.\s+)?$/.test(before)) return { kind: "saturated" };
  m = new RegExp(`^\\s*(?:solution\\s*)?\\((?:aq\\.,?\\s*)?${NUM}\\s*[mn](?![a-z])`).exec(after);
  if (m) return { kind: "molar", value: Number(m[1]) };
  m = new RegExp(`^\\s*(?:solution\\s*)?\\((?:aq\\.,?\\s*)?${NUM}\\s*%`).exec(after);
  if (m) return { kind: "percent", value: Number(m[1]) };
  if (/^\s*(?:solution\s*)?\((?:aq\.,?\s*)?sat\./.test(after)) return { kind: "saturated" };
  if (/^\s+solution/.test(after) && /\bsat\.\s+(?:aq\.\s+)?$/.test(before)) return { kind: "saturated" };
  return null;
}

export type Reagent = { ok: true; key: string } | { ok: false; reason: string };

/** The aqueous reagent a species mention stands for, or why it is not one the library has. */
export function reagentOf(text: string, hit: NameHit, original: string): Reagent {
  if (hit.kind === "plain") return { ok: true, key: hit.key };
  if (hit.kind !== "species") return { ok: false, reason: `${original} is not an aqueous reagent` };
  const strength = strengthAround(text, hit);
  if (!strength) return { ok: false, reason: `${original}: the strength (e.g. 1 M, 10%, sat.) is not given` };
  const key = solutionKey(hit.key, strength);
  if (key) return { ok: true, key };
  const written = strength.kind === "molar" ? `${strength.value} M` : strength.kind === "percent" ? `${strength.value}%` : strength.kind;
  return { ok: false, reason: `${written} ${original} is not a solution in the reagent library` };
}

export interface Volume { value: number; unit: "mL" | "L" | "uL"; portions: number; explicitPortions: boolean }

const WORD_COUNTS: Record<string, number> = { once: 1, twice: 2, thrice: 3, two: 2, three: 3, four: 4, five: 5, six: 6 };
const VOL_UNIT = String.raw`(ml|l|µl|μl|ul)(?![a-z])`;

function unitOf(u: string): Volume["unit"] {
  return u === "ml" ? "mL" : u === "l" ? "L" : "uL";
}

/** A volume with its number of portions, from any of the ways a clause writes it. */
export function volumeIn(text: string): Volume | null {
  let m = new RegExp(`(\\d+)\\s*[×x*]\\s*${NUM}\\s*${VOL_UNIT}`).exec(text);
  if (m) return { portions: Number(m[1]), value: Number(m[2]), unit: unitOf(m[3] as string), explicitPortions: true };
  m = new RegExp(`${NUM}\\s*${VOL_UNIT}\\s*[×x*]\\s*(\\d+)(?![\\d.])`).exec(text);
  if (m) return { value: Number(m[1]), unit: unitOf(m[2] as string), portions: Number(m[3]), explicitPortions: true };
  const single = new RegExp(`${NUM}\\s*${VOL_UNIT}`).exec(text);
  if (!single) return null;
  const times = /\b(once|twice|thrice|(two|three|four|five|six|\d+) (?:times|portions|more times))\b/.exec(text);
  const count = times ? (WORD_COUNTS[times[2] ?? times[1] ?? ""] ?? Number(times[2])) : 1;
  return { value: Number(single[1]), unit: unitOf(single[2] as string), portions: count, explicitPortions: times !== null };
}

export function massIn(text: string): { value: number; unit: "g" | "mg" | "kg" } | null {
  const m = new RegExp(`${NUM}\\s*(mg|kg|g)(?![a-z])`).exec(text);
  return m ? { value: Number(m[1]), unit: m[2] as "g" | "mg" | "kg" } : null;
}

export function amountIn(text: string): { value: number; unit: "mmol" | "mol" } | null {
  const m = new RegExp(`${NUM}\\s*(mmol|mol)(?![a-z])`).exec(text);
  return m ? { value: Number(m[1]), unit: m[2] as "mmol" | "mol" } : null;
}

/** Target pH; a range ("pH 1–2") is read as the end nearer neutral, the least reagent that reaches it. */
export function targetPhIn(text: string): { value: number; range: boolean } | null {
  const m = new RegExp(`\\bph\\s*(?:of\\s*)?(?:~|≈|about\\s+|approximately\\s+|ca\\.\\s*|<\\s*|>\\s*|≤\\s*|≥\\s*)?${NUM}(?:\\s*(?:-|to)\\s*${NUM})?`).exec(text);
  if (!m) return null;
  const a = Number(m[1]);
  if (m[2] === undefined) return { value: a, range: false };
  const b = Number(m[2]);
  return { value: Math.abs(a - 7) < Math.abs(b - 7) ? a : b, range: true };
}

export function bathIn(text: string): number | null {
  const m = new RegExp(`${NUM}\\s*°\\s*c\\b`).exec(text);
  return m ? Number(m[1]) : null;
}

export function pressureIn(text: string): { value: number; unit: "mbar" | "torr" } | null {
  const m = new RegExp(`${NUM}\\s*(mbar|torr|mm\\s*hg)\\b`).exec(text);
  if (!m) return null;
  return { value: Number(m[1]), unit: m[2] === "mbar" ? "mbar" : "torr" };
}
