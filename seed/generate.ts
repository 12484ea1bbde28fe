/**
 * Turns the workup families of the demo scenario into ~60 dated workups with specs the engine accepts. Pure and
 * deterministic (a fixed seed), so every fresh demo database holds the same records.
 */
import { createRng } from "@/lib/chem/random";
import type { WorkupInputRaw } from "@/lib/chem/schema";
import type { SeedCompound } from "./compounds";
import { demoGroup, emulsionLoss, families, type WorkupFamily } from "./scenario";

/** What the generator needs to know of a registered compound. */
export interface CompoundFacts {
  id: string;
  seed: SeedCompound;
  molarMass: number;
  crippenLogP: number;
}

export interface GeneratedWorkup {
  title: string;
  chemistEmail: string;
  performedOn: Date;
  notebookRef: string;
  scaleMmol: number;
  expectedProductMmol: number;
  spec: WorkupInputRaw;
  componentCompoundIds: Record<string, string>;
  /** Null: no outcome reported yet. */
  outcome: null | { factor: number; purityPct: number; method: "qnmr" | "hplc" | "weight_only"; note: string };
}

const WORKUP_COUNT = 60;
const FIRST_DAY = Date.UTC(2026, 5, 1);
const LAST_DAY = Date.UTC(2026, 10, 27);

function componentSpec(facts: CompoundFacts, role: WorkupFamily["components"][number]["role"], mmol: number) {
  const { seed } = facts;
  return {
    key: seed.key,
    name: seed.name,
    role,
    smiles: seed.smiles,
    molarMass: Number(facts.molarMass.toFixed(3)),
    amount: { value: Number(mmol.toFixed(3)), unit: "mmol" as const },
    logP: seed.logP
      ? { value: seed.logP.value, provenance: "literature" as const, source: seed.logP.source, ...(seed.logP.source === "from memory" ? { se: 0.4 } : {}) }
      : { value: Number(facts.crippenLogP.toFixed(2)), provenance: "estimated" as const, source: "Wildman–Crippen estimate from structure" },
    pKas: seed.pKas.map((p) => ({
      value: p.value, kind: p.kind, provenance: "literature" as const, source: p.source, ...(p.source === "from memory" ? { se: 0.4 } : {}),
    })),
    ...(seed.bpC !== undefined ? { bpC: seed.bpC } : {}),
  };
}

export function generateWorkups(compounds: ReadonlyMap<string, CompoundFacts>): GeneratedWorkup[] {
  const rng = createRng(20260601);
  const chemists = demoGroup.people.filter((p) => p.role !== "viewer").map((p) => p.email);
  const out: GeneratedWorkup[] = [];
  for (let i = 0; i < WORKUP_COUNT; i++) {
    // A stride coprime with the number of families, so every family recurs through the months.
    const family = families[(i * 5 + Math.floor(i / families.length)) % families.length]!;
    const scale = 0.5 + 1.5 * rng.uniform();
    const chemistEmail = chemists[(i * 3 + (i >> 2)) % chemists.length]!;
    const performedOn = new Date(FIRST_DAY + Math.round(((LAST_DAY - FIRST_DAY) * i) / (WORKUP_COUNT - 1) / 86_400_000) * 86_400_000);
    const product = family.components.find((c) => c.role === "product")!;
    const components = family.components.map((c) => {
      const facts = compounds.get(c.compound);
      if (!facts) throw new Error(`seed: compound ${c.compound} is not registered`);
      return componentSpec(facts, c.role, c.mmol * scale);
    });
    const volumeScale = Math.max(0.6, Math.min(1.8, scale));
    const spec: WorkupInputRaw = {
      name: family.title,
      components,
      mixture: {
        solvents: family.solvents.map((s) => ({ solvent: s.solvent, volume: { value: Math.round(s.ml * volumeScale), unit: "mL" } })),
        reagents: (family.reagents ?? []).map((r) => ({ reagent: r.reagent, volume: { value: Math.round(r.ml * volumeScale), unit: "mL" } })),
      },
      operations: family.operations.map((op) => scaleOperation(op, volumeScale)),
      funnel: { value: volumeScale > 1.2 ? 500 : 250, unit: "mL" },
    };
    const emulsion = i % 13 === 5;
    const reported = i < WORKUP_COUNT - 5; // the last few are waiting for analysis
    out.push({
      title: family.title,
      chemistEmail,
      performedOn,
      notebookRef: `HG-${(chemists.indexOf(chemistEmail) + 1).toString()}-${(112 + i).toString().padStart(4, "0")}`,
      scaleMmol: Number((product.mmol * scale).toFixed(2)),
      expectedProductMmol: Number((product.mmol * scale).toFixed(2)),
      spec,
      componentCompoundIds: Object.fromEntries(family.components.map((c) => [c.compound, compounds.get(c.compound)!.id])),
      outcome: !reported ? null : {
        factor: (emulsion ? emulsionLoss.factor : family.outcomeFactor) * (1 + 0.06 * (rng.uniform() - 0.5)),
        purityPct: Math.min(99.5, family.purityPct + 3 * (rng.uniform() - 0.5)),
        method: i % 3 === 0 ? "weight_only" : i % 3 === 1 ? "qnmr" : "hplc",
        note: emulsion ? emulsionLoss.note : family.note ?? "",
      },
    });
  }
  return out;
}

type Op = WorkupFamily["operations"][number];

/** Scales liquid volumes and solid masses with the batch size, rounded the way a chemist would measure them. */
function scaleOperation(op: Op, k: number): Op {
  const round = (v: number) => (v >= 20 ? Math.round(v / 5) * 5 : Math.max(1, Math.round(v)));
  const scaled: Record<string, unknown> = { ...op };
  for (const field of ["volume", "mass"] as const) {
    const q = (op as Record<string, unknown>)[field] as { value: number; unit: string } | undefined;
    if (q) scaled[field] = { ...q, value: round(q.value * k) };
  }
  return scaled as Op;
}
