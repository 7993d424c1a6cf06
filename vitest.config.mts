import path from "node:path";
import { defineConfig } from "vitest/config";

const alias = { "@": path.resolve(import.meta.dirname) };

export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        // Property tests over large grids take seconds on a busy 2-core machine.
        test: { name: "unit", include: ["tests/unit/**/*.test.{ts,tsx}"], environment: "node", testTimeout: 30_000 },
      },
      {
        resolve: { alias },
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.ts", "tests/security/**/*.test.ts"],
          environment: "node",
          // One database: files run one after another, tests inside a file in order.
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 30_000,
          setupFiles: ["tests/integration/setup.ts"],
        },
      },
    ],
  },
});
