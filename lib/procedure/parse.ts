/**
 * Procedure text in: the workup part of an experimental section read into proposed steps, each clause linked to
 * the text it came from. Nothing is guessed silently: a clause that names no known reagent, lacks a quantity the
 * step needs, or describes something the engine does not model is reported with the reason, for the chemist to
 * confirm or enter by hand.
 */
import { splitClauses, type Span } from "./clauses";
import { COSOLVENT_NAMES, DRYING_AGENT_NAMES, normalise, PLAIN_REAGENT_NAMES, SOLVENT_NAMES, SPECIES_NAMES } from "./lexicon";
import {
  amountIn, bathIn, findNames, massIn, pressureIn, reagentOf, targetPhIn, volumeIn, type NameHit, type Volume,
} from "./phrases";

/** A step in the engine's input form (the shape the editor and the JSON format take). */
export type ProposedStep = { type: string } & Record<string, unknown>;

export type ClauseOutcome =
  | "step" // became one or more steps
  | "incomplete" // became a step that still needs a value (listed in `message`)
  | "context" // understood, needs no step of its own ("the combined organic layers", "filtered" after drying)
  | "outside" // understood as something the workup model does not cover (chromatography, stirring): not entered
  | "unclear"; // not understood: nothing entered

export interface ProcedureClause extends Span {
  outcome: ClauseOutcome;
  /** Indexes into `steps` of the steps this clause produced or completed. */
  steps: number[];
  message?: string;
}

export interface ProcedureReading {
  steps: ProposedStep[];
  clauses: ProcedureClause[];
}

type Verb = "charge" | "quench" | "wash" | "extract" | "adjust_ph" | "add_salt" | "dry" | "filter" | "concentrate"
  | "separate" | "rinse" | "outside" | "context";

const RESULT_PHRASE = /\b(to (?:give|afford|provide|yield|leave)|affording|giving|yielding|leaving|which was used)\b/;
const OUTSIDE = /\b(purif|chromatograph|recrystalli[sz]|triturat|stirr|cooled|warmed|heated|allowed|left|sonicat|stood|analy[sz]ed|tlc)/;

function verbOf(n: string, last: ProposedStep | undefined): Verb | null {
  if (/high vacuum|under vacuum overnight/.test(n)) return "concentrate";
  if (/\b(wash|rins)\w*/.test(n) && /\b(solids?|cake|filter cake|drying agent|pad|residue|salts?|funnel)\b/.test(n)) return "rinse";
  if (/^(washing|rinsing)\b/.test(n) && (last?.type === "dry" || last?.type === "filter")) return "rinse";
  if (/\bdri(ed|ng)\b|\bdry\b/.test(n)) return "dry";
  if (/\bquench/.test(n)) return "quench";
  if (/\bwash/.test(n)) return "wash";
  if (/\bextract(ed|ing)?\b(?! was| were)|\bextraction\b/.test(n) && !/\bextracts\b/.test(n.replace(/\bextracted\b.*$/, ""))) return "extract";
  if (/\bextracted\b/.test(n)) return "extract";
  if (/\b(acidif|basif|alkalini[sz]|neutrali[sz]|adjust)/.test(n)) return "adjust_ph";
  if (/\bsat\. with\b|\bsalted out\b|\btreated with solid\b|\bsolid nacl\b/.test(n)) return "add_salt";
  if (/\b(concentrat|evaporat)|\bremoved (under reduced pressure|in vacuo|by rotary|on a rotary)/.test(n)) return "concentrate";
  if (/\bseparat(ed|e)\b/.test(n) || /\b(organic|aq\.) (layer|phase) was (collected|retained|kept)\b/.test(n)) return "separate";
  if (/\bfilter|\bfiltration\b/.test(n)) return "filter";
  if (/\b(dilut\w*|partitioned between|poured (in)?to|was added|were added|taken up in|dissolved in|added)\b/.test(n)) return "charge";
  if (OUTSIDE.test(n)) return "outside";
  if (/^(the )?combined (organic|aq\.)/.test(n) || /^the (organic|aq\.) (layer|phase|extracts?)s?$/.test(n)) return "context";
  return null;
}

interface State {
  steps: ProposedStep[];
  lastVerb: Verb | null;
  pendingCombine: string | null;
  /** Set when a clause acted on a stream the steps do not hold (saved washes): the rest of its sentence is reported. */
  lost: boolean;
}

type Result = { outcome: ClauseOutcome; steps: number[]; message?: string };

