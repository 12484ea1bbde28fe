// The dashboard strip above the list: the newest workups flagged for review, each with its likely causes (ranked by
// how much of the gap each explains) or the serious flag that put it there.
import Link from "next/link";
import { formatDate, formatNumber } from "@/components/ui/format";

export interface FlaggedCard {
  id: string;
  title: string;
  performedOn: Date;
  deviationPct: number | null;
  reasons: { title: string; detail: string }[];
}

export function FlaggedStrip({ items, total, href }: { items: FlaggedCard[]; total: number; href: string }) {
  if (items.length === 0) return null;
  return (
    <section aria-labelledby="flagged-heading" className="mb-6" data-testid="flagged-strip">
      <div className="mb-2 flex items-baseline justify-between">
        <h2 id="flagged-heading" className="text-sm font-semibold text-stone-900">Flagged for review ({total})</h2>
        {total > items.length ? <Link href={href} className="text-sm text-teal-800 underline">Show all flagged</Link> : null}
      </div>
      <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        {items.map((w) => (
          <li key={w.id} className="rounded-lg border border-amber-200 bg-amber-50/60 p-3 text-sm">
            <Link href={`/workups/${w.id}`} className="font-medium text-stone-900 hover:underline">
              <span className="sr-only">Flagged: </span>{w.title}
            </Link>
            <p className="text-xs text-stone-600">{formatDate(w.performedOn)}{w.deviationPct !== null ? ` · ${w.deviationPct > 0 ? "+" : ""}${formatNumber(w.deviationPct, 1)} points vs predicted` : ""}</p>
            {w.reasons.length > 0 ? (
              <ol className="mt-1.5 space-y-0.5 text-xs text-amber-950">
                {w.reasons.map((r, i) => <li key={i}>{i + 1}. {r.title}{r.detail ? <span className="text-amber-800"> ({r.detail})</span> : null}</li>)}
              </ol>
            ) : <p className="mt-1.5 text-xs text-stone-600">No single cause stands out.</p>}
          </li>
        ))}
      </ul>
    </section>
  );
}
