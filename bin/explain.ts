/**
 * The readable per-step report of `layerwise predict --explain`: phases, volumes, pH, where each component
 * is after every step, the final recovery and purity, flags with cause and remedy, and safety cautions.
 */
import type { WorkupInput } from "../lib/chem/schema";
import type { ContactResult, PhaseState, StepResult, WorkupPrediction } from "../lib/chem/types";
import type { WorkupUncertainty } from "../lib/chem/uncertainty";

const fmt = (x: number, digits = 1): string => (Number.isFinite(x) ? x.toFixed(digits) : "–");
const pct = (x: number, digits = 1): string => `${fmt(100 * x, digits)} %`;
const mmol = (x: number): string => (Math.abs(x) < 0.0005 ? "0" : x < 0.1 ? x.toPrecision(2) : x.toFixed(2));

function table(rows: string[][], indent = "  "): string[] {
  const widths: number[] = [];
  for (const row of rows) row.forEach((cell, i) => { widths[i] = Math.max(widths[i] ?? 0, cell.length); });
  return rows.map((row) => indent + row.map((cell, i) => (i === row.length - 1 ? cell : cell.padEnd(widths[i] ?? 0))).join("  ").trimEnd());
}

function phaseLine(p: PhaseState): string {
  const where = p.position === "single" ? "single phase" : p.position;
  const ph = p.pH === null ? "" : `, pH ${fmt(p.pH, 1)}`;
  return `${p.kind} ${fmt(p.volumeMl)} mL, ρ ${fmt(p.densityGPerMl, 3)} g/mL, ${where}${ph}`;
}

function contactLines(c: ContactResult, count: number): string[] {
  const head = count > 1 ? `portion ${c.portion}: ` : "";
  const lines = [`    ${head}${c.phases.map(phaseLine).join(" | ")}`];
  const notes: string[] = [];
  if (c.densityDifference !== null && Math.abs(c.densityDifference) < 0.03) notes.push(`densities within ${fmt(Math.abs(c.densityDifference), 3)} g/mL`);
  if (c.co2Mmol > 0.005) notes.push(`CO₂ ${fmt(c.co2Mmol, 2)} mmol ≈ ${fmt(c.co2GasMl, 0)} mL gas`);
  if (c.temperatureRiseK >= 1) notes.push(`warms ≈ ${fmt(c.temperatureRiseK, 0)} K`);
  if (c.capacityExceeded) notes.push(`wash capacity used up (reagent pH ${c.reagentPh === null ? "–" : fmt(c.reagentPh, 1)})`);
  if (notes.length > 0) lines.push(`      ${notes.join("; ")}`);
  return lines;
}

function componentRows(step: StepResult, input: WorkupInput): string[][] {
  const rows = [["component", "kept mmol", "left in other streams", "D (first contact)", "form in aqueous"]];
  const first = step.contacts[0];
  for (const c of input.components) {
    const kept = step.kept.components[c.key] ?? 0;
    const elsewhere = step.sideStreams.reduce((s, side) => s + (side.components[c.key] ?? 0), 0);
    const d = first?.phases.find((p) => p.distributionRatio?.[c.key] !== undefined)?.distributionRatio?.[c.key];
    const aq = first?.phases.find((p) => p.kind === "aqueous")?.components[c.key];
    const form = aq && aq.neutral + aq.charged > 1e-12 ? `${pct(aq.charged / (aq.neutral + aq.charged), 0)} charged` : "";
    rows.push([c.key, mmol(kept), mmol(elsewhere), d === undefined ? "" : d.toPrecision(3), form]);
  }
  return rows;
}

function stepLines(step: StepResult, input: WorkupInput): string[] {
  const lines = [`Step ${step.index} · ${step.type.replace(/_/g, " ")}${step.label && step.label !== step.type ? ` · ${step.label}` : ""}`];
  for (const c of step.contacts) lines.push(...contactLines(c, step.contacts.length));
  lines.push(`    kept: ${step.kept.kind}, ${fmt(step.kept.volumeMl)} mL`);
  for (const s of step.sideStreams) {
    const fate = s.fate === "saved" ? `saved as '${s.name}'` : `${s.name} → ${s.fate.replace(/_/g, " ")}${s.wasteClass ? ` (${s.wasteClass.replace(/_/g, " ")} waste)` : ""}`;
    lines.push(`    ${fate}, ${fmt(s.volumeMl)} mL`);
  }
  const details = Object.entries(step.details);
  const detail = (v: number | string | boolean): string => (typeof v !== "number" ? String(v) : Number.isInteger(v) ? String(v) : fmt(v, 2));
  if (details.length > 0) lines.push(`    ${details.map(([k, v]) => `${k}: ${detail(v)}`).join("; ")}`);
  lines.push(...table(componentRows(step, input), "    "));
  return lines;
}

/** The whole report as text lines. */
export function explainPrediction(input: WorkupInput, prediction: WorkupPrediction, uncertainty?: WorkupUncertainty): string {
  const out: string[] = [];
  out.push(`Work-up${input.name ? `: ${input.name}` : ""} (engine ${prediction.engineVersion})`);
  out.push(...table([["component", "role", "start mmol"], ...input.components.map((c) => [`${c.key} (${c.name})`, c.role, mmol(c.amountMmol)])]));
  out.push("");
  for (const step of prediction.steps) out.push(...stepLines(step, input), "");

  out.push("Result (isolated fraction)");
  const head = ["component", "recovery", ...(uncertainty ? ["95 % interval"] : []), "mg", "purity (mass %)"];
  const rows = prediction.components.map((c) => {
    const u = uncertainty?.components[c.key]?.recovery;
    return [c.key, pct(c.recovery), ...(uncertainty ? [u ? `${pct(u.p025)} – ${pct(u.p975)}` : ""] : []), fmt(c.isolatedMg), fmt(c.purityPct)];
  });
  out.push(...table([head, ...rows]));
  out.push(`  predicted crude mass ${fmt(prediction.crudeMassMg)} mg${uncertainty ? ` (95 %: ${fmt(uncertainty.crudeMassMg.p025)}–${fmt(uncertainty.crudeMassMg.p975)} mg, ${uncertainty.draws} draws, seed ${uncertainty.seed})` : ""}`);
  const residual = Object.entries(prediction.residualSolventsMg).filter(([, mg]) => mg >= 0.5);
  if (residual.length > 0) out.push(`  residual solvent: ${residual.map(([s, mg]) => `${s} ${fmt(mg)} mg`).join(", ")}`);
  out.push("");

  out.push(prediction.flags.length === 0 ? "Flags: none" : "Flags");
  for (const f of prediction.flags) {
    const where = [f.step !== undefined ? `step ${f.step}` : "", f.component ?? ""].filter(Boolean).join(", ");
    out.push(`  [${f.severity}] ${f.code} ${f.title}${where ? ` (${where})` : ""}`, `    cause: ${f.cause}`, `    remedy: ${f.remedy}`);
  }
  if (prediction.cautions.length > 0) {
    out.push("", "Safety cautions (local rules and your institution's safety plan take precedence)");
    for (const c of prediction.cautions) out.push(`  step ${c.step}: ${c.text}`);
  }
  return out.join("\n");
}
