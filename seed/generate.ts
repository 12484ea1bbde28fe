/**
 * Turns the workup families of the demo scenario into ~60 dated workups with specs the engine accepts. Pure and
 * deterministic (a fixed seed), so every fresh demo database holds the same records.
 */
import { createRng } from "@/lib/chem/random";
import type { WorkupInputRaw } from "@/lib/chem/schema";
import type { SeedCompound } from "./compounds";
import { demoGroup, emulsionMishap, families, HANDLING_LOSS, type WorkupFamily, type WrittenPoor } from "./scenario";

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
  /** Set when the scenario writes this workup as a poor one (its family's procedure, or a mishap at the bench). */
  poor: WrittenPoor | null;
  /**
   * What happened, by the story; null: no outcome reported yet. The isolated product is expected × reactionYield ×
   * the written procedure's recovery × (1 − handlingLoss) × (1 − mishapLoss); purity as reported; a weight alone
   * (weight_only) also weighs residual solvent, `weighedExcess` of the product's mass.
   */
  outcome: null | {
    reactionYield: number; handlingLoss: number; mishapLoss: number; purityPct: number; weighedExcess: number;
    method: "qnmr" | "hplc" | "weight_only"; note: string;
  };
}

const SEPARATIONS = new Set(["wash", "extract", "back_extract", "separate"]);

/** Notes an emulsion at the second separation (the first when there is only one); returns the step (1-based). */
function withEmulsion(operations: WorkupFamily["operations"]): { operations: WorkupFamily["operations"]; step: number } {
  const separations = operations.map((op, i) => ({ op, i })).filter(({ op }) => SEPARATIONS.has(op.type));
  const at = (separations[1] ?? separations[0])!.i;
  return {
    operations: operations.map((op, i) => (i === at ? { ...op, observed: { ...(op.observed ?? {}), interface: "emulsion" as const } } : op)),
    step: at + 1,
  };
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
  // About one workup in thirteen meets an emulsion; it falls on the next workup whose procedure is sound.
  let emulsionDue = false;
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
    const reported = i < WORKUP_COUNT - 5; // the last few are waiting for analysis
    if (i % 13 === 5) emulsionDue = true;
    const emulsion = emulsionDue && !family.poor && reported;
    if (emulsion) emulsionDue = false;
    const scaled = family.operations.map((op) => scaleOperation(op, volumeScale));
    const noted = emulsion ? withEmulsion(scaled) : { operations: scaled, step: 0 };
    const spec: WorkupInputRaw = {
      name: family.title,
      components,
      mixture: {
        solvents: family.solvents.map((s) => ({ solvent: s.solvent, volume: { value: Math.round(s.ml * volumeScale), unit: "mL" } })),
        reagents: (family.reagents ?? []).map((r) => ({ reagent: r.reagent, volume: { value: Math.round(r.ml * volumeScale), unit: "mL" } })),
      },
      operations: noted.operations,
      funnel: { value: volumeScale > 1.2 ? 500 : 250, unit: "mL" },
    };
    out.push({
      title: family.title,
      chemistEmail,
      performedOn,
      notebookRef: `HG-${(chemists.indexOf(chemistEmail) + 1).toString()}-${(112 + i).toString().padStart(4, "0")}`,
      scaleMmol: Number((product.mmol * scale).toFixed(2)),
      expectedProductMmol: Number((product.mmol * scale).toFixed(2)),
      spec,
      componentCompoundIds: Object.fromEntries(family.components.map((c) => [c.compound, compounds.get(c.compound)!.id])),
      // A mishap is written only where an outcome shows it; a poor procedure is poor before any outcome.
      poor: emulsion
        ? { kind: "mishap", cause: emulsionMishap.cause, loss: emulsionMishap.loss, words: emulsionMishap.note(noted.step) }
        : family.poor && (family.poor.kind === "procedure" || reported) ? family.poor : null,
      outcome: !reported ? null : {
        // Run-to-run scatter of the reaction (±2 %) and of the mishap's size (±5 % of the product).
        reactionYield: Math.min(1, family.reactionYield * (1 + 0.04 * (rng.uniform() - 0.5))),
        handlingLoss: HANDLING_LOSS.low + (HANDLING_LOSS.high - HANDLING_LOSS.low) * rng.uniform(),
        mishapLoss: (() => {
          const poor = emulsion ? emulsionMishap : family.poor?.kind === "mishap" ? family.poor : null;
          return poor ? Math.min(0.95, Math.max(0, poor.loss + 0.1 * (rng.uniform() - 0.5))) : 0;
        })(),
        purityPct: Math.min(99.5, family.purityPct + 3 * (rng.uniform() - 0.5)),
        weighedExcess: 0.04 * rng.uniform(),
        method: i % 3 === 0 ? "weight_only" : i % 3 === 1 ? "qnmr" : "hplc",
        note: emulsion ? emulsionMishap.note(noted.step) : family.note ?? "",
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
