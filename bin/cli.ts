/**
 * `layerwise predict FILE.json [--explain] [--uncertainty N] [--seed S] [--ideal-phases] [--no-salting-out] [--no-ion-partition]`
 * `layerwise plan FILE.json [--json] [--product KEY] [--target-recovery F] [--max-impurity F]`
 * `layerwise fit FILE.json --component KEY --recovery F [--recovery-se F] [--solvent NAME]`
 * FILE may be "-" for standard input. Exit codes: 0 done, 2 bad usage or invalid input, 1 anything else.
 */
import { readFileSync } from "node:fs";
import { parseArgs } from "node:util";
import { type WorkupInput } from "../lib/chem/schema";
import { simulateWorkup, validateWorkup } from "../lib/chem/predict";
import { propagateUncertainty } from "../lib/chem/uncertainty";
import { fitLogK } from "../lib/chem/fit";
import { planWorkup, planOptionsSchema } from "../lib/chem/planner";
import { siteFlags } from "../lib/workups/site-flags";
import { explainPrediction } from "./explain";
import { explainPlan } from "./explain-plan";

export class InputError extends Error {}

const USAGE = `Usage:
  layerwise predict FILE.json [--explain] [--uncertainty N] [--seed S] [IDEALISATIONS]
  layerwise plan FILE.json [--json] [--product KEY] [--target-recovery F] [--max-impurity F]
  layerwise fit FILE.json --component KEY --recovery F [--recovery-se F] [--solvent NAME]
IDEALISATIONS (for comparisons with textbook arithmetic; the same as the input's "options"):
  --ideal-phases      solvent and water mutually insoluble
  --no-salting-out    salts do not change partition coefficients
  --no-ion-partition  charged forms stay in the water
FILE may be - to read standard input. The input format is described in README.md (section "Command line").`;

function readJson(file: string): unknown {
  let text: string;
  try {
    text = readFileSync(file === "-" ? 0 : file, "utf8");
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    throw new InputError(`cannot read ${file}: ${code === "ENOENT" ? "no such file" : (error as Error).message}`);
  }
  // A byte-order mark (some Windows editors write one) is not part of the JSON text (RFC 8259 §8.1 lets a parser ignore it).
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  try {
    return JSON.parse(text) as unknown;
  } catch (error) {
    throw new InputError(`${file} is not valid JSON: ${(error as Error).message}`);
  }
}

/** "components.0.molarMass" → "components[0].molarMass". */
function formatPath(path: string): string {
  return path.replace(/\.(\d+)(?=\.|$)/g, "[$1]") || "(top level)";
}

/** One line per issue; an unknown key, whose message starts with its name, is reported at the object holding it. */
function issueLine(path: string, message: string): string {
  const parts = path.split(".");
  const last = parts.at(-1) ?? "";
  if (last !== "" && message.startsWith(`\`${last}\`:`)) return `  ${formatPath(parts.slice(0, -1).join("."))}: ${message}`;
  return `  ${formatPath(path)}: ${message}`;
}

const IDEALISATION_FLAGS = {
  "ideal-phases": { type: "boolean" }, "no-salting-out": { type: "boolean" }, "no-ion-partition": { type: "boolean" },
} as const;

/** The input with the idealisations named on the command line switched on in its `options`. */
function withIdealisations(raw: unknown, values: Partial<Record<keyof typeof IDEALISATION_FLAGS, boolean | undefined>>): unknown {
  const on = {
    ...(values["ideal-phases"] ? { idealPhases: true } : {}),
    ...(values["no-salting-out"] ? { noSaltingOut: true } : {}),
    ...(values["no-ion-partition"] ? { noIonPartition: true } : {}),
  };
  if (Object.keys(on).length === 0 || typeof raw !== "object" || raw === null || Array.isArray(raw)) return raw;
  const given = (raw as { options?: unknown }).options;
  return { ...raw, options: { ...(typeof given === "object" && given !== null ? given : {}), ...on } };
}

function parseWorkup(file: string, raw: unknown): WorkupInput {
  const v = validateWorkup(raw);
  if (v.success) return v.data;
  const lines = v.issues.slice(0, 20).map((i) => issueLine(i.path, i.message));
  throw new InputError(`${file}: invalid work-up description\n${lines.join("\n")}`);
}

function numberOption(name: string, value: string | undefined, check: (x: number) => boolean, rule: string): number | undefined {
  if (value === undefined) return undefined;
  const x = Number(value);
  if (!Number.isFinite(x) || !check(x)) throw new InputError(`--${name} must be ${rule}, got '${value}'`);
  return x;
}

