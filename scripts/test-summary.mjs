// Sums the results of every runner and prints the one closing line CI reads:
// "N passed, N failed". A failed check (typecheck, lint, build, ...) counts as one failure.
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";

const [runDir, ...failedChecks] = process.argv.slice(2);
let passed = 0;
let failed = failedChecks.length;
const lines = [];

const vitestFile = path.join(runDir, "vitest.json");
if (existsSync(vitestFile)) {
  const v = JSON.parse(readFileSync(vitestFile, "utf8"));
  // A file that failed to load has no tests but counts as a failure.
  const brokenFiles = (v.testResults ?? []).filter((f) => f.status === "failed" && f.assertionResults?.length === 0).length;
  passed += v.numPassedTests;
  failed += v.numFailedTests + brokenFiles;
  lines.push(`vitest: ${v.numPassedTests} passed, ${v.numFailedTests + brokenFiles} failed, ${v.numPendingTests} skipped`);
} else {
  failed += 1;
  lines.push("vitest: no result file (the runner did not finish)");
}

// The single-instance run, then the run against two instances behind the proxy (PLAYWRIGHT_PAIR=1).
for (const [name, file] of [["playwright", "playwright.json"], ["playwright (pair)", "playwright-pair.json"]]) {
  const pwFile = path.join(runDir, file);
  if (existsSync(pwFile)) {
    const s = JSON.parse(readFileSync(pwFile, "utf8")).stats ?? {};
    const ok = (s.expected ?? 0) + (s.flaky ?? 0);
    const bad = (s.unexpected ?? 0) + ((s.expected ?? 0) + (s.unexpected ?? 0) + (s.flaky ?? 0) === 0 ? 1 : 0);
    passed += ok;
    failed += bad;
    lines.push(`${name}: ${ok} passed (${s.flaky ?? 0} flaky), ${s.unexpected ?? 0} failed, ${s.skipped ?? 0} skipped`);
  } else {
    failed += 1;
    lines.push(`${name}: no result file (the runner did not run or crashed)`);
  }
}

if (failedChecks.length) lines.push(`failed checks: ${failedChecks.join(", ")}`);
for (const l of lines) console.log(l);
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed > 0 ? 1 : 0);
