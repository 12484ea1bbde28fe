import { Badge } from "@/components/ui/badge";

type Status = "as_expected" | "below" | "above" | "inconclusive" | "unknown";

const LABELS: Record<Status, { label: string; tone: "good" | "low" | "high" | "neutral" }> = {
  as_expected: { label: "As predicted", tone: "good" },
  below: { label: "Below prediction", tone: "low" },
  above: { label: "Above prediction", tone: "high" },
  inconclusive: { label: "Low, not conclusive", tone: "neutral" },
  unknown: { label: "No outcome yet", tone: "neutral" },
};

/**
 * `intervalPending`: the version's interval is still being computed, so a reported outcome (stored "inconclusive")
 * has not been judged yet; the badge says so instead of calling it low.
 */
export function StatusBadge({ status, intervalPending = false }: { status: Status; intervalPending?: boolean }) {
  if (intervalPending && status === "inconclusive") return <Badge tone="neutral">Inconclusive — interval being computed</Badge>;
  const { label, tone } = LABELS[status];
  return <Badge tone={tone}>{label}</Badge>;
}
