import Link from "next/link";
import { buttonClass } from "@/components/ui/button";

export default function NotFoundInApp() {
  return (
    <div className="mx-auto max-w-lg py-16 text-center">
      <p className="text-sm font-semibold uppercase tracking-wide text-teal-700">404</p>
      <h1 className="mt-2 text-2xl font-semibold text-stone-900">Nothing here</h1>
      <p className="mt-3 text-stone-600">There is no such record in this group. It may have been deleted, or it may belong to another group.</p>
      <Link href="/workups" className={buttonClass("secondary", "mt-6")}>
        Back to workups
      </Link>
    </div>
  );
}
