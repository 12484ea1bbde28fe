"use client";
import { ChartFrame } from "@/components/charts/chart-frame";
import { fileSlug } from "@/components/charts/csv";
import { PooledHistoryChart, pooledLegend } from "@/components/charts/pooled-history-chart";
import { pooledSummary } from "@/components/charts/summaries";
import type { SolventPartition } from "@/lib/partition/queries";

function summary(s: SolventPartition): string {
  const p = s.pooled;
  const parts: string[] = [];
  if (p.estimate !== null && p.se !== null && p.label) parts.push(`log K ${p.estimate.toFixed(2)} (${p.label})`);
  else if (p.label) parts.push(p.label);
  if (p.lowerBound !== null && p.estimate !== null) parts.push(`lower bound ${p.lowerBound.toFixed(2)}`);
  if (p.upperBound !== null && p.estimate !== null) parts.push(`upper bound ${p.upperBound.toFixed(2)}`);
  if (p.boundConflict) parts.push(p.boundConflict);
  if (s.structureEstimate) parts.push(`without group data: ${s.structureEstimate.value.toFixed(2)} (${s.structureEstimate.label})`);
  return parts.join("; ");
}

/** One solvent system: the pooled value, and how it moved as observations arrived. */
export function SolventHistory({ compoundName, solvent }: { compoundName: string; solvent: SolventPartition }) {
  const csv = [
    ["recorded", "observation_id", "pooled_log_k", "low_95", "high_95", "n"],
    ...solvent.history.map((h) => [new Date(h.at).toISOString(), h.observationId, h.estimate, h.low, h.high, h.n]),
  ];
  const points = solvent.history.map((h) => ({ at: new Date(h.at).getTime(), estimate: h.estimate, low: h.low, high: h.high, n: h.n }));
  const reference = solvent.structureEstimate ? { value: solvent.structureEstimate.value, label: solvent.structureEstimate.label } : undefined;
  return (
    <ChartFrame title={`${solvent.solventName} / water`} description={summary(solvent)} csv={csv} fileBase={`pooled-${fileSlug(compoundName)}-${solvent.solventKey}`}
      image={solvent.history.length > 0} summary={pooledSummary(points)} legend={pooledLegend(reference)}>
      {solvent.history.length > 0 ? (
        <PooledHistoryChart points={points} reference={reference} />
      ) : (
        <p className="text-sm text-stone-500">Only bounds so far: no value to plot.</p>
      )}
    </ChartFrame>
  );
}
