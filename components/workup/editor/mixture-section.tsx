"use client";
// What is in the flask when the workup starts: reaction solvents (and water), aqueous reagents already added, and the
// settings the whole workup shares (temperature, funnel size for the gas head-space check).
import { unitsOf } from "@/lib/chem/units";
import { addMixtureReagent, addMixtureSolvent, removeMixtureRow, setSettings, updateMixtureRow } from "@/lib/workups-client/editor-actions";
import { reagentChoices, solventChoices, withCurrent } from "@/lib/workups-client/library-options";
import { QuantityControl, SelectControl, ToolButton, fieldId } from "./controls";
import { useEditor } from "./editor-context";

const VOLUME_UNITS = unitsOf("volume");

export function MixtureSection() {
  const { state, apply, messages, touch, library } = useEditor();
  const bind = (key: string) => ({ fieldKey: key, messages: messages(key), onBlur: () => touch(key) });
  const { solvents, reagents } = state.mixture;
  return (
    <div className="space-y-3">
      <div id={fieldId("mixture")} tabIndex={-1}>
        {messages("mixture").map((m) => <p key={m} className="text-xs text-red-700">{m}</p>)}
      </div>
      <ul className="space-y-2" aria-label="Solvents in the starting mixture">
        {solvents.map((row, i) => (
          <li key={row.id} className="flex flex-wrap items-start gap-2">
            <SelectControl {...bind(`mix:${row.id}.solvent`)} label={`Solvent ${i + 1}`} value={row.solvent} className="min-w-56"
              groups={withCurrent(solventChoices(library, "any"), row.solvent)} onChange={(v) => apply((s) => updateMixtureRow(s, row.id, { solvent: v }), `mix:${row.id}.solvent`)} />
            <QuantityControl {...bind(`mix:${row.id}.volume`)} label={`Volume of solvent ${i + 1}`} quantity={row.volume} units={VOLUME_UNITS} className="w-36"
              onChange={(q) => apply((s) => updateMixtureRow(s, row.id, { volume: q }), `mix:${row.id}.volume`)} />
            <div className="pt-4"><ToolButton label={`Remove solvent ${i + 1}`} tone="danger" onClick={() => apply((s) => removeMixtureRow(s, row.id), null)}>Remove</ToolButton></div>
          </li>
        ))}
        {reagents.map((row, i) => (
          <li key={row.id} className="flex flex-wrap items-start gap-2">
            <SelectControl {...bind(`mix:${row.id}.reagent`)} label={`Aqueous reagent ${i + 1} already present`} value={row.reagent} className="min-w-56"
              groups={withCurrent(reagentChoices(library, "solution"), row.reagent)} onChange={(v) => apply((s) => updateMixtureRow(s, row.id, { reagent: v }), `mix:${row.id}.reagent`)} />
            <QuantityControl {...bind(`mix:${row.id}.volume`)} label={`Volume of aqueous reagent ${i + 1}`} quantity={row.volume} units={VOLUME_UNITS} className="w-36"
              onChange={(q) => apply((s) => updateMixtureRow(s, row.id, { volume: q }), `mix:${row.id}.volume`)} />
            <div className="pt-4"><ToolButton label={`Remove aqueous reagent ${i + 1}`} tone="danger" onClick={() => apply((s) => removeMixtureRow(s, row.id), null)}>Remove</ToolButton></div>
          </li>
        ))}
      </ul>
      <div className="flex flex-wrap gap-3 text-xs font-medium">
        <button type="button" className="text-teal-800 hover:underline" onClick={() => apply((s) => addMixtureSolvent(s), null)}>Add a solvent</button>
        <button type="button" className="text-teal-800 hover:underline" onClick={() => apply((s) => addMixtureReagent(s), null)}>Add an aqueous reagent already in the flask</button>
      </div>
      <div className="flex flex-wrap gap-3 border-t border-stone-100 pt-3">
        <QuantityControl {...bind("settings.temperature")} label="Workup temperature" quantity={state.settings.temperature} units={unitsOf("temperature")} className="w-40"
          placeholder="20" hint="Blank: 20 °C." onChange={(q) => apply((s) => setSettings(s, { temperature: q }), "settings.temperature")} />
        <QuantityControl {...bind("settings.funnel")} label="Separatory funnel size" quantity={state.settings.funnel} units={VOLUME_UNITS} className="w-40"
          hint="For the gas head-space check." onChange={(q) => apply((s) => setSettings(s, { funnel: q }), "settings.funnel")} />
      </div>
    </div>
  );
}
