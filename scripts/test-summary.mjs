// Adds up the test reports of one test-command run and prints the closing line "N passed, N failed".
// Usage: node scripts/test-summary.mjs REPORTS_DIR [failed step …]. Exit 1 when anything failed.
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";

const [reports, ...failedSteps] = process.argv.slice(2);
let passed = 0;
let failed = 0;
let skipped = 0;

const vitest = path.join(reports, "vitest.json");
if (existsSync(vitest)) {
  const r = JSON.parse(readFileSync(vitest, "utf8"));
  passed += r.numPassedTests;
  failed += r.numFailedTests;
  skipped += r.numPendingTests + r.numTodoTests;
}
const playwright = path.join(reports, "playwright.json");
if (existsSync(playwright)) {
  const s = JSON.parse(readFileSync(playwright, "utf8")).stats;
  passed += s.expected + s.flaky;
  failed += s.unexpected;
  skipped += s.skipped;
}
// A failed step that is not a test suite (lint, typecheck, build …) counts as one failure.
const suites = new Set(["vitest", "e2e"]);
const stepFailures = failedSteps.filter((s) => !suites.has(s));
failed += stepFailures.length;
if (failedSteps.some((s) => suites.has(s)) && failed === 0) failed = 1;

if (failedSteps.length) console.log(`failed steps: ${failedSteps.join(", ")}`);
console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ""}`);
process.exit(failed > 0 || passed === 0 ? 1 : 0);
