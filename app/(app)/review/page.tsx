import { requirePageMember } from "@/lib/authz/page";
import { ComingSoon } from "@/components/ui/coming-soon";

export const metadata = { title: "Review" };

export default async function ReviewPage() {
  await requirePageMember("data:read", { returnTo: "/review" });
  return <ComingSoon title="Review" description="Workups whose outcome departs from the prediction, with the likely causes." />;
}
