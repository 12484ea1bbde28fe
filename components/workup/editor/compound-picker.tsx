"use client";
// Adds a component: found in the group's registry by name (a combobox: type, ↓/↑ to choose, Enter to add), registered
// on the spot from a SMILES, or typed in by hand.
import { useEffect, useId, useRef, useState, useTransition, type KeyboardEvent } from "react";
import { ROLES, type ComponentRole } from "@/lib/chem/schema";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { formatNumber } from "@/components/ui/format";
import { blankComponent, componentFromCompound, type PickerCompound } from "@/lib/workups-client/compound-component";
import { addComponent } from "@/lib/workups-client/editor-actions";
import { registerForWorkupAction, searchCompoundsAction } from "@/app/(app)/workups/_lib/picker-actions";
import { useEditor } from "./editor-context";
import { roleLabel } from "./labels";

const SEARCH_DELAY_MS = 200;

export function CompoundPicker({ onAdded }: { onAdded: (componentIndex: number) => void }) {
  const { state, apply } = useEditor();
  const [role, setRole] = useState<ComponentRole>(state.components.some((c) => c.role === "product") ? "impurity" : "product");
  const [mode, setMode] = useState<"search" | "smiles">("search");
  const add = (c: Parameters<typeof addComponent>[1]) => {
    apply((s) => addComponent(s, c), null);
    onAdded(state.components.length);
  };
  return (
    <div className="rounded-md border border-dashed border-stone-300 bg-stone-50/60 p-3">
      <div className="flex flex-wrap items-end gap-3">
        <div>
          <label htmlFor="new-component-role" className="block text-xs font-medium text-stone-700">Role of the next component</label>
          <select id="new-component-role" value={role} onChange={(e) => setRole(e.target.value as ComponentRole)} className={`${inputClass} mt-0.5 py-1.5`}>
            {ROLES.map((r) => <option key={r} value={r}>{roleLabel(r)}</option>)}
          </select>
        </div>
        <fieldset className="flex gap-3 text-sm">
          <legend className="sr-only">Where the component comes from</legend>
          <label className="flex items-center gap-1.5"><input type="radio" name="component-source" checked={mode === "search"} onChange={() => setMode("search")} /> From the registry</label>
          <label className="flex items-center gap-1.5"><input type="radio" name="component-source" checked={mode === "smiles"} onChange={() => setMode("smiles")} /> New structure (SMILES)</label>
        </fieldset>
        <Button variant="ghost" className="ml-auto text-xs" onClick={() => add(blankComponent(role))}>Type one in by hand</Button>
      </div>
      <div className="mt-3">
        {mode === "search"
          ? <RegistrySearch onPick={(c) => add(componentFromCompound(c, role))} />
          : <InlineRegister onRegistered={(c) => add(componentFromCompound(c, role))} />}
      </div>
    </div>
  );
}

