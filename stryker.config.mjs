// Mutation testing of the formula library (lib/concrete) and the rulebook (lib/checks) against
// their unit tests: `npm run test:mutation`. Not part of scripts/test.sh (it takes minutes).
// Report: reports/mutation/index.html (and mutation.json for scripts).
/** @type {import('@stryker-mutator/api/core').PartialStrykerOptions} */
const config = {
  testRunner: "vitest",
  vitest: { configFile: "vitest.mutation.config.mts", related: true },
  // The vitest runner always measures coverage per test: each mutant runs only the tests that reach it.
  coverageAnalysis: "perTest",
  mutate: ["lib/concrete/**/*.ts", "lib/checks/**/*.ts", "!lib/**/*.d.ts", "!lib/**/index.ts"],
  // Two cores on the shared machine.
  concurrency: 2,
  timeoutMS: 10_000,
  reporters: ["clear-text", "progress", "html", "json"],
  htmlReporter: { fileName: "reports/mutation/index.html" },
  jsonReporter: { fileName: "reports/mutation/mutation.json" },
  clearTextReporter: { reportScoreTable: true, allowEmojis: false, logTests: false, maxTestsToLog: 0 },
  // The sandbox needs only the code under test, its tests and the build config.
  ignorePatterns: [".next", ".data", "public", "test-results", "playwright-report", "reports", "drizzle", "tests/e2e", "tests/integration"],
  tempDirName: ".stryker-tmp",
  cleanTempDir: true,
};

export default config;
