"use client";
// Procedure text out: the saved steps as a journal-style paragraph, copied as plain text or as rich text (HTML for
// word processors and electronic notebooks), with a link to the one-page printable procedure.
import Link from "next/link";
import { useState } from "react";
import { Button, buttonClass } from "@/components/ui/button";

function escapeHtml(s: string): string {
  return s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;");
}

export function ProcedureText({ paragraph, printHref }: { paragraph: string; printHref: string }) {
  const [copied, setCopied] = useState<"" | "plain" | "rich" | "failed">("");
  async function copy(kind: "plain" | "rich") {
    try {
      if (kind === "rich" && typeof ClipboardItem !== "undefined") {
        const html = `<p>${escapeHtml(paragraph)}</p>`;
        await navigator.clipboard.write([new ClipboardItem({
          "text/html": new Blob([html], { type: "text/html" }), "text/plain": new Blob([paragraph], { type: "text/plain" }),
        })]);
      } else await navigator.clipboard.writeText(paragraph);
      setCopied(kind);
    } catch {
      setCopied("failed");
    }
  }
  return (
    <div className="space-y-2">
      <p className="text-sm leading-6 text-stone-900" data-testid="procedure-paragraph">{paragraph || "No steps yet."}</p>
      <div className="flex flex-wrap items-center gap-2">
        <Button variant="secondary" onClick={() => void copy("plain")} disabled={!paragraph}>Copy text</Button>
        <Button variant="secondary" onClick={() => void copy("rich")} disabled={!paragraph}>Copy as rich text</Button>
        <Link href={printHref} className={buttonClass("ghost")}>Printable procedure</Link>
        <span role="status" className="text-xs text-stone-600">
          {copied === "plain" ? "Copied as plain text." : copied === "rich" ? "Copied as rich text." : copied === "failed" ? "The browser refused the clipboard; select the text and copy it." : ""}
        </span>
      </div>
    </div>
  );
}
