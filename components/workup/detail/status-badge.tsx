import { Badge } from "@/components/ui/badge";

type Status = "as_expected" | "below" | "above" | "inconclusive" | "unknown";

const LABELS: Record<Status, { label: string; tone: "good" | "low" | "high" | "neutral" }> = {
  as_expected: { label: "As predicted", tone: "good" },
  below: { label: "Below prediction", tone: "low" },
  above: { label: "Above prediction", tone: "high" },
  inconclusive: { label: "Low, not conclusive", tone: "neutral" },
  unknown: { label: "No outcome yet", tone: "neutral" },
};

export function StatusBadge({ status }: { status: Status }) {
  const { label, tone } = LABELS[status];
  return <Badge tone={tone}>{label}</Badge>;
}
