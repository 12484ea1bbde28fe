import { type ReactNode } from "react";
import { Badge } from "@/components/ui/badge";
import { formatNumber } from "@/components/ui/format";
import { Card } from "@/components/ui/page-header";
import { COUNTER_IONS } from "@/lib/chem/data/counter-ions";
import { saltFromSmiles } from "@/lib/chem/salt-smiles";
import { parseLogPSource } from "@/lib/compounds/provenance";
import type { CompoundDetail } from "@/lib/compounds/queries";
import { Formula } from "./formula";
import { LogPEditor } from "./log-p-editor";

/** Wildman & Crippen, J. Chem. Inf. Comput. Sci. 1999, 39, 868: σ = 0.677 log units on their training set. */
const CRIPPEN_NOTE = "Wildman–Crippen atom contributions (1999); typical error about ±0.7 log units";
const TPSA_NOTE = "Ertl, Rohde & Selzer (2000) fragment contributions";

export function Estimated() {
  return <Badge tone="neutral">estimated from structure</Badge>;
}

export function PropertiesCard({ compound, editable }: { compound: CompoundDetail; editable: boolean }) {
  const logPSource = parseLogPSource(compound.logPSource);
  const salt = saltFromSmiles(compound.canonicalSmiles);
  return (
    <Card title="Properties">
      <dl className="divide-y divide-stone-100 text-sm">
        <Row label="Formula"><Formula formula={compound.formula} /></Row>
        <Row label="Molar mass">{formatNumber(compound.molarMass, 2)} g/mol{salt ? " (the salt)" : ""}</Row>
        {salt ? (
          <Row label="Salt">
            <span data-testid="salt">
              parent <code className="text-xs">{salt.parentSmiles}</code> with {salt.perParent > 1 ? `${salt.perParent} × ` : ""}
              {COUNTER_IONS[salt.counterIon].formula} ({COUNTER_IONS[salt.counterIon].name}){salt.water > 0 ? `, ${salt.water} H₂O` : ""}
              <span className="block text-xs text-stone-500">Workups simulate the parent with its counter-ion in the aqueous charge balance.</span>
            </span>
          </Row>
        ) : null}
        <Row label="log P (octanol/water)">
          <div className="space-y-1.5" data-testid="logp">
            {compound.logP !== null ? (
              <p>
                <span className="font-medium tabular-nums">{formatNumber(compound.logP, 2)}</span>{" "}
                <Badge tone="good">{logPSource.provenance ?? "measured or literature"}</Badge>{" "}
                <span className="text-stone-600">{logPSource.source}</span>
              </p>
            ) : null}
            {compound.crippenLogP !== null ? (
              <p className={compound.logP !== null ? "text-stone-500" : ""}>
                <span className="tabular-nums">{formatNumber(compound.crippenLogP, 2)}</span> <Estimated />{" "}
                <span className="text-xs text-stone-500">{CRIPPEN_NOTE}{compound.logP !== null ? "; the value above is used instead" : ""}</span>
              </p>
            ) : null}
            {editable ? <LogPEditor compoundId={compound.id} logP={compound.logP} sourceText={compound.logPSource} /> : null}
          </div>
        </Row>
        <Row label="Topological polar surface area">
          {compound.tpsa !== null ? <>{formatNumber(compound.tpsa, 1)} Å² <Estimated /> <span className="text-xs text-stone-500">{TPSA_NOTE}</span></> : "—"}
        </Row>
        {compound.notes ? <Row label="Notes">{compound.notes}</Row> : null}
      </dl>
    </Card>
  );
}

function Row({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="grid gap-1 py-2 sm:grid-cols-3">
      <dt className="text-stone-500">{label}</dt>
      <dd className="text-stone-900 sm:col-span-2">{children}</dd>
    </div>
  );
}
