import path from "node:path";
import { defineConfig } from "vitest/config";

// Only the unit tests of the formula library and the rulebook: StrykerJS runs these against each
// mutant of lib/concrete and lib/checks (stryker.config.mjs). Kept apart from vitest.config.mts so
// the mutation run never picks up the database-backed integration project.
const alias = { "@": path.resolve(import.meta.dirname) };

export default defineConfig({
  resolve: { alias },
  test: {
    include: ["tests/unit/concrete/**/*.test.ts", "tests/unit/checks/**/*.test.ts"],
    environment: "node",
    // lib/checks may not exist yet on a branch: an empty tests/unit/checks is not an error.
    passWithNoTests: true,
    // Instrumented code on a shared 2-core machine: the property tests need more than the 5 s default.
    testTimeout: 60_000,
  },
});
