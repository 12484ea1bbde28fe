import Link from "next/link";
import type React from "react";
import { can } from "@/lib/authz";
import { requirePageMember } from "@/lib/authz/page";
import { Card, PageHeader } from "@/components/ui/page-header";
import { Badge } from "@/components/ui/badge";
import { buttonClass } from "@/components/ui/button";
import { formatNumber } from "@/components/ui/format";
import { getDb } from "@/lib/db/client";
import { libraryListing, type EntryOrigin } from "@/lib/library/service";
import { type Sourced } from "@/lib/chem/data/sources";

export const metadata = { title: "Solvent and wash library" };

function Origin({ origin }: { origin: EntryOrigin }) {
  return origin === "shipped" ? <Badge>shipped</Badge> : origin === "changed" ? <Badge tone="accent">changed by the group</Badge> : <Badge tone="high">added by the group</Badge>;
}

/** A value with a marker when it is recalled rather than checked in a source. */
function V({ v, digits = 2 }: { v: Sourced | null | undefined; digits?: number }) {
  if (!v) return <span className="text-stone-400">—</span>;
  const unsure = v.confidence === "memory" || v.confidence === "assumed";
  const shown = formatNumber(v.value, v.value !== 0 && Math.abs(v.value) < 0.1 ? 4 : digits);
  return <span title={`${v.source} (${v.confidence.replace(/_/g, " ")})`} className={unsure ? "text-amber-800" : undefined}>{shown}{unsure ? "*" : ""}</span>;
}

/** What the tables' marks, symbols and abbreviated headings mean. */
const KEY: [mark: React.ReactNode, label: string, meaning: string][] = [
  ["Key", "entry key", "The short name a workup description uses for the entry (in its JSON and the CSV's spec_json)."],
  [<abbr key="rho" title="density">ρ (g/mL)</abbr>, "density", "Density in grams per millilitre, at the temperature its source gives (hover a value for the source)."],
  [<abbr key="bp" title="boiling point">bp (°C)</abbr>, "boiling point", "Normal boiling point (at 1 atm) in degrees Celsius."],
  ["In water (wt %)", "solvent in water", "How much of the solvent dissolves in water, percent by weight; “miscible” when they mix in any ratio."],
  ["Water in it (wt %)", "water in the solvent", "How much water the wet solvent holds, percent by weight."],
  ["mol/L (solid: g/mol)", "strength", "A solution's concentration in moles per litre; for a solid added as such, its molar mass."],
  ["Capacity (g water/g)", "drying capacity", "Water a drying agent takes up per gram of agent."],
  ["Hold-up (mL/g)", "hold-up", "Solution left behind on the drying agent per gram, lost unless rinsed out."],
  [<span key="star" className="text-amber-800">0.87*</span>, "recalled value", "Amber with a star: recalled or assumed, not checked in a source; a measured value from the group should replace it."],
  [<span key="dash" className="text-stone-400">—</span>, "no value", "No value: not known, or it does not apply (a solid has no solution density)."],
  [<Badge key="shipped">shipped</Badge>, "shipped", "The value shipped with Layerwise, with its published source."],
  [<Badge key="changed" tone="accent">changed by the group</Badge>, "changed by the group", "A shipped entry whose values a group lead replaced with the group's own."],
  [<Badge key="added" tone="high">added by the group</Badge>, "added by the group", "An entry the group added."],
];

