/**
 * A registered compound as a spec component: molar mass from the registry, log P and pKa values with where they came
 * from. A measured or literature value recorded on the compound wins over the structure estimate; a recorded value
 * without a stated provenance is shown as the group's.
 */
import { type ComponentRole } from "@/lib/chem/schema";
import { parseLogPSource } from "@/lib/compounds/provenance";
import { type StoredPKa } from "@/lib/compounds/schemas";
import { newClientId } from "./ids";
import { type ComponentState } from "./editor-types";

/** What the editor's compound picker receives for each registered compound. */
export interface PickerCompound {
  id: string;
  name: string;
  canonicalSmiles: string;
  formula: string;
  molarMass: number;
  crippenLogP: number | null;
  logP: number | null;
  logPSource: string | null;
  pKas: StoredPKa[];
}

export const ESTIMATED_LOGP_SOURCE = "Crippen log P estimated from the structure (RDKit)";

/** Molar masses are shown and sent to 0.01 g/mol, the precision of a formula weight on a label. */
const round2 = (x: number) => String(Math.round(x * 100) / 100);

export function componentFromCompound(compound: PickerCompound, role: ComponentRole): Omit<ComponentState, "id" | "key"> {
  const recorded = compound.logP !== null ? parseLogPSource(compound.logPSource) : null;
  const logP = compound.logP !== null
    ? { value: String(compound.logP), provenance: recorded?.provenance ?? ("group" as const), source: recorded?.source ?? "" }
    : compound.crippenLogP !== null
      ? { value: String(Math.round(compound.crippenLogP * 100) / 100), provenance: "estimated" as const, source: ESTIMATED_LOGP_SOURCE }
      : null;
  return {
    name: compound.name,
    role,
    molarMass: round2(compound.molarMass),
    amount: { value: "", unit: "mmol" },
    smiles: compound.canonicalSmiles,
    compoundId: compound.id,
    logP,
    pKas: compound.pKas.map((p) => ({
      id: newClientId("p"), value: String(p.value), kind: p.kind, provenance: p.provenance,
      source: p.source || (p.site ? `${p.site} site` : ""), ...(p.se !== undefined ? { se: p.se } : {}),
    })),
    extra: {},
    autoKey: true,
  };
}

/** A component typed in by hand (no registered structure). */
export function blankComponent(role: ComponentRole): Omit<ComponentState, "id" | "key"> {
  return {
    name: "", role, molarMass: "", amount: { value: "", unit: "mmol" }, smiles: "", compoundId: null,
    logP: { value: "", provenance: "literature", source: "" }, pKas: [], extra: {}, autoKey: true,
  };
}
