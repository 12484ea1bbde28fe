"use client";
// At the hood (phone or tablet), the prediction panel would sit far below the form. Below the large breakpoint a
// one-line summary stays pinned at the top of the screen (recovery, interval, flag count) and opens the full panel
// as a sheet over the form; Escape or Close returns to the field that was being edited.
import { useEffect, useRef } from "react";
import { useEditor } from "./editor-context";

const pct = (x: number) => `${Math.round(x * 100)} %`;

export function PredictionSummaryBar({ open, onToggle }: { open: boolean; onToggle: () => void }) {
  const { live } = useEditor();
  const p = live.prediction;
  const product = p?.components.find((c) => c.key === p.productKey);
  const band = product ? live.interval?.components[product.key]?.recovery : undefined;
  const text = !p || !product
    ? live.status === "invalid" ? `Fix ${live.issues.length} field${live.issues.length === 1 ? "" : "s"} for a prediction` : "No prediction yet"
    : `${pct(product.recovery)}${band ? ` (${pct(band.p025)}–${pct(band.p975)})` : ""} · ${p.flags.length} flag${p.flags.length === 1 ? "" : "s"}`;
  return (
    <div className="sticky top-0 z-20 -mx-4 mb-3 border-b border-stone-200 bg-white/95 px-4 py-2 backdrop-blur lg:hidden" data-testid="prediction-summary">
      <button type="button" onClick={onToggle} aria-expanded={open} aria-controls="prediction-sheet"
        className="flex w-full items-center justify-between gap-3 text-left text-sm">
        <span><span className="text-stone-600">Predicted recovery </span><strong className="tabular-nums text-stone-900">{text}</strong></span>
        <span className="shrink-0 text-teal-800 underline">{open ? "Hide" : "Show"} prediction</span>
      </button>
    </div>
  );
}

/** The full panel: beside the form on large screens, a closable sheet over it on small ones. */
export function PredictionSheet({ open, onClose, children }: { open: boolean; onClose: () => void; children: React.ReactNode }) {
  const closeRef = useRef<HTMLButtonElement>(null);
  const returnTo = useRef<HTMLElement | null>(null);
  useEffect(() => {
    if (!open) return;
    returnTo.current = document.activeElement instanceof HTMLElement ? document.activeElement : null;
    closeRef.current?.focus();
    const onKey = (e: KeyboardEvent) => { if (e.key === "Escape") onClose(); };
    window.addEventListener("keydown", onKey);
    return () => { window.removeEventListener("keydown", onKey); returnTo.current?.focus(); };
  }, [open, onClose]);
  return (
    <aside id="prediction-sheet" aria-label="Prediction"
      className={`${open ? "fixed inset-x-0 bottom-0 top-12 z-30 overflow-y-auto bg-stone-50 p-3 shadow-lg" : "hidden"} min-w-0 lg:static lg:block lg:sticky lg:top-4 lg:z-auto lg:max-h-[calc(100vh-2rem)] lg:self-start lg:overflow-y-auto lg:bg-transparent lg:p-0 lg:shadow-none`}>
      {open ? (
        <div className="mb-2 flex justify-end lg:hidden">
          <button ref={closeRef} type="button" onClick={onClose} className="rounded border border-stone-300 bg-white px-3 py-1 text-sm">Close prediction</button>
        </div>
      ) : null}
      {children}
    </aside>
  );
}
