"use client";
import { useId, useRef, useState } from "react";
import { inputClass } from "@/components/ui/field";
import { buttonClass } from "@/components/ui/button";

/** A read-only value with a copy button; falls back to selecting the text where the clipboard API is unavailable. */
export function CopyField({ label, value }: { label: string; value: string }) {
  const id = useId();
  const input = useRef<HTMLInputElement>(null);
  const [copied, setCopied] = useState(false);
  async function copy() {
    input.current?.select();
    try {
      await navigator.clipboard.writeText(value);
      setCopied(true);
    } catch {
      setCopied(false);
    }
  }
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-medium text-stone-800">
        {label}
      </label>
      <div className="flex gap-2">
        <input id={id} ref={input} readOnly value={value} onFocus={(e) => e.currentTarget.select()} className={`${inputClass} font-mono`} />
        <button type="button" onClick={() => void copy()} className={buttonClass("secondary")}>
          {copied ? "Copied" : "Copy"}
        </button>
      </div>
    </div>
  );
}
