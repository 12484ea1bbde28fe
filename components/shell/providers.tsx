"use client";
import { SessionProvider } from "next-auth/react";
import { type ReactNode } from "react";

/** next-auth's client context, needed by the group switcher (session update) and sign-out. */
export function Providers({ children }: { children: ReactNode }) {
  return (
    <SessionProvider refetchOnWindowFocus={false} refetchInterval={0}>
      {children}
    </SessionProvider>
  );
}
