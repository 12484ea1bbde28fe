/**
 * One line per step in the trade's words ("Wash: Brine (saturated NaCl), 2 × 20 mL, keep the organic layer"), read
 * from the spec as saved. Defensive: a stored spec that no longer fits the schema still reads sensibly.
 */
import { type Library } from "@/lib/chem/library";
import { type OperationType } from "@/lib/chem/schema";
import type { JsonObject, JsonValue } from "@/lib/workups/record";
import { OPERATION_TYPES } from "./operation-forms";
import { libraryName } from "./library-options";

const asRecord = (v: JsonValue | undefined): JsonObject => (v !== null && typeof v === "object" && !Array.isArray(v) ? v : {});
const text = (v: JsonValue | undefined) => (typeof v === "string" ? v : typeof v === "number" ? String(v) : "");

function qty(v: JsonValue | undefined): string {
  const q = asRecord(v);
  const value = text(q.value);
  return value ? `${value} ${text(q.unit)}`.trim() : "";
}

const METHOD: Record<string, string> = { rotavap: "rotary evaporator", high_vacuum: "high vacuum", n2_stream: "nitrogen stream", distillation: "distillation" };

export function typeLabel(type: string): string {
  return OPERATION_TYPES.find((t) => t.type === type)?.label ?? type.replace(/_/g, " ");
}

export interface StepWords {
  /** The step type in words ("Wash"). */
  title: string;
  /** Its parameters ("Brine (saturated NaCl), 2 × 20 mL, keep the organic layer"); "" when none. */
  details: string;
}

export function describeOperation(op: JsonValue, lib: Library): string {
  const w = stepWords(op, lib);
  return w.details ? `${w.title}: ${w.details}` : w.title;
}

export function stepWords(op: JsonValue, lib: Library): StepWords {
  const o = asRecord(op);
  const type = text(o.type) as OperationType;
  const name = (k: JsonValue | undefined) => libraryName(lib, text(k));
  const portions = typeof o.portions === "number" && o.portions > 1 ? `${o.portions} × ` : "";
  const keep = text(o.keep) ? `keep the ${text(o.keep)} ${o.keep === "filtrate" || o.keep === "solid" ? "" : "layer"}`.trim() : "";
  const saved = text(o.saveAs) ? `save the other layer as “${text(o.saveAs)}”` : "";
  const rinse = qty(asRecord(o.rinse).volume) ? `rinse ${qty(asRecord(o.rinse).volume)} ${name(asRecord(o.rinse).solvent)}` : "";
  const parts: string[] = (() => {
    switch (type) {
      case "charge": return [name(o.solvent), qty(o.volume)];
      case "quench": return [name(o.reagent), qty(o.volume) || qty(o.amount), o.mode === "inverse" ? "inverse addition" : ""];
      case "wash": case "back_extract": return [name(o.reagent), `${portions}${qty(o.volume)}`, keep, saved];
      case "extract": return [name(o.solvent), `${portions}${qty(o.volume)}`, keep, saved];
      case "separate": return [keep, saved];
      case "combine": return [`with ${(Array.isArray(o.streams) ? o.streams.map(text) : []).join(", ") || "—"}`];
      case "adjust_ph": return [name(o.reagent), typeof o.targetPh === "number" ? `to pH ${o.targetPh}` : qty(o.volume) || qty(o.amount)];
      case "add_salt": return [name(o.salt), o.saturate === true ? "to saturation" : qty(o.mass)];
      case "remove_cosolvent": return [name(o.solvent), typeof o.fractionRemoved === "number" ? `${Math.round(o.fractionRemoved * 100)} % removed` : ""];
      case "dry": return [name(o.agent), qty(o.mass), rinse];
      case "filter": return [keep, qty(o.cakeMass) ? `cake ${qty(o.cakeMass)}` : "", rinse, saved];
      case "concentrate": return [METHOD[text(o.method)] ?? text(o.method), qty(o.bath) ? `bath ${qty(o.bath)}` : "", qty(o.pressure), o.peroxideTested === true ? "tested for peroxides" : ""];
      default: return Object.entries(o).filter(([k]) => k !== "type").map(([k, v]) => `${k} ${text(v) || qty(v)}`);
    }
  })();
  return { title: typeLabel(type || "step"), details: parts.filter((p) => p.trim() !== "").join(", ") };
}
