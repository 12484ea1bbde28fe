import { requirePageMember } from "@/lib/authz/page";
import { ComingSoon } from "@/components/ui/coming-soon";

export const metadata = { title: "Partition data" };

export default async function PartitionPage() {
  await requirePageMember("data:read", { returnTo: "/partition" });
  return <ComingSoon title="Partition data" description="Partition coefficients measured or inferred from the group's own workups." />;
}
