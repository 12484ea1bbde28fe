// The list's filters as a plain GET form: the URL holds the filter, so a filtered list can be bookmarked, shared,
// paged and exported as CSV with the same parameters.
import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { OUTCOME_STATUSES } from "@/lib/workups/schemas";

export interface FilterValues {
  q?: string;
  compoundId?: string;
  solvent?: string;
  chemistId?: string;
  from?: string;
  to?: string;
  flagged?: string;
  status?: string;
}

export const FILTER_KEYS = ["q", "compoundId", "solvent", "chemistId", "from", "to", "flagged", "status"] as const;

const STATUS_WORDS: Record<string, string> = { as_expected: "As predicted", below: "Below prediction", above: "Above prediction", inconclusive: "Low, not conclusive", unknown: "No outcome yet" };

type Choice = { value: string; label: string };

function Select({ name, label, value, choices, errors }: { name: string; label: string; value: string | undefined; choices: Choice[]; errors: string[] }) {
  return (
    <div>
      <label htmlFor={`filter-${name}`} className="block text-xs font-medium text-stone-700">{label}</label>
      <select id={`filter-${name}`} name={name} defaultValue={value ?? ""} className={`${inputClass} mt-0.5 py-1.5`} aria-invalid={errors.length > 0 || undefined}>
        <option value="">Any</option>
        {choices.map((c) => <option key={c.value} value={c.value}>{c.label}</option>)}
      </select>
      {errors.map((e) => <p key={e} className="text-xs text-red-700">{e}</p>)}
    </div>
  );
}

export function FilterForm({ values, compounds, solvents, chemists, errors }: {
  values: FilterValues; compounds: Choice[]; solvents: Choice[]; chemists: Choice[]; errors: Record<string, string[]>;
}) {
  const err = (k: string) => errors[k] ?? [];
  const active = FILTER_KEYS.some((k) => values[k]);
  return (
    <form method="get" action="/workups" role="search" aria-label="Filter workups" className="mb-4 grid gap-3 rounded-lg border border-stone-200 bg-white p-4 shadow-xs sm:grid-cols-2 lg:grid-cols-4">
      <div className="sm:col-span-2">
        <label htmlFor="filter-q" className="block text-xs font-medium text-stone-700">Words in the title, notebook reference or component names</label>
        <input id="filter-q" name="q" type="search" defaultValue={values.q ?? ""} className={`${inputClass} mt-0.5 py-1.5`} aria-invalid={err("q").length > 0 || undefined} />
        {err("q").map((e) => <p key={e} className="text-xs text-red-700">{e}</p>)}
      </div>
      <Select name="compoundId" label="Compound" value={values.compoundId} choices={compounds} errors={err("compoundId")} />
      <Select name="solvent" label="Solvent" value={values.solvent} choices={solvents} errors={err("solvent")} />
      <Select name="chemistId" label="Chemist" value={values.chemistId} choices={chemists} errors={err("chemistId")} />
      {(["from", "to"] as const).map((k) => (
          <div key={k}>
            <label htmlFor={`filter-${k}`} className="block text-xs font-medium text-stone-700">{k === "from" ? "Run on or after" : "Run on or before"}</label>
            <input id={`filter-${k}`} name={k} type="date" defaultValue={values[k] ?? ""} className={`${inputClass} mt-0.5 py-1.5`} aria-invalid={err(k).length > 0 || undefined} />
            {err(k).map((e) => <p key={e} className="text-xs text-red-700">{e}</p>)}
          </div>
      ))}
      <Select name="status" label="Outcome" value={values.status} choices={OUTCOME_STATUSES.map((s) => ({ value: s, label: STATUS_WORDS[s] ?? s }))} errors={err("status")} />
      <div className="flex items-end justify-between gap-3 sm:col-span-2 lg:col-span-4">
        <label className="flex items-center gap-2 pb-2 text-sm text-stone-800">
          <input type="checkbox" name="flagged" value="true" defaultChecked={values.flagged === "true"} className="h-4 w-4 accent-teal-700" />
          Flagged only
        </label>
        <div className="flex gap-2">
          {active ? <Link href="/workups" className={buttonClass("ghost")}>Clear</Link> : null}
          <button type="submit" className={buttonClass("secondary")}>Filter</button>
        </div>
      </div>
    </form>
  );
}

/** The filter as query parameters (empty values left out), for page links and the CSV export. */
export function filterQuery(values: FilterValues, extra: Record<string, string> = {}): string {
  const params = new URLSearchParams();
  for (const k of FILTER_KEYS) {
    const v = values[k];
    if (v) params.set(k, v);
  }
  for (const [k, v] of Object.entries(extra)) params.set(k, v);
  const s = params.toString();
  return s ? `?${s}` : "";
}