const SAVED_ORGANIC = "first organic layer";

function volumeField(v: Volume) {
  return { value: v.value, unit: v.unit };
}

function firstOf(hits: NameHit[], kinds: NameHit["kind"][]) {
  return hits.find((h) => kinds.includes(h.kind));
}

function add(state: State, step: ProposedStep): number {
  state.steps.push(step);
  return state.steps.length - 1;
}

/** How a recognised name is written in a message: its usual spelling, not the normalised text. */
function displayOf(h: NameHit): string {
  const table = { solvent: SOLVENT_NAMES, cosolvent: COSOLVENT_NAMES, agent: DRYING_AGENT_NAMES, species: SPECIES_NAMES, plain: PLAIN_REAGENT_NAMES }[h.kind as Exclude<NameHit["kind"], "unlisted">];
  return table?.[h.key]?.[0] ?? h.key;
}

function agentKey(h: NameHit): string | null {
  if (h.kind === "agent") return h.key;
  if (h.kind === "species" && DRYING_AGENT_NAMES[h.key]) return h.key;
  return null;
}

/** The reagent of a mention, treating a drying-agent spelling that is also a dissolved species (K₂CO₃) as the species. */
function reagentFrom(n: string, h: NameHit, original: string) {
  const hit = h.kind === "agent" && SPECIES_NAMES[h.key] ? { ...h, kind: "species" as const } : h;
  return reagentOf(n, hit, original);
}

/** One item of a wash, extraction, quench or dilution: a name with its volume. */
function liquidItem(verb: Verb, n: string, hits: NameHit[], raw: string, state: State): Result {
  const hit = firstOf(hits, ["solvent", "plain", "species", "agent", "cosolvent", "unlisted"]);
  if (!hit) return { outcome: "unclear", steps: [], message: "no solvent or reagent recognised" };
  const name = displayOf(hit);
  if (hit.kind === "unlisted") return { outcome: "unclear", steps: [], message: `${name} is not in the solvent library` };
  const vol = volumeIn(n);
  const isOrganic = hit.kind === "solvent" && hit.key !== "water";
  const missing = vol ? undefined : "volume not given";
  const volume = vol ? volumeField(vol) : undefined;
  const portions = vol?.portions ?? 1;
  const done = (i: number): Result => (missing ? { outcome: "incomplete", steps: [i], message: `${name}: ${missing}` } : { outcome: "step", steps: [i] });

  if (verb === "charge") {
    if (hit.kind === "solvent" || hit.kind === "cosolvent" || hit.key === "water") return done(add(state, { type: "charge", solvent: hit.key, volume }));
    const r = reagentFrom(n, hit, name);
    if (!r.ok) return { outcome: "unclear", steps: [], message: r.reason };
    return done(add(state, { type: "quench", reagent: r.key, volume, mode: "normal" }));
  }
  if (verb === "quench") {
    const r = hit.key === "water" ? { ok: true as const, key: "water" } : reagentFrom(n, hit, name);
    if (!r.ok) return { outcome: "unclear", steps: [], message: r.reason };
    const inverse = /\b(poured|pouring|addition) (in)?to\b|\binverse\b/.test(n);
    return done(add(state, { type: "quench", reagent: r.key, volume, mode: inverse ? "inverse" : "normal" }));
  }
  if (verb === "extract") {
    if (isOrganic) {
      const out: number[] = [];
      if (/\baq\. (layer|phase)s?\b/.test(n)) {
        const last = state.steps.at(-1);
        if (last && ["wash", "extract", "back_extract"].includes(last.type)) {
          state.lost = true;
          return { outcome: "unclear", steps: [], message: "re-extraction of an aqueous wash: enter it with \u2018Save the other layer as\u2019 on the wash and \u2018Combine\u2019" };
        }
        if (last?.type === "separate") { last["keep"] = "aqueous"; last["saveAs"] = SAVED_ORGANIC; out.push(state.steps.length - 1); }
        else out.push(add(state, { type: "separate", keep: "aqueous", saveAs: SAVED_ORGANIC }));
        state.pendingCombine = SAVED_ORGANIC;
      }
      out.push(add(state, { type: "extract", solvent: hit.key, volume, portions }));
      return missing ? { outcome: "incomplete", steps: out, message: `${name}: ${missing}` } : { outcome: "step", steps: out };
    }
    if (hit.kind === "solvent" && hit.key !== "water") return { outcome: "unclear", steps: [], message: `${name}: not an extraction solvent here` };
    const r = reagentFrom(n, hit, name);
    if (!r.ok) return { outcome: "unclear", steps: [], message: r.reason };
    return done(add(state, { type: "back_extract", reagent: r.key, volume, portions }));
  }
  // wash
  if (isOrganic || hit.kind === "cosolvent") return { outcome: "unclear", steps: [], message: `${name} is a solvent, not an aqueous wash` };
  const r = reagentFrom(n, hit, name);
  if (!r.ok) return { outcome: "unclear", steps: [], message: r.reason };
  return done(add(state, { type: "wash", reagent: r.key, volume, portions }));
}

