#!/usr/bin/env node
// `npm test`: type check, lint, unit, integration (PGlite always; PostgreSQL too when TEST_DATABASE_URL or
// DATABASE_URL is set) and browser tests, in that order. Every stage runs even if an earlier one failed, so one
// run shows everything; the exit code is non-zero if any stage failed. The last line totals the test counts.
import { spawnSync } from "node:child_process";
import { existsSync, mkdirSync, readFileSync, rmSync } from "node:fs";

mkdirSync(".tmp", { recursive: true });
// Nothing may call out of the machine: Next.js would otherwise send anonymous usage telemetry.
process.env.NEXT_TELEMETRY_DISABLED ??= "1";
const only = process.argv.slice(2);
const stages = [
  { name: "typecheck", cmd: ["npx", "tsc", "--noEmit"] },
  { name: "lint", cmd: ["npx", "eslint", "--max-warnings=0", "."] },
  { name: "unit", cmd: ["npx", "vitest", "run", "--project", "unit", "--reporter=default", "--reporter=json", "--outputFile.json=.tmp/vitest-unit.json"], report: ".tmp/vitest-unit.json" },
  { name: "integration", cmd: ["npx", "vitest", "run", "--project", "integration", "--reporter=default", "--reporter=json", "--outputFile.json=.tmp/vitest-integration.json"], report: ".tmp/vitest-integration.json" },
  { name: "browser", cmd: ["npx", "playwright", "test", "--reporter=list,json"], report: ".tmp/playwright.json", env: { PLAYWRIGHT_JSON_OUTPUT_NAME: ".tmp/playwright.json" } },
].filter((s) => only.length === 0 || only.includes(s.name));

let passed = 0, failed = 0, skipped = 0;
const summary = [];
for (const stage of stages) {
  if (stage.report) rmSync(stage.report, { force: true });
  console.log(`\n=== ${stage.name}: ${stage.cmd.join(" ")}`);
  const t0 = Date.now();
  const r = spawnSync(stage.cmd[0], stage.cmd.slice(1), { stdio: "inherit", env: { ...process.env, ...stage.env } });
  const ok = r.status === 0;
  const counts = stage.report && existsSync(stage.report) ? countReport(JSON.parse(readFileSync(stage.report, "utf8"))) : null;
  if (counts) { passed += counts.passed; failed += counts.failed; skipped += counts.skipped; }
  if (!ok && (!counts || counts.failed === 0)) failed += 1; // a stage that failed without a test failure (type errors, lint, crash)
  summary.push(`${ok ? "ok  " : "FAIL"} ${stage.name} (${((Date.now() - t0) / 1000).toFixed(1)} s)${counts ? `: ${counts.passed} passed, ${counts.failed} failed` : ""}`);
}
console.log(`\n${summary.join("\n")}`);
console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ""}`);
process.exit(failed > 0 ? 1 : 0);

function countReport(report) {
  // Vitest's JSON reporter (Jest-compatible) and Playwright's JSON reporter have different shapes.
  if (typeof report.numPassedTests === "number") {
    return { passed: report.numPassedTests, failed: report.numFailedTests, skipped: report.numPendingTests + (report.numTodoTests ?? 0) };
  }
  const s = report.stats ?? {};
  return { passed: s.expected ?? 0, failed: (s.unexpected ?? 0) + (s.flaky ?? 0), skipped: s.skipped ?? 0 };
}
