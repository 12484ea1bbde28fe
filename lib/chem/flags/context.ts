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
