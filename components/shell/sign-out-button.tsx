"use client";
import { signOut } from "next-auth/react";
import { buttonClass } from "@/components/ui/button";

export function SignOutButton() {
  return (
    <button type="button" onClick={() => void signOut({ callbackUrl: "/sign-in" })} className={buttonClass("secondary")}>
      Sign out
    </button>
  );
}
