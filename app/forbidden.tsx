import Link from "next/link";
import { buttonClass } from "@/components/ui/button";

export default function Forbidden() {
  return (
    <main className="mx-auto max-w-lg px-4 py-24 text-center">
      <p className="text-sm font-semibold uppercase tracking-wide text-amber-700">403</p>
      <h1 className="mt-2 text-2xl font-semibold text-stone-900">Not allowed with your role</h1>
      <p className="mt-3 text-stone-600">Your role in this group does not allow this. A group lead can change roles on the Members page.</p>
      <Link href="/workups" className={buttonClass("secondary", "mt-6")}>
        Go to workups
      </Link>
    </main>
  );
}
