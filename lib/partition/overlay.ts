/**
 * What the group knows about a linked compound, laid over a workup's parsed spec before it is predicted:
 *  - the group's pooled log K for each organic solvent with group data (provenance "group", its n and se);
 *  - the registry's measured or literature log P, and its ionizable sites, where they differ from the copy the spec
 *    took when the workup was written (the registry is the record the group keeps up to date; an unchanged copy is
 *    left alone so that the spec's own standard errors survive).
 * And, after the overlay, where each component's partition coefficient in each solvent comes from, for display.
 * Pure: the database side is group-values.ts.
 */
import { LOGP_SE_BY_PROVENANCE, solventLogK, type SolventLogK } from "@/lib/chem/partition";
import { type Component, type LogValue, type PKa, type WorkupInput } from "@/lib/chem/schema";
import { type SolventProps } from "@/lib/chem/data/solvents";

export interface ComponentGroupValues {
  compoundId: string;
  /** Pooled group values by organic solvent key. */
  logK: Record<string, LogValue>;
  /** The registry's measured or literature log P. */
  logP?: LogValue;
  /** The registry's ionizable sites. */
  pKas?: PKa[];
}

/** By the spec's component key. */
export type GroupValues = Record<string, ComponentGroupValues>;

const sameSites = (a: readonly PKa[], b: readonly PKa[]): boolean =>
  a.length === b.length && a.every((s, i) => s.kind === b[i]?.kind && Math.abs(s.value - (b[i]?.value ?? NaN)) < 1e-9);

function overlayComponent(c: Component, v: ComponentGroupValues | undefined): Component {
  if (!v) return c;
  let next = c;
  if (Object.keys(v.logK).length > 0) next = { ...next, logK: { ...next.logK, ...v.logK } };
  if (v.logP && (!c.logP || Math.abs(c.logP.value - v.logP.value) > 1e-9 || c.logP.provenance !== v.logP.provenance)) next = { ...next, logP: v.logP };
  if (v.pKas && !sameSites(c.pKas, v.pKas)) next = { ...next, pKas: v.pKas };
  return next;
}

export function applyGroupValues(spec: WorkupInput, values: GroupValues | undefined): WorkupInput {
  if (!values || Object.keys(values).length === 0) return spec;
  return { ...spec, components: spec.components.map((c) => overlayComponent(c, values[c.key])) };
}

export interface PartitionSource {
  component: string;
  solvent: string;
  /** log K of the neutral form between the solvent and water as the prediction used it. */
  logK: number;
  se: number;
  /** "abraham": the solvation model from the compound's descriptors; "log_p": the Collander line from log P. */
  origin: "group" | "component" | "abraham" | "log_p";
  /** e.g. "group data, n = 4, ±0.12", "Abraham model (literature descriptors), ±0.19", "estimated from structure". */
  label: string;
}

/** The organic, water-immiscible solvents a spec names. */
export function organicSolventsOf(spec: WorkupInput, solvents: Readonly<Record<string, SolventProps>>): string[] {
  const keys = new Set<string>(spec.mixture.solvents.map((s) => s.solvent));
  for (const op of spec.operations) {
    if (op.type === "charge" || op.type === "extract") keys.add(op.solvent);
  }
  return [...keys].filter((k) => solvents[k] && !solvents[k].waterMiscible && solvents[k].partition);
}

function labelOfOwn(v: LogValue): string {
  if (v.provenance === "group") return v.source ?? "group data";
  if (v.provenance === "estimated") return "estimated from structure";
  return `${v.provenance}${v.source ? `: ${v.source}` : ""}`;
}

/** How an estimate without group data was made, with its standard error for the Abraham model. */
export function estimateLabel(k: SolventLogK): string {
  if (k.origin === "abraham") return `Abraham model (${k.provenance === "estimated" ? "estimated" : "literature"} descriptors), ±${k.se.toFixed(2)}`;
  return k.provenance === "estimated" ? "estimated from structure" : `from ${k.provenance} log P via the solvent's Collander line`;
}

/** Where each component's log K in each organic solvent of the spec comes from. */
export function partitionSources(spec: WorkupInput, solvents: Readonly<Record<string, SolventProps>>): PartitionSource[] {
  const out: PartitionSource[] = [];
  for (const solventKey of organicSolventsOf(spec, solvents)) {
    const solvent = solvents[solventKey] as SolventProps;
    for (const c of spec.components) {
      const own = c.logK[solventKey];
      if (own) {
        out.push({
          component: c.key, solvent: solventKey, logK: own.value, se: own.se ?? LOGP_SE_BY_PROVENANCE[own.provenance],
          origin: own.provenance === "group" ? "group" : "component", label: labelOfOwn(own),
        });
        continue;
      }
      // The engine's own estimate (Abraham model, else the Collander line), so the page shows what it predicted with.
      const k = solventLogK(c, solvent, solvents);
      if (!k) continue;
      out.push({ component: c.key, solvent: solventKey, logK: k.value, se: k.se, origin: k.origin === "abraham" ? "abraham" : "log_p", label: estimateLabel(k) });
    }
  }
  return out;
}
