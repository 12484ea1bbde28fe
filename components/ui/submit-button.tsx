"use client";
import { type ReactNode } from "react";
import { useFormStatus } from "react-dom";
import { buttonClass, type ButtonVariant } from "@/components/ui/button";

/** A submit button that shows it is working and cannot be pressed twice. */
export function SubmitButton({ children, pendingLabel, variant = "primary", className = "" }: { children: ReactNode; pendingLabel?: string; variant?: ButtonVariant; className?: string }) {
  const { pending } = useFormStatus();
  return (
    <button type="submit" disabled={pending} aria-disabled={pending} className={buttonClass(variant, className)}>
      {pending ? (pendingLabel ?? "Working…") : children}
    </button>
  );
}
