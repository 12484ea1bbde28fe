// A plain, readable rendering of a stored workup description (components, starting mixture, ordered operations).
// It reads the JSON defensively: the structured editor and its typed views replace this later.
import { formatNumber } from "@/components/ui/format";

type Json = string | number | boolean | null | Json[] | { [key: string]: Json };

function isRecord(value: unknown): value is Record<string, Json> {
  return typeof value === "object" && value !== null && !Array.isArray(value);
}

function label(key: string): string {
  return key.replace(/([a-z0-9])([A-Z])/g, "$1 $2").replace(/_/g, " ").toLowerCase();
}

function text(value: Json | undefined): string {
  if (value === null || value === undefined) return "—";
  if (typeof value === "number") return formatNumber(value);
  if (typeof value === "boolean") return value ? "yes" : "no";
  if (typeof value === "string") return value;
  if (Array.isArray(value)) return value.length === 0 ? "none" : value.map(text).join(", ");
  if ("value" in value && "unit" in value && Object.keys(value).length === 2) return `${text(value.value)} ${text(value.unit)}`;
  return Object.entries(value)
    .map(([k, v]) => `${label(k)}: ${text(v)}`)
    .join("; ");
}

function Pairs({ value, skip = [] }: { value: Record<string, Json>; skip?: string[] }) {
  const entries = Object.entries(value).filter(([k]) => !skip.includes(k));
  if (entries.length === 0) return null;
  return (
    <dl className="mt-1 grid grid-cols-[max-content_1fr] gap-x-4 gap-y-0.5 text-sm">
      {entries.map(([k, v]) => (
        <div key={k} className="contents">
          <dt className="text-stone-500">{label(k)}</dt>
          <dd className="text-stone-800">{text(v)}</dd>
        </div>
      ))}
    </dl>
  );
}

export function ComponentsList({ spec }: { spec: unknown }) {
  const components = isRecord(spec) && Array.isArray(spec.components) ? spec.components.filter(isRecord) : [];
  if (components.length === 0) return <p className="text-sm text-stone-500">No components recorded.</p>;
  return (
    <ul className="divide-y divide-stone-100">
      {components.map((c, i) => (
        <li key={typeof c.key === "string" ? c.key : i} className="py-2">
          <p className="font-medium text-stone-900">
            {text(c.name ?? c.key)} <span className="text-sm font-normal text-stone-500">{c.role ? `· ${text(c.role)}` : ""}</span>
          </p>
          <Pairs value={c} skip={["name", "role", "key", "notes"]} />
        </li>
      ))}
    </ul>
  );
}

export function MixtureList({ spec }: { spec: unknown }) {
  const mixture = isRecord(spec) && isRecord(spec.mixture) ? spec.mixture : null;
  if (!mixture) return <p className="text-sm text-stone-500">No starting mixture recorded.</p>;
  return <Pairs value={mixture} />;
}

export function OperationsList({ spec }: { spec: unknown }) {
  const operations = isRecord(spec) && Array.isArray(spec.operations) ? spec.operations.filter(isRecord) : [];
  if (operations.length === 0) return <p className="text-sm text-stone-500">No steps recorded.</p>;
  return (
    <ol className="space-y-3">
      {operations.map((op, i) => (
        <li key={i} className="flex gap-3">
          <span aria-hidden className="mt-0.5 flex h-6 w-6 shrink-0 items-center justify-center rounded-full bg-stone-100 text-xs font-semibold text-stone-600">
            {i + 1}
          </span>
          <div>
            <p className="font-medium capitalize text-stone-900">
              <span className="sr-only">Step {i + 1}: </span>
              {label(typeof op.type === "string" ? op.type : "step")}
            </p>
            <Pairs value={op} skip={["type"]} />
          </div>
        </li>
      ))}
    </ol>
  );
}
