"use client";
// Asks before leaving the editor with unsaved edits: closing or reloading the tab (the browser's own prompt) and
// following a link inside the app (checked before Next's router sees the click). The browser's Back button inside
// the app is not intercepted: the App Router offers no hook for it.
import { useEffect } from "react";

export const LEAVE_MESSAGE = "Leave this page? Your changes to this workup have not been saved.";

export function useLeaveGuard(active: boolean): void {
  useEffect(() => {
    if (!active) return;
    const beforeUnload = (e: BeforeUnloadEvent) => {
      e.preventDefault();
    };
    const click = (e: MouseEvent) => {
      if (e.defaultPrevented || e.button !== 0 || e.metaKey || e.ctrlKey || e.shiftKey || e.altKey) return;
      const link = e.target instanceof Element ? e.target.closest("a[href]") : null;
      if (!link || link.getAttribute("target") === "_blank" || link.hasAttribute("download")) return;
      // A link to a place on this page (the error summary's links to fields) does not leave it.
      if (link.getAttribute("href")?.startsWith("#")) return;
      if (!window.confirm(LEAVE_MESSAGE)) {
        e.preventDefault();
        e.stopPropagation();
      }
    };
    window.addEventListener("beforeunload", beforeUnload);
    document.addEventListener("click", click, true);
    return () => {
      window.removeEventListener("beforeunload", beforeUnload);
      document.removeEventListener("click", click, true);
    };
  }, [active]);
}
