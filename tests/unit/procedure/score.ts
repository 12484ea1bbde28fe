/** The corpus's short step notation turned into steps, and the clause-by-clause score of a reading against it. */
import { readProcedure, type ProposedStep } from "@/lib/procedure/parse";
import { type CorpusEntry } from "./corpus";

function volume(token: string | undefined): { volume?: { value: number; unit: string }; portions: number } {
  if (!token || token === "?") return { portions: 1 };
  const m = /^(?:(\d+)×)?([\d.]+)$/.exec(token);
  if (!m) throw new Error(`bad volume token ${token}`);
  return { volume: { value: Number(m[2]), unit: "mL" }, portions: m[1] ? Number(m[1]) : 1 };
}

function rinse(tokens: string[]): Record<string, unknown> {
  const i = tokens.indexOf("rinse");
  if (i < 0) return {};
  return { rinse: { solvent: tokens[i + 1], volume: { value: Number(tokens[i + 2]), unit: "mL" } } };
}

export function expand(short: string): ProposedStep {
  const [verb, a, b, ...rest] = short.split(" ");
  const t = [a, b, ...rest].filter((x): x is string => x !== undefined);
  const opt = (key: string) => t.find((x) => x.startsWith(`${key}=`))?.slice(key.length + 1);
  switch (verb) {
    case "charge": return { type: "charge", solvent: a, volume: volume(b).volume };
    case "quench": return { type: "quench", reagent: a, volume: volume(b).volume, mode: t.includes("inverse") ? "inverse" : "normal" };
    case "wash": return { type: "wash", reagent: a, ...volume(b) };
    case "extract": return { type: "extract", solvent: a, ...volume(b) };
    case "back": return { type: "back_extract", reagent: a, ...volume(b) };
    case "ph": {
      const ph = opt("pH");
      if (ph !== undefined) return { type: "adjust_ph", reagent: a, targetPh: Number(ph) };
      return b === "?" ? { type: "adjust_ph", reagent: a } : { type: "adjust_ph", reagent: a, volume: volume(b).volume };
    }
    case "salt": return a === "sat" ? { type: "add_salt", salt: "nacl", saturate: true } : { type: "add_salt", salt: "nacl", mass: { value: Number(a?.replace("g", "")), unit: "g" } };
    case "dry": {
      const mass = b?.endsWith("g") ? { mass: { value: Number(b.slice(0, -1)), unit: "g" } } : {};
      return { type: "dry", agent: a, ...mass, ...rinse(t) };
    }
    case "filter": return { type: "filter", keep: a === "solid" ? "solid" : "filtrate", ...rinse(t) };
    case "conc": {
      const bath = opt("bath"), p = opt("p");
      return { type: "concentrate", method: a, ...(bath ? { bath: { value: Number(bath), unit: "°C" } } : {}),
        ...(p ? { pressure: { value: Number(p.replace("mbar", "")), unit: "mbar" } } : {}) };
    }
    case "sep": return b === "save" ? { type: "separate", keep: a, saveAs: "first organic layer" } : { type: "separate", keep: a };
    case "combine": return { type: "combine", streams: ["first organic layer"] };
    case "cosolvent": return { type: "remove_cosolvent", solvent: a };
    default: throw new Error(`unknown short step ${short}`);
  }
}

/** Drops undefined fields so that steps compare by what they say. */
export function clean(step: ProposedStep): ProposedStep {
  return JSON.parse(JSON.stringify(step)) as ProposedStep;
}

export interface Score { clauses: number; exact: number; reported: number; misread: number; wronglyReported: number; missingSteps: number; paragraphsExact: number }

/**
 * Scores every entry clause by clause. A clause is exact when it was read (step, context or outside) and every step it
 * produced equals the expected step at that place; reported when it was flagged (unclear or incomplete) and the
 * corpus expects that; misread when it produced a step that differs from the expected one, or was read although
 * the corpus expects it reported. Expected steps that no clause produced are counted apart.
 */
export function score(corpus: CorpusEntry[]): { total: Score; failures: string[] } {
  const total: Score = { clauses: 0, exact: 0, reported: 0, misread: 0, wronglyReported: 0, missingSteps: 0, paragraphsExact: 0 };
  const failures: string[] = [];
  for (const entry of corpus) {
    const expected = entry.steps.map(expand).map(clean);
    const reading = readProcedure(entry.text);
    const got = reading.steps.map(clean);
    const report = entry.report ?? [];
    let ok = true;
    for (const c of reading.clauses) {
      total.clauses += 1;
      const flagged = c.outcome === "unclear" || c.outcome === "incomplete";
      const expectFlag = report.some((r) => c.text.includes(r) || r.includes(c.text));
      const stepsRight = c.steps.every((i) => JSON.stringify(got[i]) === JSON.stringify(expected[i]));
      if (!stepsRight || (expectFlag && !flagged)) { total.misread += 1; ok = false; failures.push(`misread: "${c.text}" in "${entry.text.slice(0, 60)}…"`); }
      else if (flagged && !expectFlag) { total.wronglyReported += 1; ok = false; failures.push(`reported: "${c.text}" (${c.message ?? ""})`); }
      else if (flagged) total.reported += 1;
      else total.exact += 1;
    }
    if (got.length !== expected.length) { total.missingSteps += Math.max(0, expected.length - got.length); ok = false; failures.push(`steps ${got.length} vs ${expected.length} in "${entry.text.slice(0, 60)}…": ${JSON.stringify(got)}`); }
    if (ok) total.paragraphsExact += 1;
  }
  return { total, failures };
}