function adjustPh(n: string, hits: NameHit[], raw: string, state: State): Result {
  const hit = firstOf(hits, ["plain", "species", "agent"]);
  if (!hit) return { outcome: "unclear", steps: [], message: "the acid or base is not named" };
  const name = displayOf(hit);
  const r = reagentFrom(n, hit, name);
  if (!r.ok) return { outcome: "unclear", steps: [], message: r.reason };
  const target = targetPhIn(n);
  const vol = volumeIn(n.replace(/\bph\s*[\d.\s\-–to]+/, ""));
  const amount = amountIn(n);
  const step: ProposedStep = { type: "adjust_ph", reagent: r.key };
  if (target) step["targetPh"] = target.value;
  else if (vol) step["volume"] = volumeField(vol);
  else if (amount) step["amount"] = amount;
  const i = add(state, step);
  if (!target && !vol && !amount) return { outcome: "incomplete", steps: [i], message: "neither a target pH nor an amount is given" };
  if (target?.range) return { outcome: "step", steps: [i], message: `pH range read as target pH ${target.value} (the least reagent that reaches it)` };
  return { outcome: "step", steps: [i] };
}

function addSalt(n: string, hits: NameHit[], state: State): Result {
  const hit = firstOf(hits, ["species", "plain"]);
  if (!hit || !["nacl", "brine"].includes(hit.key)) return { outcome: "unclear", steps: [], message: "only sodium chloride is known as a salting-out salt here" };
  const mass = massIn(n);
  const saturate = /\bsat\. with\b/.test(n) && !mass;
  return { outcome: "step", steps: [add(state, saturate ? { type: "add_salt", salt: "nacl", saturate: true } : { type: "add_salt", salt: "nacl", mass })] };
}

function rinseOf(n: string, hits: NameHit[]): { solvent: string; volume: { value: number; unit: string } } | null {
  const hit = hits.find((h) => h.kind === "solvent" || h.key === "water");
  const vol = volumeIn(n);
  return hit && vol ? { solvent: hit.key, volume: volumeField(vol) } : null;
}

function concentrate(n: string, hits: NameHit[], state: State): Result {
  const co = firstOf(hits, ["cosolvent"]);
  const anyExtraction = state.steps.some((s) => ["wash", "extract", "back_extract"].includes(s.type));
  if (co && !anyExtraction && !/\bconcentrat/.test(n)) return { outcome: "step", steps: [add(state, { type: "remove_cosolvent", solvent: co.key })] };
  const method = /high vacuum|under vacuum overnight/.test(n) ? "high_vacuum"
    : /\bstream of (nitrogen|n2|argon)|\bn2 stream/.test(n) ? "n2_stream"
      : /\bdistil/.test(n) ? "distillation" : "rotavap";
  const step: ProposedStep = { type: "concentrate", method };
  const bath = bathIn(n);
  if (bath !== null) step["bath"] = { value: bath, unit: "°C" };
  const p = pressureIn(n);
  if (p) step["pressure"] = p;
  return { outcome: "step", steps: [add(state, step)] };
}

const SAVED_WASHES = /^(the )?(combined )?(acidic |basic |acidic aq\. |basic aq\. )?(aq\. )?(washes|washings)\b/;

