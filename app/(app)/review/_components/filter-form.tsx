import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { type ReviewFilters } from "@/lib/review/filters";
import { PrintButton } from "./print-button";

export interface FilterOptions {
  chemists: { id: string; name: string }[];
  solvents: { key: string; name: string }[];
  isLead: boolean;
}

/** A plain GET form: the filters live in the address, so a view can be bookmarked, shared and printed as it is. */
export function FilterForm({ filters, options }: { filters: ReviewFilters; options: FilterOptions }) {
  return (
    <form method="get" action="/review" aria-label="Review filters" className="flex flex-wrap items-end gap-3 rounded-lg border border-stone-200 bg-white p-4 shadow-xs print:hidden">
      <div className="space-y-1">
        <label htmlFor="from" className="block text-sm font-medium text-stone-800">From</label>
        <input id="from" name="from" type="date" defaultValue={filters.from ?? ""} className={inputClass} />
      </div>
      <div className="space-y-1">
        <label htmlFor="to" className="block text-sm font-medium text-stone-800">To</label>
        <input id="to" name="to" type="date" defaultValue={filters.to ?? ""} className={inputClass} />
      </div>
      <div className="min-w-48 space-y-1">
        <label htmlFor="chemist" className="block text-sm font-medium text-stone-800">Chemist</label>
        <select id="chemist" name="chemist" defaultValue={filters.chemist ?? ""} className={inputClass}>
          <option value="">{options.isLead ? "Everyone" : "Everyone (in aggregate)"}</option>
          {options.chemists.map((c) => <option key={c.id} value={c.id}>{options.isLead ? c.name : `Only mine (${c.name})`}</option>)}
        </select>
      </div>
      <div className="min-w-48 space-y-1">
        <label htmlFor="solvent" className="block text-sm font-medium text-stone-800">Solvent system</label>
        <select id="solvent" name="solvent" defaultValue={filters.solvent ?? ""} className={inputClass}>
          <option value="">All</option>
          {options.solvents.map((s) => <option key={s.key} value={s.key}>{s.name} / water</option>)}
        </select>
      </div>
      <button type="submit" className={buttonClass("primary")}>Apply</button>
      <Link href="/review" className={buttonClass("ghost")}>Clear</Link>
      <span className="ml-auto"><PrintButton /></span>
    </form>
  );
}
