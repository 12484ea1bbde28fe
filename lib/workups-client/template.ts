/**
 * A saved workup used as a template: "copy as new" starts a new run (today, the person copying, no notebook entry or its address,
 * no assay of a crude that does not exist yet), and "scale to…" rescales every amount, mass and volume by the ratio of
 * the new reaction scale to the old one. Portions, pH targets, temperatures and pressures do not scale; a portion
 * that outgrows the separatory funnel is named so the chemist can choose a larger funnel or more portions.
 */
import { unitKey, type EditorState, type HeaderState, type Quantity } from "./editor-types";
import { parseNumber } from "./to-spec";

/** The header of a copy: the source's title and amounts, but a new date and chemist and none of its run's records. */
export function copiedHeader(source: HeaderState, today: string, chemistId: string): HeaderState {
  return { ...source, title: `${source.title} (copy)`, performedOn: today, chemistId, notebookRef: "", notebookUrl: "", assayedProductMmol: "" };
}

/** Scaled text of a typed number; blank or unreadable input is left as typed. Four significant figures. */
function scaled(value: string, factor: number): string {
  const n = parseNumber(value);
  if (n === undefined || !Number.isFinite(n)) return value;
  return String(Number((n * factor).toPrecision(4)));
}

const scaleQuantity = (q: Quantity, f: number): Quantity => ({ ...q, value: scaled(q.value, f) });

/** Operation fields that are amounts of material (they scale); everything else (portions, pH, °C, mbar) does not. */
const SCALING_FIELDS = ["volume", "amount", "mass", "cakeMass", "rinse.volume", "reactive.amount"];

export interface ScaleResult {
  state: EditorState;
  factor: number;
  /** Steps whose one portion no longer fits the funnel (1-based step numbers), with the portion in mL. */
  overFunnel: { step: number; portionMl: number }[];
}

/** Rescales a workup from its reaction scale to `newScaleMmol`; null when the old scale is not known. */
export function scaleWorkup(state: EditorState, newScaleMmol: number): ScaleResult | null {
  const old = parseNumber(state.header.scaleMmol) ?? Number.NaN;
  if (!Number.isFinite(old) || old <= 0 || !Number.isFinite(newScaleMmol) || newScaleMmol <= 0) return null;
  const f = newScaleMmol / old;
  const header = { ...state.header, scaleMmol: String(newScaleMmol), expectedProductMmol: scaled(state.header.expectedProductMmol, f), assayedProductMmol: "" };
  const components = state.components.map((c) => ({ ...c, amount: scaleQuantity(c.amount, f) }));
  const mixture = {
    solvents: state.mixture.solvents.map((s) => ({ ...s, volume: scaleQuantity(s.volume, f) })),
    reagents: state.mixture.reagents.map((r) => ({ ...r, volume: scaleQuantity(r.volume, f) })),
  };
  const operations = state.operations.map((op) => {
    const values = { ...op.values };
    for (const name of SCALING_FIELDS) if (values[name] !== undefined) values[name] = scaled(values[name], f);
    return { ...op, values };
  });
  const funnel = parseNumber(state.settings.funnel.value) ?? Number.NaN;
  const funnelMl = state.settings.funnel.unit === "L" ? funnel * 1000 : funnel;
  const overFunnel: ScaleResult["overFunnel"] = [];
  if (Number.isFinite(funnelMl) && funnelMl > 0) {
    operations.forEach((op, i) => {
      const v = parseNumber(op.values["volume"] ?? "") ?? Number.NaN;
      const unit = op.values[unitKey("volume")] ?? "mL";
      const ml = unit === "L" ? v * 1000 : unit === "uL" ? v / 1000 : v;
      if (Number.isFinite(ml) && ml > funnelMl) overFunnel.push({ step: i + 1, portionMl: ml });
    });
  }
  return { state: { ...state, header, components, mixture, operations }, factor: f, overFunnel };
}
