import { type ReactNode } from "react";

type Tone = "neutral" | "good" | "low" | "high" | "accent";

const tones: Record<Tone, string> = {
  neutral: "bg-stone-100 text-stone-700 ring-stone-200",
  good: "bg-emerald-50 text-emerald-800 ring-emerald-200",
  low: "bg-amber-50 text-amber-900 ring-amber-200",
  high: "bg-sky-50 text-sky-800 ring-sky-200",
  accent: "bg-teal-50 text-teal-800 ring-teal-200",
};

export function Badge({ tone = "neutral", children }: { tone?: Tone; children: ReactNode }) {
  return <span className={`inline-flex items-center rounded-full px-2 py-0.5 text-xs font-medium ring-1 ring-inset ${tones[tone]}`}>{children}</span>;
}
