// Number words of the prediction views: percentages of a starting amount, volumes, masses, pH.
import { formatNumber } from "@/components/ui/format";

/** A fraction 0–1 as a percentage; one decimal below 10 % so small losses stay visible. */
export function pct(fraction: number): string {
  const p = fraction * 100;
  if (p > 0 && p < 0.1) return "< 0.1 %";
  return `${formatNumber(p, Math.abs(p) < 10 ? 1 : 0)} %`;
}

export function ml(volume: number): string {
  return `${formatNumber(volume, volume < 10 ? 1 : 0)} mL`;
}

export function mg(mass: number): string {
  return mass >= 1000 ? `${formatNumber(mass / 1000, 2)} g` : `${formatNumber(mass, mass < 10 ? 1 : 0)} mg`;
}

export function pH(value: number | null): string {
  return value === null ? "—" : formatNumber(value, 1);
}

export const PHASE_COLORS = {
  organic: { fill: "#fde68a", stroke: "#d97706", text: "text-amber-800", swatch: "bg-amber-300" },
  aqueous: { fill: "#bae6fd", stroke: "#0284c7", text: "text-sky-800", swatch: "bg-sky-300" },
} as const;
