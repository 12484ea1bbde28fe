/**
 * `npm run bench:pka`: accuracy of the default pKa estimated from structure (lib/chem/structure/sites.ts) against
 * measured aqueous values at 25 °C in bench/data/pka-measured.csv (each row names its published source).
 * Not part of the test suite.
 *
 * Pairing: for each compound, the measured values of one kind (acid, or base = pKa of BH⁺) are matched in order of
 * value with the estimated sites of that kind (lowest with lowest). A measured value with no estimated site left
 * is a missed site. Reports MAE and RMSE per benchmark class and overall; `--rows` lists every pair, worst first.
 * Targets (issue 9): overall MAE ≤ 0.5, no class above 1.0, no missed site. Also prints the median time of site
 * detection per structure (5 runs). The last line is one JSON object.
 */
import { readFileSync } from "node:fs";
import { estimateIonizableSites, loadRDKit } from "../lib/chem/structure";

interface Row {
  cls: string;
  name: string;
  smiles: string;
  kind: "acid" | "base";
  pKa: number;
  /** "reference": the value (or its compound) was used to set a constant of the method; "check": it was not. */
  use: "reference" | "check";
  source: string;
}

/** RFC 4180 fields: quotes around fields with commas, doubled quotes inside. */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let field = "";
  let row: string[] = [];
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') {
        field += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else field += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === ",") {
      row.push(field);
      field = "";
    } else if (ch === "\n" || ch === "\r") {
      if (ch === "\r" && text[i + 1] === "\n") i++;
      row.push(field);
      if (row.some((f) => f !== "")) rows.push(row);
      row = [];
      field = "";
    } else field += ch;
  }
  if (field !== "" || row.length) rows.push([...row, field]);
  return rows;
}

export function readMeasured(path = new URL("./data/pka-measured.csv", import.meta.url)): Row[] {
  const [header, ...lines] = parseCsv(readFileSync(path, "utf8"));
  if (header?.join(",") !== "class,name,smiles,kind,pKa,use,source") throw new Error("unexpected header in pka-measured.csv");
  return lines.map((f, i) => {
    const [cls = "", name = "", smiles = "", kind = "", pKa = "", use = "", source = ""] = f;
    if ((kind !== "acid" && kind !== "base") || (use !== "reference" && use !== "check") || !Number.isFinite(Number(pKa)) || source.trim() === "") {
      throw new Error(`pka-measured.csv row ${i + 2} is incomplete`);
    }
    return { cls, name, smiles, kind, pKa: Number(pKa), use, source };
  });
}

interface Pair extends Row {
  estimate?: number;
  site?: string;
}

async function main() {
  const rdkit = await loadRDKit();
  const rows = readMeasured();
  const groups = new Map<string, Row[]>();
  for (const r of rows) {
    const key = `${r.smiles}|${r.kind}`;
    groups.set(key, [...(groups.get(key) ?? []), r]);
  }
  const pairs: Pair[] = [];
  for (const [, measured] of groups) {
    const first = measured[0];
    if (!first) continue;
    const sites = estimateIonizableSites(rdkit, first.smiles).filter((s) => s.kind === first.kind).sort((a, b) => a.value - b.value);
    const sorted = [...measured].sort((a, b) => a.pKa - b.pKa);
    // Bases: the first protonation is the highest value, so pair from the top.
    const ordered = first.kind === "base" ? { m: [...sorted].reverse(), s: [...sites].reverse() } : { m: sorted, s: sites };
    ordered.m.forEach((m, i) => {
      const s = ordered.s[i];
      pairs.push({ ...m, ...(s ? { estimate: s.value, site: s.site } : {}) });
    });
  }
  const stats = (list: Pair[]) => {
    const errors = list.filter((p) => p.estimate !== undefined).map((p) => (p.estimate ?? 0) - p.pKa);
    const n = errors.length;
    const mae = n ? errors.reduce((s, e) => s + Math.abs(e), 0) / n : NaN;
    const rmse = n ? Math.sqrt(errors.reduce((s, e) => s + e * e, 0) / n) : NaN;
    return { n, missed: list.length - n, mae: Number(mae.toFixed(3)), rmse: Number(rmse.toFixed(3)) };
  };
  const classes = [...new Set(pairs.map((p) => p.cls))];
  const table = (list: Pair[]) => Object.fromEntries(classes.map((c) => [c, stats(list.filter((p) => p.cls === c))]));
  const checks = pairs.filter((p) => p.use === "check");
  const perClass = table(pairs);
  const perClassCheck = table(checks);
  const overall = stats(pairs);
  const overallCheck = stats(checks);

  if (process.argv.includes("--rows")) {
    const worst = [...pairs].sort((a, b) => Math.abs((b.estimate ?? 99) - b.pKa) - Math.abs((a.estimate ?? 99) - a.pKa));
    for (const p of worst) console.log(`${(p.estimate === undefined ? "MISSED" : (p.estimate - p.pKa).toFixed(2)).padStart(7)}  ${p.name} (${p.kind} ${p.pKa}, ${p.use}; estimate ${p.estimate ?? "—"}, ${p.site ?? "no site"})`);
  }
  console.log(`pKa from structure against ${rows.length} measured aqueous values (25 °C) in ${new Set(rows.map((r) => r.smiles)).size} compounds;`);
  console.log(`${checks.length} of them ("check") were not used to set any constant of the method.`);
  const fmt = (s: ReturnType<typeof stats> | undefined) => (s && s.n ? `${String(s.n).padStart(4)} ${s.mae.toFixed(2).padStart(6)} ${s.rmse.toFixed(2).padStart(6)} ${String(s.missed).padStart(6)}` : "   0      —      —      0".padStart(25));
  console.log("".padEnd(30), "all rows".padEnd(27), "check rows only");
  console.log("class".padEnd(30), "   n    MAE   RMSE missed", "    n    MAE   RMSE missed");
  for (const c of classes) console.log(c.padEnd(30), fmt(perClass[c]), "", fmt(perClassCheck[c]));
  console.log("overall".padEnd(30), fmt(overall), "", fmt(overallCheck));
  const worstClass = Math.max(...Object.values(perClass).map((s) => s.mae));
  console.log(`targets (all rows): overall MAE ≤ 0.5 ${overall.mae <= 0.5 ? "met" : "NOT met"}; no class above 1.0 ${worstClass <= 1 ? "met" : "NOT met"}; no missed site ${overall.missed === 0 ? "met" : "NOT met"}`);
  const structures = [...new Set(rows.map((r) => r.smiles))];
  const perRun: number[] = [];
  for (let run = 0; run < 5; run++) {
    const t0 = performance.now();
    for (const smiles of structures) estimateIonizableSites(rdkit, smiles);
    perRun.push(((performance.now() - t0) * 1000) / structures.length);
  }
  const microsPerStructure = Number([...perRun].sort((a, b) => a - b)[2]?.toFixed(0));
  console.log(`site detection with estimates: median ${microsPerStructure} µs per structure (5 runs over ${structures.length} structures, parsing included)`);
  console.log(JSON.stringify({ overall, overallCheck, perClass, perClassCheck, microsPerStructure }));
}

if (import.meta.url === `file://${process.argv[1]}`) void main();
