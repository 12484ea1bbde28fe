// A measured or literature log P is stored as its value plus one text column, logPSource, written as
// "measured: <source>" or "literature: <source>". Rows written without the prefix (older data, the demo seed) keep
// their text as the source and show no provenance.
export type EditableProvenance = "measured" | "literature";

export function formatLogPSource(provenance: EditableProvenance, source: string): string {
  return `${provenance}: ${source.trim()}`;
}

export function parseLogPSource(text: string | null): { provenance: EditableProvenance | null; source: string } {
  const match = text ? /^(measured|literature):\s*(.*)$/s.exec(text) : null;
  if (match?.[1] === "measured" || match?.[1] === "literature") return { provenance: match[1], source: match[2] ?? "" };
  return { provenance: null, source: text ?? "" };
}
