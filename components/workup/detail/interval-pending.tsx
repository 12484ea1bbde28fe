"use client";
// While a saved version's Monte Carlo interval is computed in the background (a second or a few after a save), the
// page refreshes itself every few seconds until it no longer renders this (the interval is there).
import { useRouter } from "next/navigation";
import { useEffect, type ReactNode } from "react";

const REFRESH_MS = 3000;

/** Refreshes the page while mounted; render one per page. */
export function RefreshWhileIntervalPending({ children = null }: { children?: ReactNode }) {
  const router = useRouter();
  useEffect(() => {
    const timer = setInterval(() => router.refresh(), REFRESH_MS);
    return () => clearInterval(timer);
  }, [router]);
  return <>{children}</>;
}
