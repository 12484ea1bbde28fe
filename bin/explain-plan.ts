/** The readable report of `layerwise plan`: washes, extraction, changes to the procedure and the simulated check. */
import type { OperationRaw } from "../lib/chem/schema";
import type { PlanChange, WorkupPlan } from "../lib/chem/planner";

const pct = (x: number): string => `${(100 * x).toFixed(x < 0.001 ? 3 : 1)} %`;

function describeOperation(op: OperationRaw | undefined): string {
  if (!op) return "";
  const o = op as Record<string, unknown>;
  const volume = o.volume as { value: number; unit: string } | undefined;
  const amount = volume ? `${typeof o.portions === "number" ? `${o.portions} × ` : ""}${volume.value} ${volume.unit}` : "";
  const what = [o.reagent, o.solvent].filter((x) => typeof x === "string").join(" ");
  const target = typeof o.targetPh === "number" ? `to pH ${o.targetPh}` : "";
  return [String(o.type), what, amount, target].filter(Boolean).join(" ");
}

function describeChange(c: PlanChange): string {
  if (c.action === "remove") return `remove step ${c.step}`;
  if (c.action === "append") return `add at the end: ${describeOperation(c.operation)}`;
  if (c.action === "replace") return `replace step ${c.step} by: ${describeOperation(c.operation)}`;
  return `insert before step ${c.step}: ${describeOperation(c.operation)}`;
}

export function explainPlan(plan: WorkupPlan): string {
  const out: string[] = [
    `Plan for ${plan.product} in ${plan.solvent}: target ≥ ${pct(plan.targetRecovery)} recovery, ≤ ${pct(plan.maxImpurityLeft)} of each ionizable impurity left`,
    "",
  ];
  for (const w of plan.washes) {
    out.push(`${w.purpose === "remove_bases" ? "Acid wash" : "Basic wash"} to remove ${w.impurities.join(", ")}${w.reagent && w.portions > 0 ? `: ${w.portions} × ${w.volumeMl} mL ${w.reagent.name}` : ""}`);
    if (w.window) out.push(`  pH window ${w.window.low.toFixed(1)}–${w.window.high.toFixed(1)}`);
    if (w.reagent && w.portions > 0) {
      const left = Object.entries(w.impurityLeft).map(([k, v]) => `${k} ${pct(v)} left`).join(", ");
      out.push(`  closed-form estimate at the reagent's pH ${w.reagent.pH.toFixed(1)}: ${left}; product kept ${pct(w.productKept)}`);
    }
    for (const r of w.reasons) out.push(`  · ${r}`);
    out.push("");
  }
  const x = plan.extraction;
  if (x) {
    out.push(`Extraction of ${plan.product} into ${x.solvent} from ${x.aqueousMl.toFixed(0)} mL aqueous at pH ${x.pH.toFixed(1)} (D = ${x.distributionRatio.toPrecision(3)})`);
    if (x.adjust) out.push(`  first set pH ${x.adjust.targetPh.toFixed(1)} with ${x.adjust.name}`);
    out.push(`  ${x.portions} × ${x.volumeMl} mL: ${pct(x.recovery)} extracted (closed form)`);
    out.push(`  same total volume in n portions: ${x.alternatives.map((a) => `${a.portions} → ${pct(a.recovery)}`).join(", ")}`);
    for (const r of x.reasons) out.push(`  · ${r}`);
    out.push("");
  }
  for (const a of plan.aqueousWashes) {
    out.push(`Organic wash of the aqueous product solution (step ${a.step}): ${a.portions} × ${a.volumeMl} mL ${a.solvent}${a.portions !== a.procedurePortions ? ` (procedure: ${a.procedurePortions})` : ""}`);
    for (const r of a.reasons) out.push(`  · ${r}`);
    out.push("");
  }
  for (const n of plan.neutralImpurities) out.push(`${n.key}: ${n.reason}`);
  if (plan.neutralImpurities.length > 0) out.push("");
  if (plan.changes.length > 0) {
    out.push("Changes to the procedure");
    for (const c of plan.changes) out.push(`  ${describeChange(c)}`);
    out.push("");
  }
  if (plan.check) {
    out.push(`Simulated check of the revised procedure: ${plan.check.meetsTargets ? "meets the targets" : "misses a target"}`);
    for (const [k, r] of Object.entries(plan.check.recovery)) out.push(`  ${k}: ${pct(r)} in the isolated fraction`);
    if (plan.check.flags.length > 0) out.push(`  flags: ${plan.check.flags.map((f) => `${f.code} ${f.title}`).join("; ")}`);
  }
  for (const n of plan.notes) out.push(`Note: ${n}`);
  out.push("", "These are prompts, not instructions: your group's procedures, local rules and the institution's safety plan govern.");
  return out.join("\n");
}