function readClause(raw: string, state: State): Result {
  const n = normalise(raw);
  if (SAVED_WASHES.test(n)) {
    state.lost = true;
    return { outcome: "unclear", steps: [], message: "acts on the aqueous washes: enter it with \u2018Save the other layer as\u2019 on the washes and \u2018Combine\u2019" };
  }
  if (/^the (combined )?organic (layers?|phases?|extracts?)\b/.test(n)) state.lost = false;
  if (state.lost) return { outcome: "unclear", steps: [], message: "continues a clause that could not be read" };
  const hits = findNames(n);
  const last = state.steps.at(-1);
  const verb = verbOf(n, last);
  const continuing = verb === null && hits.length > 0 && ["wash", "extract", "charge", "quench"].includes(state.lastVerb ?? "");
  const v: Verb | null = continuing ? state.lastVerb : verb;
  if (v !== "context" && v !== null) state.lastVerb = v;
  const combined = /\bcombined organic\b/.test(n) && state.pendingCombine !== null;
  const pre: number[] = [];
  if (combined) {
    pre.push(add(state, { type: "combine", streams: [state.pendingCombine] }));
    state.pendingCombine = null;
  }
  const result = ((): Result => {
    switch (v) {
      case null: return { outcome: "unclear", steps: [], message: "not understood" };
      case "context": return { outcome: "context", steps: [] };
      case "outside": return { outcome: "outside", steps: [], message: "not part of the workup model; not entered" };
      case "charge": case "quench": case "wash": case "extract": return liquidItem(v, n, hits, normalise(raw), state);
      case "adjust_ph": return adjustPh(n, hits, n, state);
      case "add_salt": return addSalt(n, hits, state);
      case "dry": {
        const agentHit = hits.find((h) => agentKey(h) !== null);
        if (!agentHit) return /\bhigh vacuum|in vacuo/.test(n) ? concentrate(n, hits, state) : { outcome: "unclear", steps: [], message: "the drying agent is not named" };
        const step: ProposedStep = { type: "dry", agent: agentKey(agentHit) };
        const mass = massIn(n);
        if (mass) step["mass"] = mass;
        return { outcome: "step", steps: [add(state, step)] };
      }
      case "rinse": {
        const target = [...state.steps].reverse().find((s) => s.type === "dry" || s.type === "filter");
        const rinse = rinseOf(n, hits);
        if (!target || !rinse) return { outcome: "unclear", steps: [], message: "a rinse needs a solvent, a volume and a drying or filtration step before it" };
        target["rinse"] = rinse;
        return { outcome: "step", steps: [state.steps.indexOf(target)] };
      }
      case "filter": {
        if (last?.type === "dry" && !/\bcollected\b/.test(n)) {
          const rinse = rinseOf(n, hits);
          if (rinse) last["rinse"] = rinse;
          return { outcome: "context", steps: [state.steps.length - 1] };
        }
        const step: ProposedStep = { type: "filter", keep: /\bcollected\b|\bthe solids? (was|were) (collected|kept)/.test(n) ? "solid" : "filtrate" };
        const rinse = rinseOf(n, hits);
        if (rinse) step["rinse"] = rinse;
        return { outcome: "step", steps: [add(state, step)] };
      }
      case "concentrate": return concentrate(n, hits, state);
      case "separate": {
        const keep = /\baq\. (layer|phase) was (collected|retained|kept|separated)\b/.test(n) ? "aqueous" : "organic";
        return { outcome: "step", steps: [add(state, { type: "separate", keep })] };
      }
    }
  })();
  if (pre.length === 0) return result;
  return { ...result, outcome: result.outcome === "context" ? "step" : result.outcome, steps: [...pre, ...result.steps] };
}

/** Reads the workup part of an experimental paragraph into proposed steps, clause by clause. */
export function readProcedure(text: string): ProcedureReading {
  const state: State = { steps: [], lastVerb: null, pendingCombine: null, lost: false };
  const clauses: ProcedureClause[] = [];
  let sentence = -1;
  for (const span of splitClauses(text)) {
    if (span.sentence !== sentence) { sentence = span.sentence; state.lost = false; }
    const cut = RESULT_PHRASE.exec(span.text.toLowerCase());
    const head = cut ? { ...span, text: span.text.slice(0, cut.index).trim(), end: span.start + cut.index } : span;
    if (head.text) {
      const r = readClause(head.text, state);
      clauses.push({ ...head, end: head.start + head.text.length, ...r });
    }
    if (cut) {
      const tail = span.text.slice(cut.index);
      clauses.push({ text: tail, start: span.start + cut.index, end: span.end, sentence: span.sentence, outcome: "outside", steps: [], message: "the product obtained: not a workup step" });
    }
  }
  return { steps: state.steps, clauses };
}

/** The clauses a chemist must look at: not understood, or understood but still missing a value. */
export function clausesToCheck(reading: ProcedureReading): ProcedureClause[] {
  return reading.clauses.filter((c) => c.outcome === "unclear" || c.outcome === "incomplete");
}