function RegistrySearch({ onPick }: { onPick: (c: PickerCompound) => void }) {
  const listId = useId();
  const [query, setQuery] = useState("");
  const [hits, setHits] = useState<PickerCompound[]>([]);
  const [active, setActive] = useState(0);
  const [open, setOpen] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const [pending, startTransition] = useTransition();
  const latest = useRef(0);

  useEffect(() => {
    if (!open) return;
    const ticket = ++latest.current;
    const timer = setTimeout(() => {
      startTransition(async () => {
        const result = await searchCompoundsAction(query);
        if (ticket !== latest.current) return;
        if (result.ok) {
          setHits(result.data);
          setActive(0);
          setProblem(null);
        } else setProblem(result.message);
      });
    }, SEARCH_DELAY_MS);
    return () => clearTimeout(timer);
  }, [query, open]);

  const pick = (c: PickerCompound | undefined) => {
    if (!c) return;
    onPick(c);
    setQuery("");
    setOpen(false);
  };
  return (
    <div className="relative">
      <label htmlFor={`${listId}-input`} className="block text-xs font-medium text-stone-700">Find a registered compound by name</label>
      <input
        id={`${listId}-input`} role="combobox" aria-expanded={open && hits.length > 0} aria-controls={listId} aria-autocomplete="list"
        aria-activedescendant={open && hits[active] ? `${listId}-${active}` : undefined}
        value={query} placeholder="e.g. benzoic acid" autoComplete="off" className={`${inputClass} mt-0.5 py-1.5`}
        onFocus={() => setOpen(true)} onBlur={() => setTimeout(() => setOpen(false), 150)}
        onChange={(e) => { setQuery(e.target.value); setOpen(true); }}
        onKeyDown={(e) => {
          if (e.key === "ArrowDown") { e.preventDefault(); setOpen(true); setActive((a) => Math.min(a + 1, hits.length - 1)); }
          else if (e.key === "ArrowUp") { e.preventDefault(); setActive((a) => Math.max(a - 1, 0)); }
          else if (e.key === "Enter") { e.preventDefault(); if (open) pick(hits[active]); }
          else if (e.key === "Escape") setOpen(false);
        }}
      />
      {problem ? <p className="mt-1 text-xs text-red-700">{problem}</p> : null}
      {open ? (
        <ul id={listId} role="listbox" aria-label="Registered compounds" className="absolute z-20 mt-1 max-h-72 w-full overflow-auto rounded-md border border-stone-200 bg-white py-1 text-sm shadow-lg">
          {hits.length === 0 ? <li role="option" aria-selected={false} aria-disabled className="px-3 py-2 text-stone-500">{pending ? "Searching…" : "No registered compound matches. Register it from a SMILES instead."}</li> : null}
          {hits.map((c, i) => (
            <li key={c.id} id={`${listId}-${i}`} role="option" aria-selected={i === active}
              onMouseDown={(e) => { e.preventDefault(); pick(c); }} onMouseEnter={() => setActive(i)}
              className={`cursor-pointer px-3 py-1.5 ${i === active ? "bg-teal-50" : ""}`}>
              <span className="font-medium text-stone-900">{c.name}</span>
              <span className="ml-2 text-xs text-stone-500">{c.formula} · {formatNumber(c.molarMass, 2)} g/mol · log P {c.logP ?? (c.crippenLogP !== null ? `${formatNumber(c.crippenLogP, 2)} (est.)` : "—")}</span>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

function InlineRegister({ onRegistered }: { onRegistered: (c: PickerCompound) => void }) {
  const [smiles, setSmiles] = useState("");
  const [name, setName] = useState("");
  const [note, setNote] = useState<{ tone: "error" | "info"; text: string } | null>(null);
  const [pending, startTransition] = useTransition();
  const submit = () => startTransition(async () => {
    setNote(null);
    const result = await registerForWorkupAction({ smiles, name });
    if (!result.ok) return setNote({ tone: "error", text: result.fieldErrors ? Object.values(result.fieldErrors).flat().join("; ") : result.message });
    const r = result.data;
    if (r.status === "rejected") return setNote({ tone: "error", text: r.message });
    onRegistered(r.compound);
    setSmiles("");
    setName("");
    setNote({ tone: "info", text: r.status === "existing" ? `Already registered as “${r.compound.name}”; that entry was added.` : `Registered “${r.compound.name}” and added it.` });
  });
  const enter = (e: KeyboardEvent) => { if (e.key === "Enter") { e.preventDefault(); submit(); } };
  return (
    <div className="flex flex-wrap items-end gap-3">
      <div className="min-w-64 flex-1">
        <label htmlFor="inline-smiles" className="block text-xs font-medium text-stone-700">SMILES</label>
        <input id="inline-smiles" value={smiles} onChange={(e) => setSmiles(e.target.value)} onKeyDown={enter} spellCheck={false} autoComplete="off"
          placeholder="OC(=O)c1ccccc1" className={`${inputClass} mt-0.5 py-1.5 font-mono`} />
      </div>
      <div className="min-w-48 flex-1">
        <label htmlFor="inline-name" className="block text-xs font-medium text-stone-700">Name</label>
        <input id="inline-name" value={name} onChange={(e) => setName(e.target.value)} onKeyDown={enter} autoComplete="off" placeholder="Benzoic acid" className={`${inputClass} mt-0.5 py-1.5`} />
      </div>
      <Button variant="secondary" onClick={submit} disabled={pending || smiles.trim() === ""}>{pending ? "Registering…" : "Register and add"}</Button>
      {note ? <p role={note.tone === "error" ? "alert" : "status"} className={`w-full text-xs ${note.tone === "error" ? "text-red-700" : "text-emerald-800"}`}>{note.text}</p> : null}
      <p className="w-full text-xs text-stone-500">Registering estimates log P and the ionizable sites from the structure; the estimates are marked as such until someone records a measured value.</p>
    </div>
  );
}
