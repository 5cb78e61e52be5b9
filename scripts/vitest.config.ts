import path from "node:path";
import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");

export default defineConfig({
  root,
  resolve: {
    alias: {
      "@": path.join(root, "src"),
      // Modules marked server-only are imported by integration tests, which run on the server side anyway.
      "server-only": path.join(root, "src/test/empty.ts"),
    },
  },
  test: {
    include: ["src/**/*.test.ts", "scripts/**/*.test.ts"],
    environment: "node",
    testTimeout: 30_000,
    hookTimeout: 60_000,
    fileParallelism: false,
    setupFiles: ["src/test/setup.ts"],
    coverage: {
      provider: "v8",
      include: ["src/lib/soa/**/*.ts"],
      exclude: ["src/lib/soa/**/*.test.ts"],
      reporter: ["text-summary", "text"],
      reportsDirectory: ".data/coverage",
      // The engine carries every verdict: the test command fails if its line coverage drops below 95 %.
      thresholds: { "src/lib/soa/**": { lines: 95 } },
    },
  },
});
