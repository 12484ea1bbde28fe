import Link from "next/link";
import { buttonClass } from "@/components/ui/button";

export const metadata = { title: "Not found" };

export default function NotFound() {
  return (
    <main className="mx-auto max-w-lg px-4 py-24 text-center">
      <p className="text-sm font-semibold uppercase tracking-wide text-teal-700">404</p>
      <h1 className="mt-2 text-2xl font-semibold text-stone-900">Nothing here</h1>
      <p className="mt-3 text-stone-600">This page does not exist, or it belongs to a group you are not in.</p>
      <Link href="/workups" className={buttonClass("secondary", "mt-6")}>
        Go to workups
      </Link>
    </main>
  );
}
