// What changed between two versions of a workup (or between a saved version and the editor's unsaved form):
// header fields, components and steps, each old → new.
import type { FieldChange, VersionDiff } from "@/lib/workups/diff";
import type { JsonValue } from "@/lib/workups/record";
import { fieldWords, stepTypeWords } from "@/lib/workups-client/field-words";

export function jsonText(v: JsonValue | undefined): string {
  if (v === null || v === undefined) return "—";
  if (typeof v === "string") return v === "" ? "—" : v;
  if (typeof v === "number" || typeof v === "boolean") return String(v);
  if (Array.isArray(v)) return v.length === 0 ? "none" : v.map(jsonText).join(", ");
  if ("value" in v && "unit" in v) return `${jsonText(v.value)} ${jsonText(v.unit)}`;
  if ("value" in v && "provenance" in v) return `${jsonText(v.value)} (${jsonText(v.provenance)})`;
  return Object.entries(v).map(([k, x]) => `${fieldWords(k)} ${jsonText(x)}`).join("; ");
}

function Changes({ changes }: { changes: FieldChange[] }) {
  return (
    <ul className="ml-4 list-disc space-y-0.5">
      {changes.map((c) => (
        <li key={c.field}><span className="text-stone-600">{fieldWords(c.field)}:</span> <del className="text-red-800">{jsonText(c.from)}</del> → <ins className="text-emerald-800 no-underline">{jsonText(c.to)}</ins></li>
      ))}
    </ul>
  );
}

function nameOf(names: Record<string, string>, id: JsonValue): JsonValue {
  return typeof id === "string" ? (names[id] ?? id) : id;
}

export function VersionDiffView({ diff, names }: { diff: VersionDiff; names?: Record<string, string> }) {
  if (diff.unchanged) return <p className="text-sm text-stone-600">No differences.</p>;
  const person = (c: FieldChange): FieldChange => (c.field === "chemistId" && names ? { ...c, from: nameOf(names, c.from), to: nameOf(names, c.to) } : c);
  const ops = diff.operations;
  return (
    <div className="space-y-3 text-sm" data-testid="version-diff">
      {diff.header.length > 0 ? <div><p className="font-medium">Record</p><Changes changes={diff.header.map(person)} /></div> : null}
      {diff.settings.length > 0 ? <div><p className="font-medium">Settings</p><Changes changes={diff.settings} /></div> : null}
      {diff.components.added.length + diff.components.removed.length + diff.components.changed.length > 0 ? (
        <div>
          <p className="font-medium">Components</p>
          <ul className="ml-4 list-disc space-y-0.5">
            {diff.components.added.map((c) => <li key={`a-${c.key}`} className="text-emerald-800">Added {c.name || c.key}</li>)}
            {diff.components.removed.map((c) => <li key={`r-${c.key}`} className="text-red-800">Removed {c.name || c.key}</li>)}
            {diff.components.changed.map((c) => <li key={`c-${c.key}`}>{c.name || c.key}<Changes changes={c.changes} /></li>)}
          </ul>
        </div>
      ) : null}
      {ops.added.length + ops.removed.length + ops.changed.length > 0 ? (
        <div>
          <p className="font-medium">Steps</p>
          <ul className="ml-4 list-disc space-y-0.5">
            {ops.added.map((o) => <li key={`a-${o.step}`} className="text-emerald-800">Added step {o.step}: {o.label ?? stepTypeWords(o.type)}</li>)}
            {ops.removed.map((o) => <li key={`r-${o.step}`} className="text-red-800">Removed step {o.step}: {o.label ?? stepTypeWords(o.type)}</li>)}
            {ops.changed.map((o) => (
              <li key={`c-${o.fromStep}-${o.toStep}`}>
                Step {o.fromStep === o.toStep ? o.toStep : `${o.fromStep} → ${o.toStep}`} ({stepTypeWords(o.type)})<Changes changes={o.changes} />
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );
}