async function predict(args: string[]): Promise<string> {
  const { values, positionals } = parseArgs({
    args, allowPositionals: true, strict: true,
    options: { explain: { type: "boolean" }, uncertainty: { type: "string" }, seed: { type: "string" }, ...IDEALISATION_FLAGS },
  });
  const file = positionals[0];
  if (!file || positionals.length > 1) throw new InputError(`predict needs exactly one FILE\n${USAGE}`);
  const input = parseWorkup(file, withIdealisations(readJson(file), values));
  const draws = numberOption("uncertainty", values.uncertainty, (x) => Number.isInteger(x) && x >= 2 && x <= 100_000, "a whole number from 2 to 100000");
  const seed = numberOption("seed", values.seed, Number.isInteger, "a whole number");
  if (seed !== undefined && draws === undefined) throw new InputError("--seed only applies with --uncertainty N");
  // As the server does: a structure with an N–H/O–H group that no ionizable-site class covers is flagged
  // ("no ionizable site recognised: check") rather than treated as silently neutral.
  const computed = simulateWorkup(input);
  const noSite = await siteFlags(input);
  const prediction = noSite.length > 0 ? { ...computed, flags: [...computed.flags, ...noSite] } : computed;
  const uncertainty = draws === undefined ? undefined : propagateUncertainty(input, simulateWorkup, { draws, seed: seed ?? 1 });
  if (values.explain) return explainPrediction(input, prediction, uncertainty);
  return JSON.stringify(uncertainty ? { ...prediction, uncertainty } : prediction, null, 2);
}

function plan(args: string[]): string {
  const { values, positionals } = parseArgs({
    args, allowPositionals: true, strict: true,
    options: {
      json: { type: "boolean" }, product: { type: "string" },
      "target-recovery": { type: "string" }, "max-impurity": { type: "string" },
    },
  });
  const file = positionals[0];
  if (!file || positionals.length > 1) throw new InputError(`plan needs exactly one FILE\n${USAGE}`);
  const raw = readJson(file);
  const input = parseWorkup(file, raw);
  const fromFile = typeof raw === "object" && raw !== null && "plan" in raw ? raw.plan : {};
  const options = planOptionsSchema.safeParse({
    ...(typeof fromFile === "object" && fromFile !== null ? fromFile : {}),
    ...(values.product !== undefined ? { product: values.product } : {}),
    ...(values["target-recovery"] !== undefined ? { targetRecovery: Number(values["target-recovery"]) } : {}),
    ...(values["max-impurity"] !== undefined ? { maxImpurityLeft: Number(values["max-impurity"]) } : {}),
  });
  if (!options.success) {
    throw new InputError(`${file}: invalid plan options\n${options.error.issues.map((i) => issueLine(["plan", ...i.path.map(String)].join("."), i.message)).join("\n")}`);
  }
  const result = planWorkup(input, options.data, simulateWorkup);
  return values.json ? JSON.stringify(result, null, 2) : explainPlan(result);
}

function fit(args: string[]): string {
  const { values, positionals } = parseArgs({
    args, allowPositionals: true, strict: true,
    options: { component: { type: "string" }, recovery: { type: "string" }, "recovery-se": { type: "string" }, solvent: { type: "string" } },
  });
  const file = positionals[0];
  if (!file || positionals.length > 1) throw new InputError(`fit needs exactly one FILE\n${USAGE}`);
  if (!values.component) throw new InputError("fit needs --component KEY");
  const recovery = numberOption("recovery", values.recovery, (x) => x >= 0 && x <= 1.5, "a fraction from 0 to 1.5");
  if (recovery === undefined) throw new InputError("fit needs --recovery F (fraction, e.g. 0.82)");
  const recoverySe = numberOption("recovery-se", values["recovery-se"], (x) => x > 0 && x < 1, "a fraction between 0 and 1");
  const input = parseWorkup(file, readJson(file));
  const result = fitLogK(input, simulateWorkup, {
    component: values.component, observedRecovery: recovery,
    ...(recoverySe !== undefined ? { recoverySe } : {}), ...(values.solvent ? { solvent: values.solvent } : {}),
  });
  return JSON.stringify(result, null, 2);
}

/** Runs one command; returns the exit code. Output goes to stdout, errors to stderr. */
export async function main(argv: string[]): Promise<number> {
  const [command, ...rest] = argv;
  try {
    let text: string;
    if (command === "predict") text = await predict(rest);
    else if (command === "plan") text = plan(rest);
    else if (command === "fit") text = fit(rest);
    else if (command === undefined || command === "help" || command === "--help" || command === "-h") {
      process.stdout.write(`${USAGE}\n`);
      return command === undefined ? 2 : 0;
    } else throw new InputError(`unknown command '${command}'\n${USAGE}`);
    process.stdout.write(`${text}\n`);
    return 0;
  } catch (error) {
    const usage = error instanceof InputError || (error as { code?: string }).code?.startsWith("ERR_PARSE_ARGS");
    if (usage) {
      process.stderr.write(`layerwise: ${(error as Error).message}\n`);
      return 2;
    }
    if (error instanceof RangeError) {
      // The library's own refusals (unknown component, unknown solvent …) are input errors too.
      process.stderr.write(`layerwise: ${error.message}\n`);
      return 2;
    }
    process.stderr.write(`layerwise: internal error: ${(error as Error).stack ?? String(error)}\n`);
    return 1;
  }
}
