// The editor's keyboard shortcuts, one click away.
const SHORTCUTS: [string, string][] = [
  ["Tab / Shift+Tab", "next / previous field"],
  ["Enter (in “Add a step”)", "add the chosen step"],
  ["Enter (in the compound search)", "add the highlighted compound"],
  ["Alt+↑ / Alt+↓", "move the step you are in"],
  ["Alt+Shift+D", "duplicate the step you are in"],
  ["Ctrl+Z", "undo the last edit"],
  ["Ctrl+Shift+Z or Ctrl+Y", "redo"],
  ["Ctrl+S or Ctrl+Enter", "save"],
];

export function ShortcutsHelp() {
  return (
    <details className="ml-auto text-sm text-stone-600">
      <summary className="cursor-pointer select-none rounded px-2 py-1 hover:bg-stone-100">Keyboard shortcuts</summary>
      <dl className="absolute bottom-14 right-4 z-20 grid w-80 grid-cols-[max-content_1fr] gap-x-3 gap-y-1 rounded-md border border-stone-200 bg-white p-3 text-xs shadow-lg">
        {SHORTCUTS.map(([keys, what]) => (
          <div key={keys} className="contents"><dt className="font-mono text-stone-800">{keys}</dt><dd>{what}</dd></div>
        ))}
        <p className="col-span-2 mt-1 text-stone-500">On a Mac, ⌘ works in place of Ctrl.</p>
      </dl>
    </details>
  );
}
