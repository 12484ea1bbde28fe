import Link from "next/link";
import { requirePageMember } from "@/lib/authz/page";
import { buttonClass } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";
import { RegisterForm } from "../_components/register-form";

export const metadata = { title: "Register compounds" };

export default async function RegisterCompoundsPage() {
  const member = await requirePageMember("data:write", { returnTo: "/compounds/new" });
  return (
    <>
      <PageHeader
        title="Register compounds"
        description={`Add structures to ${member.group.name}'s registry. Every record is checked first; if one needs attention, nothing is saved and each problem is listed with its line or record.`}
        actions={<Link href="/compounds" className={buttonClass("ghost")}>All compounds</Link>}
      />
      <RegisterForm />
    </>
  );
}
