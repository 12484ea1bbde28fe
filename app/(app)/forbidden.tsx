import Link from "next/link";
import { buttonClass } from "@/components/ui/button";

export default function ForbiddenInApp() {
  return (
    <div className="mx-auto max-w-lg py-16 text-center">
      <p className="text-sm font-semibold uppercase tracking-wide text-amber-700">403</p>
      <h1 className="mt-2 text-2xl font-semibold text-stone-900">Not allowed with your role</h1>
      <p className="mt-3 text-stone-600">
        Viewers can read the group&apos;s records but not change them, and only leads manage members. A group lead can change your role.
      </p>
      <Link href="/workups" className={buttonClass("secondary", "mt-6")}>
        Back to workups
      </Link>
    </div>
  );
}
