/**
 * What the failure-mode rules read: the parsed input, the library, the contact and step traces, the streams
 * that left the main line and the isolated fraction. Plus small helpers shared by the rule files.
 */
import { type CompiledComponents } from "../components";
import { type CompiledLibrary, type Library } from "../library";
import { type Component, type Operation, type WorkupInput } from "../schema";
import { type SideInternal } from "../simulator";
import { type Stream } from "../stream";
import { type ContactTrace, type StepTrace } from "../trace";
import { type Flag, type Severity } from "../types";

export interface FlagContext {
  input: WorkupInput;
  library: Library;
  lib: CompiledLibrary;
  comps: CompiledComponents;
  contacts: ContactTrace[];
  steps: StepTrace[];
  side: SideInternal[];
  isolated: Stream;
  recovery: Float64Array;
  productIndex: number;
  crudeMassMg: number;
  residualSolventsMg: Record<string, number>;
}

export type Rule = (ctx: FlagContext) => Flag[];

export interface ProductInfo {
  index: number;
  component: Component;
  startMmol: number;
  /** Lowest acidic pKa and highest conjugate-acid pKa, or null. */
  acidPka: number | null;
  basePka: number | null;
}

export function productInfo(ctx: FlagContext): ProductInfo | null {
  const c = ctx.input.components[ctx.productIndex];
  if (!c) return null;
  const acids = c.pKas.filter((p) => p.kind === "acid").map((p) => p.value);
  const bases = c.pKas.filter((p) => p.kind === "base").map((p) => p.value);
  return {
    index: ctx.productIndex, component: c, startMmol: c.amountMmol,
    acidPka: acids.length ? Math.min(...acids) : null,
    basePka: bases.length ? Math.max(...bases) : null,
  };
}

export function operationOf(ctx: FlagContext, step: number): Operation | undefined {
  return ctx.input.operations[step - 1];
}

export function pct(x: number): string {
  const v = 100 * x;
  return v >= 10 ? `${v.toFixed(0)}%` : v >= 1 ? `${v.toFixed(1)}%` : `${v.toPrecision(2)}%`;
}

export function ph(x: number): string {
  return Number.isFinite(x) ? x.toFixed(1) : "?";
}

export function stepName(ctx: FlagContext, step: number): string {
  const op = operationOf(ctx, step);
  if (!op) return `step ${step}`;
  const what = "reagent" in op ? ` with ${ctx.library.reagents[op.reagent]?.name ?? op.reagent}`
    : "solvent" in op ? ` with ${ctx.library.solvents[op.solvent]?.name ?? op.solvent}` : "";
  return `step ${step} (${op.label ?? op.type.replace("_", " ")}${what})`;
}

export function flag(code: string, severity: Severity, title: string, cause: string, remedy: string,
  where: { step?: number; component?: string } = {}): Flag {
  return { code, severity, title, cause, remedy, ...where };
}

/** Measured pH of a step's aqueous output if the chemist recorded one, else the model's pH at that contact. */
export function effectivePh(ctx: FlagContext, t: ContactTrace): number {
  return operationOf(ctx, t.step)?.observed?.pH ?? t.pH;
}

/**
 * Where an ampholyte (an acidic and a basic site) is best extracted: the pH range at least two units from both sites
 * (the two-unit rule, common practice), around the isoelectric point pI = (pKa + pKaH)/2, the pH of the largest
 * uncharged share (Atkins & de Paula, Physical Chemistry, "isoelectric point"). Null unless the product has both.
 * `low > high` when the sites are closer than four units: then only the isoelectric point itself is worth naming.
 */
export interface IsoelectricWindow {
  pI: number;
  low: number;
  high: number;
  /** The acid's pKa lies below the base's pKaH: the neutral form is a zwitterion at every pH. */
  zwitterion: boolean;
}

export function isoelectricWindow(p: ProductInfo): IsoelectricWindow | null {
  if (p.acidPka === null || p.basePka === null) return null;
  return { pI: (p.acidPka + p.basePka) / 2, low: p.basePka + 2, high: p.acidPka - 2, zwitterion: p.acidPka < p.basePka };
}

/** "pH 6.0–7.5 (isoelectric point ≈ 6.8)", or "pH ≈ 6.8, its isoelectric point" when no range is two units clear. */
export function describeWindow(w: IsoelectricWindow): string {
  return w.low <= w.high ? `pH ${w.low.toFixed(1)}–${w.high.toFixed(1)} (isoelectric point ≈ ${w.pI.toFixed(1)})` : `pH ≈ ${w.pI.toFixed(1)}, its isoelectric point`;
}

/** True when `pH` is inside the ampholyte's best window (or within half a unit of pI when there is no range). */
export function insideWindow(w: IsoelectricWindow, pH: number): boolean {
  return w.low <= w.high ? pH >= w.low && pH <= w.high : Math.abs(pH - w.pI) <= 0.5;
}
