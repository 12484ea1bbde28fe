import { requirePageMember } from "@/lib/authz/page";
import { ComingSoon } from "@/components/ui/coming-soon";

export const metadata = { title: "Compounds" };

export default async function CompoundsPage() {
  await requirePageMember("data:read", { returnTo: "/compounds" });
  return <ComingSoon title="Compounds" description="The group's registry of structures with their partition and acid-base data." />;
}
