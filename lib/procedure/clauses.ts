/**
 * Cutting a paragraph into clauses with their place in the text: sentences end at a full stop followed by a space
 * and a capital (not after "sat.", "aq.", "conc." and the like); clauses end at commas, semicolons, "and", "then"
 * and "followed by" outside brackets. "1,2-dichloroethane" and "1.5 M" are not cut.
 */

export interface Span { text: string; start: number; end: number; /** Index of the sentence the clause is in. */ sentence: number }

const ABBREVIATIONS = new Set(["sat", "satd", "aq", "conc", "approx", "ca", "vol", "e.g", "i.e", "anhyd", "soln", "equiv", "no", "vs", "ref", "ph"]);

/** The text with everything inside brackets replaced by "_", so separators inside them are not seen. */
function mask(text: string): string {
  let depth = 0;
  let out = "";
  for (const ch of text) {
    if (ch === "(" || ch === "[") { depth += 1; out += ch; continue; }
    if ((ch === ")" || ch === "]") && depth > 0) { depth -= 1; out += ch; continue; }
    out += depth > 0 ? "_".repeat(ch.length) : ch;
  }
  return out;
}

function sentences(text: string, masked: string): Span[] {
  const out: Span[] = [];
  const push = (o: Span[], t: string, a: number, b: number) => pushSpan(o, t, a, b, o.length);
  let from = 0;
  const re = /\.(\s+)(?=[A-Z(])|\.\s*$/g;
  for (let m = re.exec(masked); m; m = re.exec(masked)) {
    const word = /([A-Za-z.]+)$/.exec(masked.slice(from, m.index))?.[1]?.toLowerCase() ?? "";
    if (m[1] !== undefined && ABBREVIATIONS.has(word)) continue;
    push(out, text, from, m.index);
    from = m.index + m[0].length;
  }
  push(out, text, from, text.length);
  return out;
}

function pushSpan(out: Span[], text: string, start: number, end: number, sentence: number) {
  const raw = text.slice(start, end);
  const lead = raw.length - raw.trimStart().length;
  const trimmed = raw.trim().replace(/[.;,]+$/, "");
  if (trimmed) out.push({ text: trimmed, start: start + lead, end: start + lead + trimmed.length, sentence });
}

const SEPARATOR = /,\s+and then\s+|,\s+and\s+|,\s+then\s+|,\s+followed by\s+|;\s*(?:and\s+|then\s+)?|,\s+|\s+and then\s+|\s+and\s+|\s+then\s+|\s+followed by\s+/g;

/** Clauses of the paragraph, each with its offsets in the original text. */
export function splitClauses(text: string): Span[] {
  const masked = mask(text);
  const out: Span[] = [];
  for (const s of sentences(text, masked)) {
    const m = masked.slice(s.start, s.end);
    let from = 0;
    SEPARATOR.lastIndex = 0;
    for (let sep = SEPARATOR.exec(m); sep; sep = SEPARATOR.exec(m)) {
      pushSpan(out, text, s.start + from, s.start + sep.index, s.sentence);
      from = sep.index + sep[0].length;
    }
    pushSpan(out, text, s.start + from, s.end, s.sentence);
  }
  return out;
}
