// Prints the mutation score of the last `npm run test:mutation`, overall and without text mutants
// (StringLiteral: message wording), per file, from StrykerJS's JSON report.
// Usage: node scripts/mutation-summary.mjs [reports/mutation/mutation.json] [--survivors]
import { readFileSync } from "node:fs";

const args = process.argv.slice(2);
const file = args.find((arg) => !arg.startsWith("--")) ?? "reports/mutation/mutation.json";
const listSurvivors = args.includes("--survivors");
const report = JSON.parse(readFileSync(file, "utf8"));

const DETECTED = new Set(["Killed", "Timeout"]);
const UNDETECTED = new Set(["Survived", "NoCoverage"]);
const empty = () => ({ detected: 0, undetected: 0, textDetected: 0, textUndetected: 0 });
const pct = (detected, undetected) =>
  detected + undetected === 0 ? "n/a" : `${((100 * detected) / (detected + undetected)).toFixed(1)} %`;

const total = empty();
const rows = [];
const survivors = [];
for (const [path, { mutants }] of Object.entries(report.files)) {
  const row = empty();
  for (const mutant of mutants) {
    const text = mutant.mutatorName === "StringLiteral";
    const key = DETECTED.has(mutant.status) ? "detected" : UNDETECTED.has(mutant.status) ? "undetected" : null;
    if (!key) continue; // Ignored, CompileError, RuntimeError: not part of the score
    for (const target of [row, total]) {
      target[key]++;
      if (text) target[key === "detected" ? "textDetected" : "textUndetected"]++;
    }
    if (key === "undetected") survivors.push({ path, mutant });
  }
  rows.push([path, row]);
}

const line = (name, r) =>
  `${name.padEnd(34)} ${pct(r.detected, r.undetected).padStart(8)} ` +
  `${pct(r.detected - r.textDetected, r.undetected - r.textUndetected).padStart(9)} ` +
  `${String(r.undetected).padStart(9)} ${String(r.undetected - r.textUndetected).padStart(9)}`;
console.log(`${"file".padEnd(34)} ${"overall".padStart(8)} ${"non-text".padStart(9)} ${"survivors".padStart(9)} ${"non-text".padStart(9)}`);
for (const [path, row] of rows.sort(([a], [b]) => a.localeCompare(b))) console.log(line(path, row));
console.log(line("all files", total));

if (listSurvivors) {
  for (const { path, mutant } of survivors) {
    const { line: at, column } = mutant.location.start;
    console.log(`${path}:${at}:${column} ${mutant.mutatorName} ${mutant.status}: ${JSON.stringify(mutant.replacement)}`);
  }
}
