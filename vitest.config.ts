/// <reference types="vitest/config" />
import { defineConfig } from "vitest/config";
import { aliases } from "./aliases.ts";

// Unit tests sit beside the code; API and browser tests live under tests/ and are run as their own projects
// by scripts/test.sh so that each gets the environment it needs.
export default defineConfig({
  test: {
    projects: [
      { resolve: { alias: aliases }, test: { name: "unit", include: ["shared/**/*.test.ts", "server/**/*.test.ts", "src/**/*.test.ts"], environment: "node", testTimeout: 60_000 } },
      { resolve: { alias: aliases }, test: { name: "api", include: ["tests/api/**/*.test.ts"], environment: "node", testTimeout: 60_000, hookTimeout: 120_000, fileParallelism: false } },
      { resolve: { alias: aliases }, test: { name: "e2e", include: ["tests/e2e/**/*.test.ts"], environment: "node", testTimeout: 120_000, hookTimeout: 180_000, fileParallelism: false } },
    ],
  },
});
