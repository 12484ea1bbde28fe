/**
 * The engine's work for one prediction, estimated before it runs, so that a request can be refused (422, the limit
 * stated) instead of holding a CPU for minutes. Pure: reads only the counts of a spec that already passed its schema.
 *
 *   work units = portion-steps × (components + 4) × (draws + 1)
 *
 * A portion-step is one portion of a wash or extraction (other operations count once). The "+ 4" is the fixed cost
 * of a step (phase volumes, the aqueous pH solve) that does not grow with the component count, and "+ 1" is the point
 * prediction beside the Monte Carlo draws. Calibrated on this repository's engine (lib/chem): one unit costs between
 * about 2 µs (50 components) and 17 µs (the 4-component example workups) of one core, so the limit below keeps the
 * largest request accepted to a few seconds of a worker thread.
 */

/** Largest engine work accepted from one request, in work units (see above). */
export const MAX_ENGINE_UNITS = 600_000;

/**
 * Largest table of results (portion-steps × components) one prediction may produce: the stored result holds every
 * component's amounts in every stream after every portion, about 40 bytes a cell as JSON, so 20,000 cells is under
 * 1 MB to store, send and copy between threads. Real workups have a few hundred to a few thousand.
 */
export const MAX_RESULT_CELLS = 20_000;

/** Operations whose `portions` repeats the separation. */
const PORTIONED = new Set(["wash", "extract", "back_extract"]);

export interface EngineCost {
  components: number;
  portionSteps: number;
  draws: number;
  units: number;
  /** portion-steps × components. */
  cells: number;
}

/** Counts of a spec that passed workupInputSchema (unknown shapes count as nothing, never throw). */
export function engineCost(spec: unknown, draws: number): EngineCost {
  const s = (spec ?? {}) as { components?: unknown; operations?: unknown };
  const components = Array.isArray(s.components) ? s.components.length : 0;
  let portionSteps = 0;
  for (const op of Array.isArray(s.operations) ? s.operations : []) {
    const o = (op ?? {}) as { type?: unknown; portions?: unknown };
    const portions = typeof o.portions === "number" && Number.isFinite(o.portions) && o.portions >= 1 ? Math.floor(o.portions) : 1;
    portionSteps += typeof o.type === "string" && PORTIONED.has(o.type) ? portions : 1;
  }
  const runs = Math.max(0, Math.floor(draws)) + 1;
  return { components, portionSteps, draws: runs - 1, units: portionSteps * (components + 4) * runs, cells: portionSteps * components };
}

const grouped = (n: number) => n.toLocaleString("en-US");

/** The words of a refusal: the counts, the product, the limit and what to change; null when the cost is within both limits. */
export function overBudgetMessage(cost: EngineCost, limit = MAX_ENGINE_UNITS): string | null {
  if (cost.cells > MAX_RESULT_CELLS) {
    return `This workup is too large to predict on the server: ${grouped(cost.portionSteps)} steps (counting each portion) × ` +
      `${grouped(cost.components)} components = ${grouped(cost.cells)} results; the limit is ${grouped(MAX_RESULT_CELLS)}. ` +
      "Use fewer portions, steps or components.";
  }
  if (cost.units <= limit) return null;
  return `This prediction is too large to run on the server: ${grouped(cost.portionSteps)} steps (counting each portion) × ` +
    `(${grouped(cost.components)} components + 4) × (${grouped(cost.draws)} draws + 1) = ${grouped(cost.units)} work units; ` +
    `the limit is ${grouped(limit)}. Use fewer draws, portions, steps or components.`;
}

/**
 * The field a refusal is reported under: `draws` when the point prediction alone would fit (fewer draws is the fix),
 * else the spec itself.
 */
export function overBudgetField(spec: unknown, draws: number, specField: string, drawsField: string | null, limit = MAX_ENGINE_UNITS): string {
  return drawsField !== null && draws > 0 && overBudgetMessage(engineCost(spec, 0), limit) === null ? drawsField : specField;
}
