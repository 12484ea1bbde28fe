// Where each component is at one contact: a bar split between the organic and the aqueous phase (by amount), the
// product first. The numbers are in the text; the bar is the picture of them.
import { type ContactResult } from "@/lib/chem/types";
import { phaseShares } from "@/lib/workups-client/funnel-geometry";
import { pct, PHASE_COLORS } from "./format";

export interface ComponentName {
  key: string;
  name: string;
  isProduct: boolean;
}

export function PhaseBars({ contact, components }: { contact: ContactResult; components: ComponentName[] }) {
  const ordered = [...components].sort((a, b) => Number(b.isProduct) - Number(a.isProduct));
  return (
    <table className="w-full text-xs">
      <caption className="sr-only">Share of each component in each layer</caption>
      <thead className="sr-only"><tr><th scope="col">Component</th><th scope="col">Split between the layers</th><th scope="col">In the organic layer</th></tr></thead>
      <tbody>
        {ordered.map((c) => {
          const shares = phaseShares(contact.phases, c.key);
          const org = shares.filter((s) => s.kind === "organic").reduce((a, s) => a + s.share, 0);
          const aq = shares.filter((s) => s.kind === "aqueous").reduce((a, s) => a + s.share, 0);
          const charged = shares.filter((s) => s.kind === "aqueous").reduce((a, s) => a + s.charged, 0);
          const total = shares.reduce((a, s) => a + s.mmol, 0);
          return (
            <tr key={c.key} className="align-middle">
              <th scope="row" className={`max-w-36 truncate py-0.5 pr-2 text-left font-normal ${c.isProduct ? "font-semibold text-stone-900" : "text-stone-700"}`} title={c.name}>{c.name}</th>
              <td className="w-full py-0.5">
                <div className="flex h-3 w-full overflow-hidden rounded-sm bg-stone-100" aria-hidden title={total > 0 && aq > 0 ? `${pct(charged / total)} of it as the charged form in water` : undefined}>
                  <div className={PHASE_COLORS.organic.swatch} style={{ width: `${org * 100}%` }} />
                  <div className={PHASE_COLORS.aqueous.swatch} style={{ width: `${aq * 100}%` }} />
                </div>
                <span className="sr-only">{pct(org)} organic, {pct(aq)} aqueous</span>
              </td>
              <td className="whitespace-nowrap py-0.5 pl-2 text-right tabular-nums text-stone-600" aria-hidden>{pct(org)} org</td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