function LibraryKey() {
  return (
    <table className="min-w-full text-sm" data-testid="library-key">
      <caption className="mb-2 text-left text-xs text-stone-500">What the marks and abbreviated headings in the tables below mean.</caption>
      <thead className="text-left text-xs text-stone-500">
        <tr><th scope="col" className="py-1 pr-3 font-normal">Mark or heading</th><th scope="col" className="pr-3 font-normal">Reads as</th><th scope="col" className="font-normal">Meaning</th></tr>
      </thead>
      <tbody className="divide-y divide-stone-100">
        {KEY.map(([mark, label, meaning]) => (
          <tr key={label}>
            <td className="py-1.5 pr-3 whitespace-nowrap tabular-nums">{mark}</td>
            <th scope="row" className="pr-3 text-left font-normal text-stone-700">{label}</th>
            <td className="text-stone-600">{meaning}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

export default async function LibraryPage() {
  const member = await requirePageMember("data:read", { returnTo: "/library" });
  const lib = await libraryListing(await getDb(), member.group.id);
  const lead = can(member, "library:manage");
  const editLink = (table: string, key: string, name: string) =>
    <Link href={`/library/${table}/${encodeURIComponent(key)}`} className="font-medium text-teal-800 hover:underline" aria-label={`${lead ? "Edit" : "Details of"} ${name}`}>{name}</Link>;
  return (
    <>
      <PageHeader
        title="Solvent and wash library"
        description={`The solvents, aqueous reagents and drying agents ${member.group.name}'s predictions use. Values marked * are recalled rather than checked in a source: a measured value from the group should replace them. Hover a value for its source; the key below explains every mark and heading.`}
        actions={lead ? (
          <>
            <Link href="/library/solvents/new" className={buttonClass("secondary")}>Add a solvent</Link>
            <Link href="/library/reagents/new" className={buttonClass("secondary")}>Add a reagent</Link>
          </>
        ) : <span className="text-sm text-stone-500">Only a group lead can change the library.</span>}
      />
      <div className="space-y-6">
        <Card title="Key to the tables">
          <div className="overflow-x-auto"><LibraryKey /></div>
        </Card>
        <Card title="Solvents">
          <div className="overflow-x-auto">
            <table className="min-w-full text-sm">
              <caption className="sr-only">Solvents: density, boiling point, mutual solubility with water, notes and origin of each value (see the key)</caption>
              <thead className="text-left text-xs text-stone-500">
                <tr><th scope="col" className="py-1 pr-3 font-normal">Name</th><th scope="col" className="pr-3 font-normal">Key</th><th scope="col" className="pr-3 text-right font-normal"><abbr title="density">ρ</abbr> (g/mL)</th><th scope="col" className="pr-3 text-right font-normal"><abbr title="boiling point">bp</abbr> (°C)</th><th scope="col" className="pr-3 text-right font-normal">In water (wt %)</th><th scope="col" className="pr-3 text-right font-normal">Water in it (wt %)</th><th scope="col" className="pr-3 font-normal">Notes</th><th scope="col" className="font-normal">Origin</th></tr>
              </thead>
              <tbody className="divide-y divide-stone-100">
                {lib.solvents.map(({ props: s, origin }) => (
                  <tr key={s.key}>
                    <th scope="row" className="py-1.5 pr-3 text-left font-normal">{editLink("solvents", s.key, s.name)}</th>
                    <td className="pr-3 font-mono text-xs text-stone-600">{s.key}</td>
                    <td className="pr-3 text-right tabular-nums"><V v={s.density} digits={3} /></td>
                    <td className="pr-3 text-right tabular-nums"><V v={s.bpC} digits={1} /></td>
                    <td className="pr-3 text-right tabular-nums">{s.waterMiscible ? "miscible" : <V v={s.solventInWaterWtPct} />}</td>
                    <td className="pr-3 text-right tabular-nums">{s.waterMiscible ? "" : <V v={s.waterInSolventWtPct} />}</td>
                    <td className="pr-3 text-xs text-stone-600">{[s.chlorinated && "halogenated waste", s.peroxideFormer && "peroxide former", s.reproductiveToxicant && "reproductive toxicant"].filter(Boolean).join(", ")}</td>
                    <td><Origin origin={origin} /></td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </Card>
        <Card title="Aqueous reagents and salts">
          <div className="overflow-x-auto">
            <table className="min-w-full text-sm">
              <caption className="sr-only">Aqueous reagents and salts: use, strength, density and origin of each value (see the key)</caption>
              <thead className="text-left text-xs text-stone-500">
                <tr><th scope="col" className="py-1 pr-3 font-normal">Name</th><th scope="col" className="pr-3 font-normal">Key</th><th scope="col" className="pr-3 font-normal">Used as</th><th scope="col" className="pr-3 text-right font-normal">mol/L (solid: g/mol)</th><th scope="col" className="pr-3 text-right font-normal"><abbr title="density">ρ</abbr> (g/mL)</th><th scope="col" className="font-normal">Origin</th></tr>
              </thead>
              <tbody className="divide-y divide-stone-100">
                {lib.reagents.map(({ props: r, origin }) => (
                  <tr key={r.key}>
                    <th scope="row" className="py-1.5 pr-3 text-left font-normal">{editLink("reagents", r.key, r.name)}</th>
                    <td className="pr-3 font-mono text-xs text-stone-600">{r.key}</td>
                    <td className="pr-3 text-stone-600">{r.kind === "solid" ? `solid, ${r.purpose}` : r.purpose}</td>
                    <td className="pr-3 text-right tabular-nums"><V v={r.basis} /></td>
                    <td className="pr-3 text-right tabular-nums"><V v={r.density} digits={3} /></td>
                    <td><Origin origin={origin} /></td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </Card>
        <Card title="Drying agents">
          <p className="mb-2 text-xs text-stone-500">Shipped with the engine; not editable per group yet.</p>
          <table className="min-w-full text-sm">
            <caption className="sr-only">Drying agents: water capacity, hold-up and speed (see the key)</caption>
            <thead className="text-left text-xs text-stone-500"><tr><th scope="col" className="py-1 pr-3 font-normal">Name</th><th scope="col" className="pr-3 text-right font-normal">Capacity (g water/g)</th><th scope="col" className="pr-3 text-right font-normal">Hold-up (mL/g)</th><th scope="col" className="font-normal">Speed</th></tr></thead>
            <tbody className="divide-y divide-stone-100">
              {lib.dryingAgents.map((a) => (
                <tr key={a.key}><th scope="row" className="py-1.5 pr-3 text-left font-normal">{a.name}</th><td className="pr-3 text-right tabular-nums"><V v={a.capacityGPerG} /></td><td className="pr-3 text-right tabular-nums"><V v={a.holdUpMlPerG} /></td><td>{a.speed}</td></tr>
              ))}
            </tbody>
          </table>
        </Card>
      </div>
    </>
  );
}
